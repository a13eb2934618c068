import type { Branch, Network } from '../../engine/network/index.ts';
import { switchPosition } from '../../engine/scenario/index.ts';
import type { Bus, Motor, Scenario, Study, Switch } from '../../engine/study/index.ts';
import { formatAmps, formatSI, formatVolts } from '../../engine/quantity/index.ts';
import type { ScenarioView } from './scenarioParts.ts';
import type { ItemKind } from './selection.ts';
import { sameNetworkInputs } from '../../engine/network/sameNetworkInputs.ts';

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

/** Options of {@link systemTreeOf}. */
export interface SystemTreeOptions {
  /**
   * The switches of the whole study and the scenario the tree is drawn in: each closed switch then
   * reads as its position in that scenario (a tree split off for a scenario holds its switches as ties).
   */
  scenario?: { switches: readonly Switch[]; scenario: Scenario };
}

/**
 * The radial tree as rows, from the source down: each bus lists its branches (transformers, cables
 * and closed switches, each with the bus it feeds) and its motors; each element carries the device
 * feeding it. A generator at the root is a `generator` item. Built with its own stack, so a study any
 * number of levels deep builds (no call-stack limit).
 *
 * @example systemTreeOf(networkOf(study)) // { kind: 'source', id: 'UTIL', children: [{ kind: 'bus', id: 'MV', … }] }
 */
export function systemTreeOf(network: Network, options: SystemTreeOptions = {}): TreeNode {
  const { study } = network;
  const source = study.source;
  const sourceDetail =
    source.kind === 'utility'
      ? `utility, ${source.max.available.va !== undefined ? formatSI(source.max.available.va, 'VA') : formatAmps(source.max.available.amps ?? 0)} available`
      : source.kind === 'generator'
        ? `generator, ${formatSI(source.rating, 'VA')}, ${formatVolts(source.voltage)}`
        : 'infinite bus';
  const kind: ItemKind = source.kind === 'generator' ? 'generator' : 'source';
  const root: TreeNode = { kind, id: source.id, label: source.id, detail: sourceDetail, children: [] };
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
      const child = branchNode(network, branch, options);
      node.children.push(child);
      pending.push({ busId: branch.item.to, into: child.children });
    }
    for (const motor of network.motorsOn.get(busId) ?? []) node.children.push(motorNode(network, motor));
  }
  return root;
}

/**
 * The tree's rows in reading order (depth first) with their depth, for drawing the tree as one flat
 * list and for keyboard movement through it. Walks with its own stack (no depth limit). Right after
 * an edit that left the network's elements as they were (a device setting), it lays out only the
 * rows of the devices the edit changed and hands back the earlier rows otherwise (the same array when
 * no row reads differently); a row's `children` are then those of the layout it was first built in.
 *
 * @example systemRowsOf(network).map((r) => `${r.depth} ${r.node.id}`) // ['0 UTIL', '1 MV', '2 T1', '3 SWBD', …]
 */
export function systemRowsOf(network: Network, options: SystemTreeOptions = {}): SystemRow[] {
  if (options.scenario) return rowsOf(systemTreeOf(network, options));
  const last = lastLaidOut;
  const rows = last && sameNetworkInputs(last.network.study, network.study) ? withDevicesOf(network, last) : undefined;
  lastLaidOut = { network, rows: rows ?? rowsOf(systemTreeOf(network)) };
  return lastLaidOut.rows;
}

/**
 * The last network `systemRowsOf` laid out (without a scenario) and its rows. An edit of a device's
 * settings leaves the network's elements as they were, so the next network's rows are these with
 * only the rows of changed devices read again: a setting edit in a large study lays out one row.
 */
let lastLaidOut: { network: Network; rows: SystemRow[] } | undefined;

