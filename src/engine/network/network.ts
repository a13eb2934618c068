import type { Bus, Cable, Device, Motor, Study, Switch, Transformer } from '../study/index.ts';
import { addToList } from '../addToList.ts';

/** A closed switch as the network sees it: a connection of no impedance from one bus down to another. */
export interface SwitchLink {
  id: string;
  name?: string;
  from: string;
  to: string;
  /** The switch it comes from (a transfer switch links its normal or emergency side to its load bus). */
  switch: Switch;
}

/** A branch of the radial tree: it carries current from its `from` bus down to its `to` bus. */
export type Branch =
  { type: 'transformer'; item: Transformer } | { type: 'cable'; item: Cable } | { type: 'switch'; item: SwitchLink };

/** Anything in the tree: a bus, a branch (transformer, cable, closed switch), or a motor; devices feed all but switches. */
export type Element = { type: 'bus'; item: Bus } | Branch | { type: 'motor'; item: Motor };

/**
 * The radial tree of a study, indexed for walking up and down (DEVELOPERS.md, data flow). Built from a study that
 * `readStudy` accepted; it does not validate again.
 */
export interface Network {
  study: Study;
  buses: Map<string, Bus>;
  elements: Map<string, Element>;
  /** The branch feeding each bus; absent for the source bus. */
  feederOf: Map<string, Branch>;
  /** Branches leaving each bus, in study order. */
  branchesFrom: Map<string, Branch[]>;
  /** Motors on each bus. */
  motorsOn: Map<string, Motor[]>;
  /** The device feeding each element id. */
  deviceFeeding: Map<string, Device>;
  devices: Map<string, Device>;
  /**
   * What the checks ask of the tree for every device, cable and zone, worked out once (walking up the
   * tree for each was about a sixth of the map reads of a large study's analysis): each bus's depth (branches
   * between it and its tree's source), each element's location bus (where a device feeding it sits)
   * and its protecting device's id (the nearest device feeding it or an element above it; `undefined`
   * where none does). Elements no source reaches (a study the tree rules have not passed) are left out,
   * and the walkers below then climb the tree as before. The protectors are kept by id and looked up in
   * `devices`, so that a device put in place of another of its id (the setting window's trials) is
   * the one found.
   */
  depths: Map<string, number>;
  locations: Map<string, Bus>;
  protectors: Map<string, string | undefined>;
}

/** Builds the indexed tree. @example const network = networkOf(study) */
export function networkOf(study: Study): Network {
  const buses = new Map(study.buses.map((bus) => [bus.id, bus]));
  const elements = new Map<string, Element>();
  for (const item of study.buses) elements.set(item.id, { type: 'bus', item });
  for (const item of study.transformers) elements.set(item.id, { type: 'transformer', item });
  for (const item of study.cables) elements.set(item.id, { type: 'cable', item });
  for (const item of study.motors) elements.set(item.id, { type: 'motor', item });
  for (const item of closedSwitchLinks(study.switches)) elements.set(item.id, { type: 'switch', item });
  const feederOf = new Map<string, Branch>();
  const branchesFrom = new Map<string, Branch[]>();
  for (const element of elements.values()) {
    if (element.type !== 'transformer' && element.type !== 'cable' && element.type !== 'switch') continue;
    feederOf.set(element.item.to, element);
    addToList(branchesFrom, element.item.from, element);
  }
  const motorsOn = new Map<string, Motor[]>();
  for (const motor of study.motors) addToList(motorsOn, motor.bus, motor);
  const deviceFeeding = new Map(study.devices.map((device) => [device.feeds, device]));
  const devices = new Map(study.devices.map((device) => [device.id, device]));
  const tree = { buses, feederOf, branchesFrom, motorsOn, deviceFeeding };
  return { study, buses, elements, feederOf, branchesFrom, motorsOn, deviceFeeding, devices, ...treeFactsOf(tree) };
}

/**
 * Each bus's depth and each element's location bus and protecting device (see `Network`), from the
 * top of each tree down: an element's protector is the device feeding it, else its parent's (a
 * branch's or motor's bus, a bus's feeding branch). Only a bus's own feeding branch leads to it, as
 * the walkers climb; a bus is visited once.
 */
function treeFactsOf(
  tree: Pick<Network, 'buses' | 'feederOf' | 'branchesFrom' | 'motorsOn' | 'deviceFeeding'>,
): Pick<Network, 'depths' | 'locations' | 'protectors'> {
  const { buses, feederOf, branchesFrom, motorsOn, deviceFeeding } = tree;
  const depths = new Map<string, number>();
  const locations = new Map<string, Bus>();
  const protectors = new Map<string, string | undefined>();
  const order: Bus[] = [];
  for (const bus of buses.values())
    if (!feederOf.has(bus.id)) {
      depths.set(bus.id, 0);
      protectors.set(bus.id, deviceFeeding.get(bus.id)?.id);
      order.push(bus);
    }
  for (let i = 0; i < order.length; i++) {
    const bus = order[i];
    const depth = depths.get(bus.id)!;
    const above = protectors.get(bus.id);
    locations.set(bus.id, bus);
    for (const motor of motorsOn.get(bus.id) ?? []) {
      locations.set(motor.id, bus);
      protectors.set(motor.id, deviceFeeding.get(motor.id)?.id ?? above);
    }
    for (const branch of branchesFrom.get(bus.id) ?? []) {
      const atBranch = deviceFeeding.get(branch.item.id)?.id ?? above;
      locations.set(branch.item.id, bus);
      protectors.set(branch.item.id, atBranch);
      const below = buses.get(branch.item.to);
      if (!below || feederOf.get(below.id) !== branch || depths.has(below.id)) continue;
      depths.set(below.id, depth + 1);
      protectors.set(below.id, deviceFeeding.get(below.id)?.id ?? atBranch);
      order.push(below);
    }
  }
  return { depths, locations, protectors };
}

