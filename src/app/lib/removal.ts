import type { StudyInput } from '../../engine/study/index.ts';
import type { Selection } from './selection.ts';

/** The kinds of item that can be deleted from the tree (the source and views are not). */
export type RemovableKind = 'bus' | 'transformer' | 'cable' | 'motor' | 'device';

/**
 * Everything deleting one item takes with it, by kind, in document order: the item, the device
 * feeding it, and for a bus or a branch everything below (branches, buses, motors and their devices).
 * A switch with an end on a bus that goes goes too, and so does a generator on such a bus; a bus
 * then fed by nothing that stays (a transfer switch's load bus) goes with what hangs below it.
 * Views left with no device go too, and so do scenarios left with none of their sources or left the
 * same as another scenario; references from other views, scenarios and per-pair margins are dropped
 * when the documents are rewritten by {@link withoutRemoval}.
 */
export interface Removal {
  target: { kind: RemovableKind; id: string };
  buses: string[];
  transformers: string[];
  cables: string[];
  motors: string[];
  devices: string[];
  /** Switches with an end (`from`, `to`, `normal`, `emergency`) on a bus that goes. */
  switches: string[];
  /** Generators on a bus that goes. */
  generators: string[];
  /** Views that would be left with no device. */
  views: string[];
  /** Scenarios that go: every source they name goes, or they would fix no more than another scenario. */
  scenarios: string[];
  /** Scenarios that stay but lose a source, a switch position or an out-of-service branch that goes. */
  trimmedScenarios: string[];
}

/** A list item as far as removal needs it (the document may be mid-edit, so nothing is trusted). */
type Item = {
  id?: unknown;
  kind?: unknown;
  from?: unknown;
  to?: unknown;
  normal?: unknown;
  emergency?: unknown;
  bus?: unknown;
  feeds?: unknown;
  devices?: unknown;
};

/** A scenario as far as removal needs it. */
type ScenarioItem = { id?: unknown; sources?: unknown; switches?: unknown; outOfService?: unknown };

/**
 * What deleting `selection` removes, worked out on the document as written (it may have problems).
 * `undefined` for what cannot be deleted this way: the source, the bus the source feeds, a view, or
 * an item not in the document.
 *
 * @example removalOf(document, { kind: 'cable', id: 'C-MCC' }) // { cables: ['C-MCC'], buses: ['MCC'], motors: ['M1', …], devices: ['FDR-MCC', …], … }
 */