// Accepts a network with the same elements as `last.network` (sameNetworkInputs); `last.rows` with
// each row whose device now reads differently replaced, or `last.rows` itself when none does.
function withDevicesOf(network: Network, last: { network: Network; rows: SystemRow[] }): SystemRow[] {
  const before = last.network.study.devices;
  const changed = new Set<string>();
  network.study.devices.forEach((device, i) => {
    if (device !== before[i]) changed.add(device.id);
  });
  if (changed.size === 0) return last.rows;
  let rows = last.rows;
  last.rows.forEach((row, i) => {
    const id = row.node.device?.id;
    if (id === undefined || !changed.has(id)) return;
    const device = deviceOf(network, row.node.id);
    const next = { node: { ...row.node, device }, depth: row.depth };
    if (readsAlike(row, next)) return;
    if (rows === last.rows) rows = last.rows.slice();
    rows[i] = next;
  });
  return rows;
}

/**
 * The rows of every tree a scenario energises, one after another (the study's own source first),
 * each switch reading as its position in the scenario.
 *
 * @example scenarioRowsOf(study, scenarioViewOf(study, onGenerator)).map((r) => r.node.id)[0] // 'G1'
 */
export function scenarioRowsOf(study: Study, scenario: ScenarioView): SystemRow[] {
  const options = { scenario: { switches: study.switches, scenario: scenario.scenario } };
  return scenario.parts.flatMap((part) => systemRowsOf(part.network, options));
}

/** An item a scenario leaves out of its trees, for the tree's "not energised in this scenario" group. */
export interface DarkItem {
  kind: ItemKind;
  id: string;
  label: string;
  detail: string;
}

/**
 * What a scenario leaves out of its trees, in study order: the sources not in service, the buses no
 * source reaches, the transformers and cables it takes out, and the switches open in it (a transfer
 * switch's idle side is not listed: the switch is in a tree, on its other side).
 *
 * @example darkItemsOf(study, scenarioViewOf(study, onGenerator)).map((d) => d.id) // ['UTIL', 'MV', 'SWBD', …, 'TIE']
 */
export function darkItemsOf(study: Study, scenario: ScenarioView): DarkItem[] {
  const { scenario: chosen, deEnergised } = scenario;
  const inService = new Set(scenario.parts.map((part) => part.sourceId));
  const dark = new Set(deEnergised);
  const out = new Set(chosen.outOfService);
  const items: DarkItem[] = [];
  if (!inService.has(study.source.id))
    items.push({ kind: 'source', id: study.source.id, label: study.source.id, detail: 'not in service' });
  for (const g of study.generators)
    if (!inService.has(g.id))
      items.push({ kind: 'generator', id: g.id, label: g.name ?? g.id, detail: 'not in service' });
  for (const bus of study.buses)
    if (dark.has(bus.id))
      items.push({
        kind: 'bus',
        id: bus.id,
        label: bus.name ?? bus.id,
        detail: `${formatVolts(bus.voltage)}, de-energised`,
      });
  for (const t of study.transformers)
    if (out.has(t.id)) items.push({ kind: 'transformer', id: t.id, label: t.name ?? t.id, detail: 'out of service' });
  for (const c of study.cables)
    if (out.has(c.id)) items.push({ kind: 'cable', id: c.id, label: c.name ?? c.id, detail: 'out of service' });
  for (const item of study.switches)
    if (switchPosition(item, chosen) === 'open')
      items.push({ kind: 'switch', id: item.id, label: item.name ?? item.id, detail: switchText(item, chosen) });
  return items;
}

/**
 * A switch's kind and its position in a scenario, as the tree prints it.
 * @example switchText(ats, onGenerator) // 'transfer switch, on the emergency side (ATS-E)'
 */
