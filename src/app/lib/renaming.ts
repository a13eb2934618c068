import { idField } from '../../engine/study/fields.ts';
import type { StudyInput } from '../../engine/study/index.ts';
import { valueAt, withValueAt, type DocumentPath } from './documentPath.ts';

/**
 * Every place a study document names an element (the source, a generator, switch, bus, transformer,
 * cable, motor or device) by its id, the element's own `id` included: `[]` stands for each item of a
 * list, `{}` for each key of a record. Views and scenarios have ids of their own namespaces, which
 * nothing in the document refers to, so they are not here. A test holds this list to every id field
 * of the study schema.
 *
 * @example ELEMENT_ID_PLACES.includes('scenarios[].outOfService[]') // true
 */
export const ELEMENT_ID_PLACES = [
  'source.id',
  'source.bus',
  'generators[].id',
  'generators[].bus',
  'switches[].id',
  'switches[].from',
  'switches[].to',
  'switches[].normal',
  'switches[].emergency',
  'scenarios[].sources[]',
  'scenarios[].switches{}',
  'scenarios[].outOfService[]',
  'buses[].id',
  'transformers[].id',
  'transformers[].from',
  'transformers[].to',
  'cables[].id',
  'cables[].from',
  'cables[].to',
  'motors[].id',
  'motors[].bus',
  'devices[].id',
  'devices[].feeds',
  'views[].devices[]',
  'views[].faults[]',
  'views[].withstand[]',
  'views[].motors[]',
  'coordination.pairs[].upstream',
  'coordination.pairs[].downstream',
] as const;

/** The lists whose items are elements, sharing one namespace of ids with the source. */
const ELEMENT_LISTS = new Set(['generators', 'switches', 'buses', 'transformers', 'cables', 'motors', 'devices']);

/** Lists whose items have ids of their own namespace (a view may share an id with a device). */
const OWN_NAMESPACE_LISTS = new Set(['views', 'scenarios']);

const EACH = Symbol('each item');
const KEYS = Symbol('each key');
type Step = string | typeof EACH | typeof KEYS;

/** The places as steps, read once: `'views[].devices[]'` is `['views', EACH, 'devices', EACH]`. */
const PLACE_STEPS: Step[][] = ELEMENT_ID_PLACES.map((place) =>
  place.split('.').flatMap((part): Step[] => {
    if (part.endsWith('[]')) return [part.slice(0, -2), EACH];
    if (part.endsWith('{}')) return [part.slice(0, -2), KEYS];
    return [part];
  }),
);

/**
 * The document with the element `oldId` called `newId` wherever it is named (see
 * `ELEMENT_ID_PLACES`): its own id, branches' and switches' ends, devices' `feeds`, motors' and
 * generators' buses, scenarios' sources, switch positions and out-of-service lists, views' lists
 * and per-pair margins. A view or scenario that happens to share the id keeps its own. Everything
 * untouched is shared with the original (the undo history keeps whole documents).
 *
 * @example withIdRenamed(document, 'MAIN', 'MAIN-2').views[0].devices // ['R-T1', 'MAIN-2', …]
 */
export function withIdRenamed(document: StudyInput, oldId: string, newId: string): StudyInput {
  if (oldId === newId) return document;
  const rename = (id: unknown) => (id === oldId ? newId : id);
  let next: unknown = document;
  for (const steps of PLACE_STEPS) next = rewritten(next, steps, 0, rename);
  return next as StudyInput;
}

/** What typing an id into the editor does (see {@link idEditOf}). */
export interface IdEdit {
  /** The document after the edit. */
  document: StudyInput;
  /**
   * True when the value is a well-formed id no other item of its namespace holds: the item now goes
   * by it, and (for an element) so does every reference that named it.
   */
  renamed: boolean;
  /** The id the rest of the document named the item by before the edit (a sheet shown, a scenario chosen). */
  wasKnownAs: string | undefined;
  /** The id the rest of the document names the item by after the edit. */
  knownAs: string | undefined;
}

/**
 * Writes `value` into the id at `path` (`['devices', 1, 'id']`, `['source', 'id']`, a view's or a
 * scenario's id), or `undefined` for any other path. A well-formed id that no other item of the same
 * namespace holds renames the item, and for an element every reference to it too (one document, so
 * one undo step). Anything else (a half-typed "MAIN 2", an id another element has) is written as
 * typed and renames nothing, so the problems bar says what is wrong and the references still name
 * the item by `knownAs`: the id they used before the edit, or the one a previous such edit left
 * them with, so that typing on to a good id renames them from there.
 *
 * @example idEditOf(document, ['devices', 1, 'id'], 'MAIN-2')?.renamed // true
 * @example idEditOf(document, ['devices', 1, 'id'], 'R-T1')?.renamed // false: R-T1 is another device's
 */
