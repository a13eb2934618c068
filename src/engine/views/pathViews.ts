import { locationBusOf, pathTo, upstreamDeviceOf, type Network } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import { addToList } from '../addToList.ts';

/** A view as it is written in a study file: plain volts, ids only. */
export interface PathView {
  id: string;
  title: string;
  /** Volts: the voltage of the load-side devices, so their curves read at their own amps. */
  referenceVoltage: number;
  devices: string[];
  withstand: string[];
  motors: string[];
}

/**
 * One view per protective path, so a study author need not build every sheet by hand: each load-side
 * device (one with no device below it) with every device above it up to the source, paths that share
 * all devices but the last merged onto one sheet, and on each sheet the withstand curves of the
 * transformers and cables the path runs through (with their inrush) and the starting curves of the
 * motors its load-side devices feed. A path the study already shows with the same devices is skipped,
 * and new ids never clash with the study's. Iterative:
 * linear in the devices times the depth of the tree.
 * @example pathViewsOf(networkOf(study)).map((view) => view.title) // ['MCC feeder 600 A and above', …]
 */
export function pathViewsOf(network: Network): PathView[] {
  const { study } = network;
  const hasBelow = new Set<string>();
  const above = new Map<string, Device | undefined>();
  for (const device of study.devices) {
    const up = upstreamDeviceOf(network, device);
    above.set(device.id, up);
    if (up) hasBelow.add(up.id);
  }
  // Load-side devices grouped by the device above them (all of a path but the last).
  const groups = new Map<string, Device[]>();
  for (const device of study.devices) {
    if (hasBelow.has(device.id)) continue;
    const key = above.get(device.id)?.id ?? `alone:${device.id}`;
    addToList(groups, key, device);
  }
  const taken = new Set(study.views.map((view) => view.id));
  const shown = new Set(study.views.map((view) => view.devices.join('\u0000')));
  const views: PathView[] = [];
  for (const [key, leaves] of groups) {
    const chain: Device[] = [];
    for (let up = above.get(leaves[0].id); up; up = above.get(up.id)) chain.unshift(up);
    const devices = [...chain, ...leaves];
    if (shown.has(devices.map((device) => device.id).join('\u0000'))) continue;
    const elementIds = new Set(leaves.flatMap((leaf) => pathTo(network, leaf.feeds)));
    const withstand = [...elementIds].filter((id) => {
      const type = network.elements.get(id)?.type;
      return type === 'transformer' || type === 'cable';
    });
    const motors = leaves.flatMap((leaf) => (network.elements.get(leaf.feeds)?.type === 'motor' ? [leaf.feeds] : []));
    const last = chain.at(-1);
    const id = uniqueId(`path-${last?.id ?? key.slice('alone:'.length)}`, taken);
    taken.add(id);
    const name = (device: Device) => device.name ?? device.id;
    views.push({
      id,
      title: last ? `${name(last)} and the devices below it` : `${name(leaves[0])}`,
      referenceVoltage: locationBusOf(network, leaves[0]).voltage,
      devices: devices.map((device) => device.id),
      withstand,
      motors,
    });
  }
  return views;
}

// Accepts a wanted id and those in use; the id, or it with the first free "-2", "-3", … suffix.
function uniqueId(wanted: string, taken: Set<string>): string {
  if (!taken.has(wanted)) return wanted;
  let n = 2;
  while (taken.has(`${wanted}-${n}`)) n++;
  return `${wanted}-${n}`;
}