export function switchText(item: Switch, scenario: Scenario): string {
  const position = switchPosition(item, scenario);
  if (item.kind === 'tie') return `tie, ${position}`;
  if (position === 'normal' || position === 'emergency')
    return `transfer switch, on the ${position} side (${item[position]})`;
  return 'transfer switch, open';
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

function branchNode(network: Network, branch: Branch, options: SystemTreeOptions): TreeNode {
  const item = branch.item;
  const original =
    branch.type === 'switch' ? options.scenario?.switches.find((s) => s.id === branch.item.id) : undefined;
  const detail =
    branch.type === 'transformer'
      ? `${formatSI(branch.item.rating, 'VA')}, ${formatVolts(branch.item.primary)}–${formatVolts(branch.item.secondary)}, ${branch.item.impedance} %Z`
      : branch.type === 'switch'
        ? original && options.scenario
          ? switchText(original, options.scenario.scenario)
          : `${branch.item.switch.kind === 'transfer' ? 'transfer switch' : 'tie'}, closed from ${branch.item.from}`
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

/**
 * `next` with each row that reads the same as the row of `previous` with its key (same depth, kind, id,
 * label, detail and feeding device) replaced by that previous row, and `previous` itself when no row
 * changed: an edit of a setting then hands the tree the rows it already drew, and a keyed list redraws
 * nothing.
 *
 * @example keptRowsOf(systemRowsOf(networkOf(edited)), rows) === rows // true when only a setting changed
 */
export function keptRowsOf(next: SystemRow[], previous: readonly SystemRow[] | undefined): SystemRow[] {
  if (!previous || next === previous) return next;
  // The very rows `previous` was made from: every row of `previous` already reads as its row of `next`.
  if (keptFrom.get(previous) === next) return previous as SystemRow[];
  const before = new Map(previous.map((row) => [rowKeyOf(row.node), row]));
  let same = next.length === previous.length;
  const kept = next.map((row, i) => {
    const old = before.get(rowKeyOf(row.node));
    const keep = old !== undefined && readsAlike(old, row);
    if (!keep || previous[i] !== old) same = false;
    return keep ? old : row;
  });
  const result = same ? (previous as SystemRow[]) : kept;
  keptFrom.set(result, next);
  return result;
}

/** For each array `keptRowsOf` returned, the rows it was made from (an unchanged layout is handed in again). */
const keptFrom = new WeakMap<readonly SystemRow[], SystemRow[]>();

/**
 * The key of a tree item, unique in the tree: its kind and id.
 * @example rowKeyOf({ kind: 'bus', id: 'MCC' }) // 'bus:MCC'
 */
export function rowKeyOf(item: { kind: string; id: string }): string {
  return `${item.kind}:${item.id}`;
}

/** One item of the tree as the keyboard moves through it: an element, or the device drawn above it on its row. */
export interface TreeItem {
  /** `rowKeyOf` of the item. */
  key: string;
  /** `rowKeyOf` of the row drawing it. */
  rowKey: string;
  /** 1 for the source, as `aria-level` counts. */
  level: number;
}

/**
 * The tree's items in reading order (a row's device before its element, on the same level).
 * @example treeItemsOf(rows).slice(0, 2) // [{ key: 'source:UTIL', rowKey: 'source:UTIL', level: 1 }, { key: 'device:R-MV', … }]
 */
export function treeItemsOf(rows: readonly SystemRow[]): TreeItem[] {
  const items: TreeItem[] = [];
  for (const { node, depth } of rows) {
    const rowKey = rowKeyOf(node);
    if (node.device) items.push({ key: rowKeyOf({ kind: 'device', id: node.device.id }), rowKey, level: depth + 1 });
    items.push({ key: rowKey, rowKey, level: depth + 1 });
  }
  return items;
}

// Two rows draw the same: same depth and the same words for the element and its device.
function readsAlike(a: SystemRow, b: SystemRow): boolean {
  const [x, y] = [a.node, b.node];
  return (
    a.depth === b.depth &&
    x.label === y.label &&
    x.detail === y.detail &&
    x.device?.id === y.device?.id &&
    x.device?.label === y.device?.label &&
    x.device?.detail === y.device?.detail
  );
}
