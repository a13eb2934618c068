import type { DocumentPath } from './documentPath.ts';

/** The kinds of item the System tree shows and the property editor edits. */
export type ItemKind =
  'source' | 'bus' | 'transformer' | 'cable' | 'switch' | 'generator' | 'motor' | 'device' | 'view';

/** What is selected: an item of the study by kind and id. */
export interface Selection {
  kind: ItemKind;
  id: string;
  /**
   * Where the item sits in its list, for an item its id may not name alone: one whose id is being
   * typed and is, for now, another item's too. The item there is the selection while it has that id.
   */
  at?: number;
}

/** The study document's list holding each kind (the source is a single object). */
export const COLLECTION_OF: Record<Exclude<ItemKind, 'source'>, string> = {
  bus: 'buses',
  transformer: 'transformers',
  cable: 'cables',
  switch: 'switches',
  generator: 'generators',
  motor: 'motors',
  device: 'devices',
  view: 'views',
};

/** A study document as far as selection needs it: lists of items with ids. */
type Lists = Record<string, unknown>;

/**
 * Where the selected item sits in the document, or `undefined` when it is not there (deleted, or
 * undone away): the item at `selection.at` when it has the selected id, else the first with it.
 *
 * @example pathOfSelection(document, { kind: 'device', id: 'MAIN' }) // ['devices', 0]
 * @example pathOfSelection(document, { kind: 'device', id: 'MAIN', at: 3 }) // ['devices', 3] while that one is called MAIN too
 */
export function pathOfSelection(document: unknown, selection: Selection | undefined): DocumentPath | undefined {
  if (!selection || document === null || typeof document !== 'object') return undefined;
  if (selection.kind === 'source') return ['source'];
  const list = (document as Lists)[COLLECTION_OF[selection.kind]];
  if (!Array.isArray(list)) return undefined;
  const collection = COLLECTION_OF[selection.kind];
  if (selection.at !== undefined && list[selection.at]?.id === selection.id) return [collection, selection.at];
  const index = list.findIndex((item) => item !== null && typeof item === 'object' && item.id === selection.id);
  return index < 0 ? undefined : [collection, index];
}

/**
 * The selection after `value` was typed into the id at `idPath` of the selected item: the item by its
 * new id once that is its own (`renamed`), else by its place in its list under the id as typed, so
 * the editor stays on it while the user types on.
 *
 * @example selectionAfterIdEdit({ kind: 'device', id: 'MAIN' }, ['devices', 1, 'id'], 'MAIN-2', true) // { kind: 'device', id: 'MAIN-2' }
 * @example selectionAfterIdEdit({ kind: 'device', id: 'MAIN' }, ['devices', 1, 'id'], 'MAIN 2', false) // { kind: 'device', id: 'MAIN 2', at: 1 }
 */
export function selectionAfterIdEdit(
  selection: Selection,
  idPath: DocumentPath,
  value: unknown,
  renamed: boolean,
): Selection {
  const id = typeof value === 'string' ? value : value === undefined || value === null ? '' : String(value);
  const at = idPath[1];
  return renamed || typeof at !== 'number' ? { kind: selection.kind, id } : { kind: selection.kind, id, at };
}

/**
 * The selection a document path points into (the item owning a field named by a problem).
 * @example selectionOfPath(document, ['devices', 0, 'rating']) // { kind: 'device', id: 'MAIN' }
 */
export function selectionOfPath(document: unknown, path: DocumentPath): Selection | undefined {
  if (document === null || typeof document !== 'object' || path.length === 0) return undefined;
  const [head, index] = path;
  if (head === 'source') {
    const id = (document as { source?: { id?: unknown } }).source?.id;
    return typeof id === 'string' ? { kind: 'source', id } : undefined;
  }
  const kind = (Object.keys(COLLECTION_OF) as (keyof typeof COLLECTION_OF)[]).find((k) => COLLECTION_OF[k] === head);
  const list = (document as Lists)[head as string];
  if (!kind || !Array.isArray(list) || typeof index !== 'number') return undefined;
  const id = list[index]?.id;
  return typeof id === 'string' ? { kind, id } : undefined;
}

/**
 * Parses a problem path (`study.devices[2].characteristic.pickup`) back into a document path.
 * @example parseProblemPath('study.devices[2].rating') // ['devices', 2, 'rating']
 */
export function parseProblemPath(text: string): DocumentPath {
  const path: (string | number)[] = [];
  for (const match of text.replace(/^study\.?/, '').matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    path.push(match[2] !== undefined ? Number(match[2]) : match[1]);
  }
  return path;
}
