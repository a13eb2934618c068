import type { StudyInput } from '../../engine/study/index.ts';
import type { Selection } from './selection.ts';

/** The kinds of item that can be deleted from the tree (the source and views are not). */
export type RemovableKind = 'bus' | 'transformer' | 'cable' | 'motor' | 'device';

/**
 * Everything deleting one item takes with it, by kind, in document order: the item, the device
 * feeding it, and for a bus or a branch everything below (branches, buses, motors and their devices).
 * Views left with no device go too; references from other views and from per-pair margins are
 * dropped when the documents are rewritten by {@link withoutRemoval}.
 */
export interface Removal {
  target: { kind: RemovableKind; id: string };
  buses: string[];
  transformers: string[];
  cables: string[];
  motors: string[];
  devices: string[];
  /** Views that would be left with no device. */
  views: string[];
}

/** A list item as far as removal needs it (the document may be mid-edit, so nothing is trusted). */
type Item = { id?: unknown; from?: unknown; to?: unknown; bus?: unknown; feeds?: unknown; devices?: unknown };

/**
 * What deleting `selection` removes, worked out on the document as written (it may have problems).
 * `undefined` for what cannot be deleted this way: the source, the bus the source feeds, a view, or
 * an item not in the document.
 *
 * @example removalOf(document, { kind: 'cable', id: 'C-MCC' }) // { cables: ['C-MCC'], buses: ['MCC'], motors: ['M1', …], devices: ['FDR-MCC', …], … }
 */
export function removalOf(document: StudyInput, selection: Selection): Removal | undefined {
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
  // Everything below, bus by bus (a walk with its own stack: no depth limit, and a loop in a
  // mid-edit document is visited once).
  const branchesFrom = groupBy([...transformers, ...cables], (branch) => branch.from);
  const motorsOn = groupBy(motors, (motor) => motor.bus);
  const visited = new Set<unknown>();
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
  for (const device of devices) if (removed.has(device.feeds)) removed.add(device.id);

  const idsIn = (list: Item[]) => list.filter((item) => removed.has(item.id)).map((item) => String(item.id));
  const goneDevices = new Set(idsIn(devices));
  const views = listOf(document, 'views')
    .filter((view) => Array.isArray(view.devices) && view.devices.every((id) => goneDevices.has(id)))
    .map((view) => String(view.id));
  return {
    target: { kind, id: selection.id },
    buses: idsIn(buses),
    transformers: idsIn(transformers),
    cables: idsIn(cables),
    motors: idsIn(motors),
    devices: [...goneDevices],
    views,
  };
}

/**
 * The document without what `removal` lists: the items, their places on views (devices, fault
 * buses, withstand and starting curves), views left with no device, and per-pair margins naming a
 * removed device. Everything else is shared with the original.
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
  ]);
  const goneViews = new Set(removal.views);
  const keep = <T>(list: T[] | undefined): T[] | undefined =>
    list?.filter((item) => !gone.has((item as Item | undefined)?.id));
  const keepIds = <T>(ids: T[] | undefined): T[] | undefined => ids?.filter((id) => !gone.has(id));
  const next: StudyInput = {
    ...document,
    buses: keep(document.buses) ?? [],
    transformers: keep(document.transformers),
    cables: keep(document.cables),
    motors: keep(document.motors),
    devices: keep(document.devices),
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
  for (const key of ['transformers', 'cables', 'motors', 'devices', 'views'] as const) {
    if (document[key] === undefined) delete next[key];
  }
  return next;
}

/**
 * Everything but the target itself that the removal takes, in words for a confirmation, or an
 * empty string when it takes only the target.
 *
 * @example alsoRemoved(removal) // 'device FDR-MCC, bus MCC, motors M1 and M2, device OL-M1, sheet V3'
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
    ['sheet', 'sheets', removal.views],
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
