import { cachedBandOf } from '../bandCache.ts';
import { protectingDevice, type CheckContext } from '../checks/context.ts';
import { faultLevelsOf } from '../fault/index.ts';
import { networkOf, seriesPairs } from '../network/index.ts';
import type { CoordinationSettings, Device, Study } from '../study/index.ts';

/**
 * A check context the setting window may try settings in: its own copy of the tree's device maps and
 * of the bands, so that `place` can put a candidate device in and every check (pairs, withstand,
 * inrush, NEC 450.3) sees it, while the study itself is never touched. Fault levels do not depend on
 * settings and are computed once.
 */
export interface Trial extends CheckContext {
  study: Study;
  settings: CoordinationSettings;
  /** The nearest device above each device (by id), from the tree. */
  aboveOf: Map<string, string>;
  /** The devices whose nearest device above is this one (by id), in study order. */
  belowOf: Map<string, string[]>;
  /** The transformers, cables and motors each device is the nearest protection of (by device id). */
  protects: Map<string, ProtectedElements>;
  /** Puts a device (with trial settings) in place of the one with its id, band and all. */
  place(device: Device): void;
  /** The device as it stands in the trial (its latest placed settings). */
  deviceOf(id: string): Device;
}

/** What one device is the nearest protection of. */
export interface ProtectedElements {
  transformers: Study['transformers'];
  cables: Study['cables'];
  motors: Study['motors'];
}

/**
 * Builds a trial context for a study: tree, fault levels, every band, and the series-pair index.
 *
 * @example const trial = trialOf(study); trial.place(deviceWith(main, { 'shortTime.delay': 0.3 }))
 */
export function trialOf(study: Study): Trial {
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const bands = new Map(study.devices.map((device) => [device.id, cachedBandOf(device.characteristic)]));
  const aboveOf = new Map<string, string>();
  const belowOf = new Map<string, string[]>();
  for (const { upstream, downstream } of seriesPairs(network)) {
    aboveOf.set(downstream.id, upstream.id);
    const list = belowOf.get(upstream.id) ?? [];
    list.push(downstream.id);
    belowOf.set(upstream.id, list);
  }
  const context = { network, faults, bands };
  const protects = new Map<string, ProtectedElements>();
  const entry = (id: string) => {
    let found = protects.get(id);
    if (!found) protects.set(id, (found = { transformers: [], cables: [], motors: [] }));
    return found;
  };
  for (const t of study.transformers) {
    const device = protectingDevice(context, t.id);
    if (device) entry(device.id).transformers.push(t);
  }
  for (const c of study.cables) {
    const device = protectingDevice(context, c.id);
    if (device) entry(device.id).cables.push(c);
  }
  for (const m of study.motors) {
    const device = protectingDevice(context, m.id);
    if (device) entry(device.id).motors.push(m);
  }
  return {
    study,
    protects,
    settings: study.coordination,
    network,
    faults,
    bands,
    aboveOf,
    belowOf,
    place(device) {
      network.devices.set(device.id, device);
      network.deviceFeeding.set(device.feeds, device);
      bands.set(device.id, cachedBandOf(device.characteristic));
    },
    deviceOf(id) {
      const device = network.devices.get(id);
      if (!device) throw new RangeError(`no device "${id}" in the study`);
      return device;
    },
  };
}
