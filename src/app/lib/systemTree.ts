import type { Branch, Network } from '../../engine/network/index.ts';
import type { Bus, Motor } from '../../engine/study/index.ts';
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

/** One row of the tree as drawn: the node and how many levels below the source it sits. */
export interface SystemRow {
  node: TreeNode;
  /** 0 for the source, 1 for its bus, and so on down. */
  depth: number;
}

/**
 * The radial tree as rows, from the source down: each bus lists its branches (transformers and
 * cables, each with the bus it feeds) and its motors; each element carries the device feeding it.
 * Built with its own stack, so a study any number of levels deep builds (no call-stack limit).
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
  const root: TreeNode = { kind: 'source', id: source.id, label: source.id, detail: sourceDetail, children: [] };
  // Each entry: a bus still to build, and the list its node goes into.
  const pending: { busId: string; into: TreeNode[] }[] = [{ busId: source.bus, into: root.children }];
  const built = new Set<string>();
  while (pending.length > 0) {
    const { busId, into } = pending.pop()!;
    const bus = network.buses.get(busId);
    if (!bus || built.has(busId)) continue;
    built.add(busId);
    const node = busNode(network, bus);
    into.push(node);
    for (const branch of network.branchesFrom.get(busId) ?? []) {
      const child = branchNode(network, branch);
      node.children.push(child);
      pending.push({ busId: branch.item.to, into: child.children });
    }
    for (const motor of network.motorsOn.get(busId) ?? []) node.children.push(motorNode(network, motor));
  }
  return root;
}

/**
 * The tree's rows in reading order (depth first) with their depth, for drawing the tree as one flat
 * list and for keyboard movement through it. Walks with its own stack (no depth limit).
 *
 * @example systemRowsOf(network).map((r) => `${r.depth} ${r.node.id}`) // ['0 UTIL', '1 MV', '2 T1', '3 SWBD', …]
 */
export function systemRowsOf(network: Network): SystemRow[] {
  return rowsOf(systemTreeOf(network));
}

/**
 * The rows under `root` (itself first) in reading order with their depth below it.
 * @example rowsOf(tree)[0] // { node: tree, depth: 0 }
 */
export function rowsOf(root: TreeNode): SystemRow[] {
  const rows: SystemRow[] = [];
  const pending: SystemRow[] = [{ node: root, depth: 0 }];
  while (pending.length > 0) {
    const row = pending.pop()!;
    rows.push(row);
    for (let i = row.node.children.length - 1; i >= 0; i--)
      pending.push({ node: row.node.children[i], depth: row.depth + 1 });
  }
  return rows;
}

function busNode(network: Network, bus: Bus): TreeNode {
  return {
    kind: 'bus',
    id: bus.id,
    label: bus.name ?? bus.id,
    detail: formatVolts(bus.voltage),
    device: deviceOf(network, bus.id),
    children: [],
  };
}

function branchNode(network: Network, branch: Branch): TreeNode {
  const item = branch.item;
  const detail =
    branch.type === 'transformer'
      ? `${formatSI(branch.item.rating, 'VA')}, ${formatVolts(branch.item.primary)}–${formatVolts(branch.item.secondary)}, ${branch.item.impedance} %Z`
      : branch.type === 'switch'
        ? `${branch.item.switch.kind === 'transfer' ? 'transfer switch' : 'tie'}, closed from ${branch.item.from}`
        : `${branch.item.sets > 1 ? `${branch.item.sets} × ` : ''}${branch.item.size} ${branch.item.material}, ${Math.round(branch.item.length / 0.3048)} ft`;
  return {
    kind: branch.type,
    id: item.id,
    label: item.name ?? item.id,
    detail,
    device: deviceOf(network, item.id),
    children: [],
  };
}

function motorNode(network: Network, motor: Motor): TreeNode {
  return {
    kind: 'motor',
    id: motor.id,
    label: motor.name ?? motor.id,
    detail: motor.hp !== undefined ? `${motor.hp} hp` : motor.rating !== undefined ? formatSI(motor.rating, 'VA') : '',
    device: deviceOf(network, motor.id),
    children: [],
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
  return rowsOf(root).map((row) => row.node);
}
