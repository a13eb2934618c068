import type { Network } from '../../engine/network/index.ts';
import { formatAmps, formatSI, formatVolts } from '../../engine/quantity/index.ts';
import type { ItemKind } from './selection.ts';

/** One row of the System tree: an element, the device feeding it (if any), and what hangs below. */
export interface TreeNode {
  kind: ItemKind;
  id: string;
  /** Name, or the id when the item has none. */
  label: string;
  /** A short rating summary: "1500 kVA, 5.75 %Z", "480 V". */
  detail: string;
  /** The device that feeds this element (drawn on the same row, above it in the circuit). */
  device?: { id: string; label: string; detail: string };
  children: TreeNode[];
}

/**
 * The radial tree as rows, from the source down: each bus lists its branches (transformers and
 * cables, each with the bus it feeds) and its motors; each element carries the device feeding it.
 *
 * @example systemTreeOf(networkOf(study)) // { kind: 'source', id: 'UTIL', children: [{ kind: 'bus', id: 'MV', … }] }
 */
export function systemTreeOf(network: Network): TreeNode {
  const { study } = network;
  const source = study.source;
  const sourceDetail =
    source.kind === 'utility'
      ? `utility, ${source.max.available.va !== undefined ? formatSI(source.max.available.va, 'VA') : formatAmps(source.max.available.amps ?? 0)} available`
      : 'infinite bus';
  return {
    kind: 'source',
    id: source.id,
    label: source.id,
    detail: sourceDetail,
    children: [busNode(network, source.bus)],
  };
}

function busNode(network: Network, busId: string): TreeNode {
  const bus = network.buses.get(busId)!;
  const branches = (network.branchesFrom.get(busId) ?? []).map((branch): TreeNode => {
    const item = branch.item;
    const detail =
      branch.type === 'transformer'
        ? `${formatSI(branch.item.rating, 'VA')}, ${formatVolts(branch.item.primary)}–${formatVolts(branch.item.secondary)}, ${branch.item.impedance} %Z`
        : `${branch.item.sets > 1 ? `${branch.item.sets} × ` : ''}${branch.item.size} ${branch.item.material}, ${Math.round(branch.item.length / 0.3048)} ft`;
    return {
      kind: branch.type,
      id: item.id,
      label: item.name ?? item.id,
      detail,
      device: deviceOf(network, item.id),
      children: [busNode(network, item.to)],
    };
  });
  const motors = (network.motorsOn.get(busId) ?? []).map((motor): TreeNode => ({
    kind: 'motor',
    id: motor.id,
    label: motor.name ?? motor.id,
    detail: motor.hp !== undefined ? `${motor.hp} hp` : motor.rating !== undefined ? formatSI(motor.rating, 'VA') : '',
    device: deviceOf(network, motor.id),
    children: [],
  }));
  return {
    kind: 'bus',
    id: bus.id,
    label: bus.name ?? bus.id,
    detail: formatVolts(bus.voltage),
    device: deviceOf(network, bus.id),
    children: [...branches, ...motors],
  };
}

function deviceOf(network: Network, elementId: string): TreeNode['device'] {
  const device = network.deviceFeeding.get(elementId);
  if (!device) return undefined;
  const rating = device.rating !== undefined ? `, ${formatAmps(device.rating)}` : '';
  return { id: device.id, label: device.name ?? device.id, detail: `${device.characteristic.kind}${rating}` };
}

/**
 * The tree's rows in reading order (depth first), for keyboard movement through the tree.
 * @example flattenTree(systemTreeOf(network)).map((n) => n.id) // ['UTIL', 'MV', 'T1', 'SWBD', …]
 */
export function flattenTree(root: TreeNode): TreeNode[] {
  return [root, ...root.children.flatMap(flattenTree)];
}