export function removalOf(document: StudyInput, selection: Selection): Removal | undefined {
  // An item held by its place while its id is typed (another item's, or no id yet) is not deleted
  // here: what goes is found by id, and the id may name another item too.
  if (selection.at !== undefined) return undefined;
  const kind = selection.kind;
  // Switches and generators are deleted from the property editor's list, with no cascade.
  if (kind === 'source' || kind === 'view' || kind === 'switch' || kind === 'generator') return undefined;
  const buses = listOf(document, 'buses');
  const transformers = listOf(document, 'transformers');
  const cables = listOf(document, 'cables');
  const motors = listOf(document, 'motors');
  const devices = listOf(document, 'devices');
  const sourceBus = (document.source as Item | undefined)?.bus;
  const lists = { bus: buses, transformer: transformers, cable: cables, motor: motors, device: devices };
  if (!lists[kind].some((item) => item.id === selection.id)) return undefined;
  if (kind === 'bus' && selection.id === sourceBus) return undefined;

  const removed = new Set<unknown>([selection.id]);
  const pending: unknown[] = [];
  if (kind === 'bus') {
    pending.push(selection.id);
    // The branch feeding the bus goes with it: a branch to nowhere is no part of a study.
    for (const branch of [...transformers, ...cables]) if (branch.to === selection.id) removed.add(branch.id);
  } else if (kind === 'transformer' || kind === 'cable') {
    const branch = lists[kind].find((item) => item.id === selection.id);
    if (branch?.to !== sourceBus) pending.push(branch?.to);
  }
  const switches = listOf(document, 'switches');
  const generators = listOf(document, 'generators');
  const branchesFrom = groupBy([...transformers, ...cables], (branch) => branch.from);
  const motorsOn = groupBy(motors, (motor) => motor.bus);
  const feedersOf = feedersByBus(transformers, cables, switches, generators);
  const visited = new Set<unknown>();
  let growing = true;
  while (growing) {
    // Everything below, bus by bus (a walk with its own stack: no depth limit, and a loop in a
    // mid-edit document is visited once).
    while (pending.length > 0) {
      const bus = pending.pop();
      if (bus === undefined || bus === sourceBus || visited.has(bus)) continue;
      visited.add(bus);
      removed.add(bus);
      for (const branch of branchesFrom.get(bus) ?? []) {
        if (removed.has(branch.id)) continue;
        removed.add(branch.id);
        pending.push(branch.to);
      }
      for (const motor of motorsOn.get(bus) ?? []) removed.add(motor.id);
    }
    growing = false;
    // A switch cannot stand with an end on nothing, nor a generator feed a bus that is gone.
    for (const item of switches) {
      if (removed.has(item.id) || !endsOf(item).some((end) => removed.has(end))) continue;
      removed.add(item.id);
      growing = true;
    }
    for (const generator of generators) {
      if (removed.has(generator.id) || !removed.has(generator.bus)) continue;
      removed.add(generator.id);
      growing = true;
    }
    // A bus whose every feed went (the load bus of a transfer switch that went) would be an orphan.
    for (const [bus, feeders] of feedersOf) {
      if (visited.has(bus) || bus === sourceBus || !feeders.every((feeder) => removed.has(feeder))) continue;
      pending.push(bus);
      growing = true;
    }
  }
  for (const device of devices) if (removed.has(device.feeds)) removed.add(device.id);

  const idsIn = (list: Item[]) => list.filter((item) => removed.has(item.id)).map((item) => String(item.id));
  const goneDevices = new Set(idsIn(devices));
  const views = listOf(document, 'views')
    .filter((view) => Array.isArray(view.devices) && view.devices.every((id) => goneDevices.has(id)))
    .map((view) => String(view.id));
  const fates = scenarioFates(listOf(document, 'scenarios'), removed);
  return {
    target: { kind, id: selection.id },
    buses: idsIn(buses),
    transformers: idsIn(transformers),
    cables: idsIn(cables),
    motors: idsIn(motors),
    devices: [...goneDevices],
    switches: idsIn(switches),
    generators: idsIn(generators),
    views,
    scenarios: fates.filter((fate) => fate.next === undefined).map((fate) => String(fate.scenario.id)),
    trimmedScenarios: fates
      .filter((fate) => fate.next !== undefined && fate.next !== fate.scenario)
      .map((fate) => String(fate.scenario.id)),
  };
}

/**
 * The document without what `removal` lists: the items, their places on views (devices, fault
 * buses, withstand and starting curves), views left with no device, per-pair margins naming a
 * removed device, and in scenarios the sources, switch positions and out-of-service branches that
 * go (scenarios the removal lists go whole). Everything else is shared with the original.
 *
 * @example withoutRemoval(document, removalOf(document, { kind: 'bus', id: 'MCC' })!)
 */