export function idEditOf(
  document: StudyInput,
  path: DocumentPath,
  value: unknown,
  knownAs?: string,
): IdEdit | undefined {
  const namespace = namespaceOf(path);
  if (!namespace) return undefined;
  const current = valueAt(document, path);
  const before = knownAs ?? (isId(current) ? current : undefined);
  const othersHold = (id: string) => idsOf(document, namespace, path).has(id);
  if (!isId(value) || othersHold(value)) {
    return { document: withValueAt(document, path, value), renamed: false, wasKnownAs: before, knownAs: before };
  }
  // References to an id another element also holds may be that one's: they stay as they are.
  const cascade = namespace === 'elements' && before !== undefined && !othersHold(before);
  const renamed = cascade ? withIdRenamed(document, before, value) : document;
  const next = valueAt(renamed, path) === value ? renamed : withValueAt(renamed, path, value);
  return { document: next, renamed: true, wasKnownAs: before, knownAs: value };
}

/**
 * Whether `value` is a well-formed id (the study schema's `idField`).
 * @example isId('C-DOCK') // true
 * @example isId('MAIN 2') // false
 */
export function isId(value: unknown): value is string {
  return typeof value === 'string' && idField.safeParse(value).success;
}

/** Which namespace the id at `path` belongs to, or `undefined` when `path` is not an item's id. */
function namespaceOf(path: DocumentPath): string | undefined {
  if (path.length === 2 && path[0] === 'source' && path[1] === 'id') return 'elements';
  if (path.length !== 3 || typeof path[1] !== 'number' || path[2] !== 'id') return undefined;
  const list = String(path[0]);
  if (ELEMENT_LISTS.has(list)) return 'elements';
  return OWN_NAMESPACE_LISTS.has(list) ? list : undefined;
}

/** The ids the items of `namespace` hold, leaving out the item whose id is at `path`. */
function idsOf(document: StudyInput, namespace: string, path: DocumentPath): Set<unknown> {
  const ids = new Set<unknown>();
  const lists = namespace === 'elements' ? [...ELEMENT_LISTS] : [namespace];
  const source = (document as { source?: { id?: unknown } }).source;
  if (namespace === 'elements' && path[0] !== 'source') ids.add(source?.id);
  for (const list of lists) {
    const items = valueAt(document, [list]);
    if (!Array.isArray(items)) continue;
    items.forEach((item, index) => {
      if (list === path[0] && index === path[1]) return;
      if (item !== null && typeof item === 'object') ids.add((item as { id?: unknown }).id);
    });
  }
  return ids;
}

/**
 * `node` with `rename` applied at the end of `steps` (from `at`), copied only along the way to what
 * changed. The document may be mid-edit, so anything of an unexpected shape is left as it is.
 */
function rewritten(node: unknown, steps: Step[], at: number, rename: (id: unknown) => unknown): unknown {
  if (at === steps.length) return rename(node);
  const step = steps[at];
  if (step === EACH) {
    if (!Array.isArray(node)) return node;
    let copy: unknown[] | undefined;
    node.forEach((item, index) => {
      const next = rewritten(item, steps, at + 1, rename);
      if (next === item) return;
      copy ??= node.slice();
      copy[index] = next;
    });
    return copy ?? node;
  }
  if (node === null || typeof node !== 'object' || Array.isArray(node)) return node;
  const record = node as Record<string, unknown>;
  if (step === KEYS) {
    const keys = Object.keys(record);
    if (!keys.some((key) => rename(key) !== key)) return node;
    // Rebuilt in the same order, so a renamed switch keeps its place in the scenario.
    return Object.fromEntries(keys.map((key) => [rename(key), record[key]]));
  }
  if (!(step in record)) return node;
  const child = record[step];
  const next = rewritten(child, steps, at + 1, rename);
  return next === child ? node : { ...record, [step]: next };
}

/**
 * The id an item goes by after an undo or a redo: `id` while `list` of `after` still holds it; else the
 * id at the place it held in `before`, when the step kept the list's length (undoing or redoing a
 * rename, not an addition or a deletion); else `undefined`.
 *
 * @example idAfterStep(renamed, original, 'devices', 'MAIN-2') // 'MAIN': the rename undone
 */
export function idAfterStep(before: StudyInput, after: StudyInput, list: string, id: string): string | undefined {
  const [was, now] = [valueAt(before, [list]), valueAt(after, [list])];
  if (!Array.isArray(was) || !Array.isArray(now)) return undefined;
  const idAt = (items: unknown[], index: number) => (items[index] as { id?: unknown } | null | undefined)?.id;
  if (now.some((_, index) => idAt(now, index) === id)) return id;
  const at = was.findIndex((_, index) => idAt(was, index) === id);
  const renamed = at >= 0 && was.length === now.length ? idAt(now, at) : undefined;
  return typeof renamed === 'string' ? renamed : undefined;
}