/**
 * The connections the switches make in their present positions: a transfer switch links its
 * `normal` side to its load bus (a study resolved for a scenario writes the chosen side as a closed
 * tie), a tie links its two buses when `normally` closed.
 */
export function closedSwitchLinks(switches: readonly Switch[]): SwitchLink[] {
  return switches.flatMap((item): SwitchLink[] => {
    if (item.kind === 'transfer')
      return [{ id: item.id, name: item.name, from: item.normal, to: item.to, switch: item }];
    return item.normally === 'closed'
      ? [{ id: item.id, name: item.name, from: item.from, to: item.to, switch: item }]
      : [];
  });
}

/**
 * The element ids from the source bus down to `elementId`, inclusive, alternating buses and
 * branches and ending, for a motor, with the motor: `['MV', 'T1', 'SWBD', 'C-MCC', 'MCC', 'M1']`.
 */
export function pathTo(network: Network, elementId: string): string[] {
  const element = network.elements.get(elementId);
  if (!element) throw new RangeError(`no element "${elementId}" in the network`);
  const path: string[] = [];
  let bus: string | undefined;
  if (element.type === 'motor') {
    path.push(element.item.id);
    bus = element.item.bus;
  } else if (element.type === 'bus') bus = element.item.id;
  else {
    path.push(element.item.id);
    bus = element.item.from;
  }
  while (bus !== undefined) {
    path.push(bus);
    const feeder = network.feederOf.get(bus);
    if (!feeder) break;
    path.push(feeder.item.id);
    bus = feeder.item.from;
  }
  return path.reverse();
}

/**
 * The bus where a device sits, which sets its voltage and the fault current at its location:
 * the bus itself for a main, else the bus its transformer, cable or motor hangs from.
 */
export function locationBusOf(network: Network, device: Device): Bus {
  const located = network.locations.get(device.feeds);
  if (located) return located;
  const element = network.elements.get(device.feeds)!;
  const busId =
    element.type === 'bus' ? element.item.id : element.type === 'motor' ? element.item.bus : element.item.from;
  return network.buses.get(busId)!;
}

/** The nearest device above `device` on the way to the source, if any. */
export function upstreamDeviceOf(network: Network, device: Device): Device | undefined {
  // Where the tree's facts know what the device feeds, they know the element just above it: its
  // protector is the answer (none above a tree's top bus).
  const element = network.elements.get(device.feeds);
  if (element && network.protectors.has(device.feeds)) {
    const parent =
      element.type === 'bus'
        ? network.feederOf.get(element.item.id)?.item.id
        : element.type === 'motor'
          ? element.item.bus
          : element.item.from;
    const above = parent === undefined ? undefined : network.protectors.get(parent);
    return above === undefined ? undefined : network.devices.get(above);
  }
  const path = pathTo(network, device.feeds);
  for (let i = path.length - 2; i >= 0; i--) {
    const above = network.deviceFeeding.get(path[i]);
    if (above) return above;
  }
  return undefined;
}

/** Every series pair: each device with the nearest device above it (DEVELOPERS.md, names "pair"). */
export function seriesPairs(network: Network): { upstream: Device; downstream: Device }[] {
  const pairs: { upstream: Device; downstream: Device }[] = [];
  for (const downstream of network.study.devices) {
    const upstream = upstreamDeviceOf(network, downstream);
    if (upstream) pairs.push({ upstream, downstream });
  }
  return pairs;
}

/** The transformers crossed going from bus `from` up or down to bus `to`, in order (for reflection). */
export function transformersBetween(network: Network, from: string, to: string): Transformer[] {
  // Most pairs and zones lie on one bus: no path to walk.
  if (from === to) return [];
  // Both buses climb toward the source, the lower one first, until they meet: the transformers
  // crossed going up from `from`, then those coming down to `to` (no path is built: a study asks
  // this for every pair and zone).
  const upward: Transformer[] = [];
  const downward: Transformer[] = [];
  let a = from;
  let b = to;
  let aDepth = depthOf(network, a);
  let bDepth = depthOf(network, b);
  // Buses of separate trees (each its own source) meet nowhere: every transformer above each counts.
  while (a !== b && (aDepth > 0 || bDepth > 0)) {
    if (aDepth >= bDepth) {
      const feeder = network.feederOf.get(a)!;
      if (feeder.type === 'transformer') upward.push(feeder.item);
      a = feeder.item.from;
      aDepth--;
    } else {
      const feeder = network.feederOf.get(b)!;
      if (feeder.type === 'transformer') downward.push(feeder.item);
      b = feeder.item.from;
      bDepth--;
    }
  }
  for (let i = downward.length - 1; i >= 0; i--) upward.push(downward[i]);
  return upward;
}

/** How many branches lie between a bus and the source bus. */
function depthOf(network: Network, busId: string): number {
  const known = network.depths.get(busId);
  if (known !== undefined) return known;
  if (!network.buses.has(busId)) throw new RangeError(`no bus "${busId}" in the network`);
  let depth = 0;
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from)) depth++;
  return depth;
}