export function withoutRemoval(document: StudyInput, removal: Removal): StudyInput {
  const gone = new Set<unknown>([
    ...removal.buses,
    ...removal.transformers,
    ...removal.cables,
    ...removal.motors,
    ...removal.devices,
    ...removal.switches,
    ...removal.generators,
  ]);
  const goneScenarios = new Set<unknown>(removal.scenarios);
  const goneViews = new Set(removal.views);
  // A list that loses nothing stays the same object (the reading of an edit skips it).
  const keep = <T>(list: T[] | undefined): T[] | undefined => {
    const stays = (item: T) => !gone.has((item as Item | undefined)?.id);
    return list && !list.every(stays) ? list.filter(stays) : list;
  };
  const keepIds = <T>(ids: T[] | undefined): T[] | undefined => ids?.filter((id) => !gone.has(id));
  const next: StudyInput = {
    ...document,
    buses: keep(document.buses) ?? [],
    transformers: keep(document.transformers),
    cables: keep(document.cables),
    motors: keep(document.motors),
    devices: keep(document.devices),
    switches: keep(document.switches),
    generators: keep(document.generators),
    scenarios: keepScenarios(document.scenarios, goneScenarios, gone),
    views: document.views
      ?.filter((view) => !goneViews.has(view.id))
      .map((view) => {
        const devices = keepIds(view.devices) ?? [];
        const faults = keepIds(view.faults);
        const withstand = keepIds(view.withstand);
        const motors = keepIds(view.motors);
        const changed =
          devices.length !== view.devices?.length ||
          faults?.length !== view.faults?.length ||
          withstand?.length !== view.withstand?.length ||
          motors?.length !== view.motors?.length;
        if (!changed) return view;
        return {
          ...view,
          devices,
          ...(faults && { faults }),
          ...(withstand && { withstand }),
          ...(motors && { motors }),
        };
      }),
  };
  const pairs = document.coordination?.pairs;
  if (pairs?.some((pair) => gone.has(pair.upstream) || gone.has(pair.downstream))) {
    next.coordination = {
      ...document.coordination,
      pairs: pairs.filter((pair) => !gone.has(pair.upstream) && !gone.has(pair.downstream)),
    };
  }
  for (const key of [
    'transformers',
    'cables',
    'motors',
    'devices',
    'switches',
    'generators',
    'scenarios',
    'views',
  ] as const) {
    if (document[key] === undefined) delete next[key];
  }
  return next;
}

/**
 * Everything but the target itself that the removal takes, in words for a confirmation, or an
 * empty string when it takes only the target. It reads on from "This also deletes".
 *
 * @example alsoRemoved(removal) // 'device FDR-DOCK; bus DOCK; switch TIE; scenario tie-closed'
 */
export function alsoRemoved(removal: Removal): string {
  const { kind, id } = removal.target;
  const others = (list: string[], own: boolean) => (own ? list.filter((other) => other !== id) : list);
  const parts: [string, string, string[]][] = [
    ['device', 'devices', others(removal.devices, kind === 'device')],
    ['transformer', 'transformers', others(removal.transformers, kind === 'transformer')],
    ['cable', 'cables', others(removal.cables, kind === 'cable')],
    ['bus', 'buses', others(removal.buses, kind === 'bus')],
    ['motor', 'motors', others(removal.motors, kind === 'motor')],
    ['generator', 'generators', removal.generators],
    ['switch', 'switches', removal.switches],
    ['sheet', 'sheets', removal.views],
    ['scenario', 'scenarios', removal.scenarios],
    ['entries naming them in scenario', 'entries naming them in scenarios', removal.trimmedScenarios],
  ];
  return parts
    .filter(([, , ids]) => ids.length > 0)
    .map(([one, many, ids]) => `${ids.length === 1 ? one : many} ${listed(ids)}`)
    .join('; ');
}

function listed(ids: string[]): string {
  if (ids.length <= 6) return ids.length === 1 ? ids[0] : `${ids.slice(0, -1).join(', ')} and ${ids.at(-1)}`;
  return `${ids.slice(0, 5).join(', ')} and ${ids.length - 5} more`;
}

/** The scenarios but those in `goneScenarios`, trimmed of what is `gone`; the same list when nothing changes. */
function keepScenarios<T extends ScenarioItem>(
  scenarios: T[] | undefined,
  goneScenarios: Set<unknown>,
  gone: Set<unknown>,
): T[] | undefined {
  const next = scenarios
    ?.filter((scenario) => !goneScenarios.has(scenario?.id))
    .map((scenario) => trimmedScenario(scenario, gone));
  return next?.length === scenarios?.length && next?.every((scenario, i) => scenario === scenarios?.[i])
    ? scenarios
    : next;
}

/** The buses at a switch's ends, whichever its kind. */
function endsOf(item: Item): unknown[] {
  return [item.from, item.to, item.normal, item.emergency].filter((end) => end !== undefined);
}

/**
 * What feeds each bus, by id: the branches to it, the transfer switches whose load bus it is, the
 * ties at either end of which it sits, the generators on it. A bus with none is left out.
 */
