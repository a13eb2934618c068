import { formatIssuePath } from '../../engine/study/issueMessage.ts';

/**
 * A location inside a study document (the file form the user edits): object keys and array
 * indexes from the top, e.g. `['devices', 2, 'characteristic', 'pickup']`.
 */
export type DocumentPath = readonly (string | number)[];

/**
 * Reads the value at `path`, or `undefined` where the path leads nowhere.
 * @example valueAt({ buses: [{ id: 'MV' }] }, ['buses', 0, 'id']) // 'MV'
 */
export function valueAt(document: unknown, path: DocumentPath): unknown {
  let node = document;
  for (const key of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string | number, unknown>)[key];
  }
  return node;
}

/**
 * Returns a copy of `document` with `value` at `path`, sharing every untouched branch (so an undo
 * history of whole documents stays small). A `value` of `undefined` removes an object key. Missing
 * objects along the path are created.
 *
 * @example withValueAt({ a: { b: 1 } }, ['a', 'b'], 2) // { a: { b: 2 } }
 */
export function withValueAt<T>(document: T, path: DocumentPath, value: unknown): T {
  return setAt(document, path, value, path.length) as T;
}

// Accepts any node; `depth` is how many keys of `path` are still to walk (for the error's path).
function setAt(node: unknown, path: DocumentPath, value: unknown, depth: number): unknown {
  if (depth === 0) return value;
  const key = path[path.length - depth];
  if (Array.isArray(node)) {
    if (typeof key !== 'number' || key < 0 || key > node.length) {
      throw new RangeError(`${formatDocumentPath(path)}: expected an index from 0 to ${node.length}, got "${key}"`);
    }
    const copy = node.slice();
    copy[key] = setAt(node[key], path, value, depth - 1);
    return copy;
  }
  const record = node !== null && typeof node === 'object' ? (node as Record<string, unknown>) : {};
  const child = setAt(record[key], path, value, depth - 1);
  const copy: Record<string, unknown> = { ...record };
  if (child === undefined) delete copy[key];
  else copy[key] = child;
  return copy;
}

/**
 * Returns a copy with the array item at `path` removed.
 * @example withoutItemAt({ views: [1, 2] }, ['views', 0]) // { views: [2] }
 */
export function withoutItemAt<T>(document: T, path: DocumentPath): T {
  const index = path[path.length - 1];
  const parent = valueAt(document, path.slice(0, -1));
  if (!Array.isArray(parent) || typeof index !== 'number') {
    throw new RangeError(`${formatDocumentPath(path)}: expected an item of a list, got ${JSON.stringify(parent)}`);
  }
  return withValueAt(
    document,
    path.slice(0, -1),
    parent.filter((_, i) => i !== index),
  );
}

/**
 * Returns a copy with `item` appended to the array at `path` (created when missing).
 * @example withItemAdded({}, ['views'], { id: 'V1' }) // { views: [{ id: 'V1' }] }
 */
export function withItemAdded<T>(document: T, path: DocumentPath, item: unknown): T {
  const list = valueAt(document, path);
  return withValueAt(document, path, [...(Array.isArray(list) ? list : []), item]);
}

/**
 * The path as the study's problems name it: `study.devices[2].characteristic.pickup`, a key that is not
 * a plain name quoted (`study.coordination.margins["relay/fuse"]`), by the reader's own formatter.
 * @example formatDocumentPath(['devices', 2, 'rating']) // 'study.devices[2].rating'
 */
export function formatDocumentPath(path: DocumentPath): string {
  return formatIssuePath('study', path);
}
