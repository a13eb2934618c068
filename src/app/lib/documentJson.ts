/** The JSON text of each object already written as an item of a document's top-level list. */
const itemTexts = new WeakMap<object, string>();

/**
 * `JSON.stringify(document)`, the very same text, writing each object in the document's top-level
 * lists (devices, buses, views…) only the first time it is met. The editor copies a document only
 * along the edited path and never changes an object in place, so an item an edit left alone is the
 * same object with the same text: keeping a 2,000-device study after an edit writes one device.
 *
 * @example documentJsonOf(document) === JSON.stringify(document) // true
 */
export function documentJsonOf(document: unknown): string {
  if (!isPlainRecord(document)) return JSON.stringify(document);
  const parts: string[] = [];
  for (const key of Object.keys(document)) {
    const value = document[key];
    const text = Array.isArray(value) ? `[${value.map(itemTextOf).join(',')}]` : JSON.stringify(value);
    // A field JSON leaves out (undefined, a function) is left out here too.
    if (text !== undefined) parts.push(`${JSON.stringify(key)}:${text}`);
  }
  return `{${parts.join(',')}}`;
}

// Accepts any list item; its text as an item of a JSON array (null for what JSON cannot write).
function itemTextOf(item: unknown): string {
  if (item === null || typeof item !== 'object') return JSON.stringify(item) ?? 'null';
  let text = itemTexts.get(item);
  if (text === undefined) {
    text = JSON.stringify(item) ?? 'null';
    itemTexts.set(item, text);
  }
  return text;
}

// Accepts any value; true for an object JSON writes field by field (no array, no toJSON).
function isPlainRecord(value: unknown): value is Record<string, unknown> {
  return (
    value !== null &&
    typeof value === 'object' &&
    !Array.isArray(value) &&
    typeof (value as { toJSON?: unknown }).toJSON !== 'function'
  );
}