function feedersByBus(transformers: Item[], cables: Item[], switches: Item[], generators: Item[]) {
  const feeders = new Map<unknown, unknown[]>();
  const add = (bus: unknown, feeder: unknown) => {
    if (bus === undefined) return;
    const list = feeders.get(bus);
    if (list) list.push(feeder);
    else feeders.set(bus, [feeder]);
  };
  for (const branch of [...transformers, ...cables]) add(branch.to, branch.id);
  for (const item of switches) {
    add(item.to, item.id);
    if (item.kind !== 'transfer') add(item.from, item.id);
  }
  for (const generator of generators) add(generator.bus, generator.id);
  return feeders;
}

/** What becomes of one scenario: `next` is the scenario as it stays (itself when untouched), or `undefined` when it goes. */
interface ScenarioFate {
  scenario: ScenarioItem;
  next: ScenarioItem | undefined;
}

/**
 * What becomes of each scenario when `gone` goes. A scenario loses the entries naming what goes; it
 * goes itself when every source it names goes (it was about running on them), or when what is left
 * fixes no more than another scenario does, which would have the same system checked twice under
 * two names. A scenario the removal leaves untouched always stays.
 */
function scenarioFates(scenarios: ScenarioItem[], gone: Set<unknown>): ScenarioFate[] {
  const trims = scenarios.map((scenario) => ({ scenario, next: trimmedScenario(scenario, gone) }));
  const fixedByUntouched = new Set(trims.filter((t) => t.next === t.scenario).map((t) => whatItFixes(t.scenario)));
  const fixedByTrimmed = new Set<string>();
  return trims.map(({ scenario, next }) => {
    if (next === scenario) return { scenario, next };
    const sourcesAllGone = Array.isArray(scenario.sources) && scenario.sources.length > 0 && !next.sources;
    const fixes = whatItFixes(next);
    if (sourcesAllGone || fixedByUntouched.has(fixes) || fixedByTrimmed.has(fixes))
      return { scenario, next: undefined };
    fixedByTrimmed.add(fixes);
    return { scenario, next };
  });
}

/**
 * The scenario without the sources, switch positions and out-of-service branches in `gone`
 * (itself when it names none); a `sources` list left empty is left out.
 */
function trimmedScenario<T extends ScenarioItem>(scenario: T, gone: Set<unknown>): T {
  if (scenario === null || typeof scenario !== 'object') return scenario;
  const changes: ScenarioItem = {};
  if (Array.isArray(scenario.sources) && scenario.sources.some((id) => gone.has(id))) {
    changes.sources = scenario.sources.filter((id) => !gone.has(id));
  }
  const switches = scenario.switches;
  if (switches !== null && typeof switches === 'object' && Object.keys(switches).some((id) => gone.has(id))) {
    changes.switches = Object.fromEntries(Object.entries(switches).filter(([id]) => !gone.has(id)));
  }
  if (Array.isArray(scenario.outOfService) && scenario.outOfService.some((id) => gone.has(id))) {
    changes.outOfService = scenario.outOfService.filter((id) => !gone.has(id));
  }
  if (Object.keys(changes).length === 0) return scenario;
  const next = Object.assign({}, scenario, changes);
  if (Array.isArray(next.sources) && next.sources.length === 0) delete next.sources;
  return next;
}

/** What a scenario fixes (its sources, switch positions and out-of-service branches) as one comparable text. */
function whatItFixes(scenario: ScenarioItem): string {
  const sorted = (value: unknown) => (Array.isArray(value) ? value.map(String).sort() : []);
  const switches =
    scenario.switches !== null && typeof scenario.switches === 'object'
      ? Object.entries(scenario.switches).map(([id, position]) => `${id}=${String(position)}`)
      : [];
  return JSON.stringify([
    Array.isArray(scenario.sources) ? sorted(scenario.sources) : 'every source',
    switches.sort(),
    sorted(scenario.outOfService),
  ]);
}

function groupBy(items: Item[], keyOf: (item: Item) => unknown): Map<unknown, Item[]> {
  const groups = new Map<unknown, Item[]>();
  for (const item of items) {
    const group = groups.get(keyOf(item));
    if (group) group.push(item);
    else groups.set(keyOf(item), [item]);
  }
  return groups;
}

function listOf(document: StudyInput, key: string): Item[] {
  const list = (document as unknown as Record<string, unknown>)[key];
  return Array.isArray(list) ? list.filter((item): item is Item => item !== null && typeof item === 'object') : [];
}
