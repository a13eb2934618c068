// Reads back what our PDF writer puts in a file, for tests: the cross-reference table, each object's
// text and (inflated) stream, found through the offsets the table gives. Enough for files with a
// classic xref table and no object streams, which is what the writer makes; not a general PDF parser.
import { inflateSync } from 'node:zlib';

/** One indirect object: its text up to `stream` (or `endobj`), and its stream's bytes when it has one. */
export interface PdfObject {
  body: string;
  stream?: Buffer;
}

/** A parsed file: objects by number, the trailer's text, and the offsets the xref table gives. */
export interface PdfFile {
  objects: Map<number, PdfObject>;
  trailer: string;
  offsets: number[];
}

/** Parses a file by its xref table; throws when an offset does not point at "N 0 obj". */
export function readPdf(bytes: Uint8Array): PdfFile {
  const buffer = Buffer.from(bytes);
  const text = buffer.toString('latin1');
  const startxref = Number(/startxref\s+(\d+)\s+%%EOF\s*$/.exec(text)?.[1]);
  if (!text.startsWith('xref', startxref)) throw new Error(`startxref ${startxref} does not point at "xref"`);
  const [, first, count] = /^xref\n(\d+) (\d+)\n/.exec(text.slice(startxref))!.map(Number);
  const tableAt = text.indexOf('\n', text.indexOf('\n', startxref) + 1) + 1;
  const offsets: number[] = [];
  const objects = new Map<number, PdfObject>();
  for (let i = 0; i < count; i++) {
    const entry = text.slice(tableAt + 20 * i, tableAt + 20 * (i + 1));
    if (!/^\d{10} \d{5} [nf]\r\n$/.test(entry))
      throw new Error(`xref entry ${i} is not 20 bytes: ${JSON.stringify(entry)}`);
    if (entry[17] !== 'n') continue;
    const id = first + i;
    const offset = Number(entry.slice(0, 10));
    offsets[id] = offset;
    const head = `${id} 0 obj\n`;
    if (!text.startsWith(head, offset))
      throw new Error(`object ${id}: offset ${offset} does not point at "${id} 0 obj"`);
    const end = text.indexOf('endobj', offset);
    const streamAt = text.indexOf('stream\n', offset);
    if (streamAt >= 0 && streamAt < end) {
      const body = text.slice(offset + head.length, streamAt);
      const length = Number(/\/Length (\d+)/.exec(body)![1]);
      const raw = buffer.subarray(streamAt + 7, streamAt + 7 + length);
      objects.set(id, { body, stream: /\/FlateDecode/.test(body) ? inflateSync(raw) : raw });
    } else objects.set(id, { body: text.slice(offset + head.length, end) });
  }
  return { objects, trailer: text.slice(text.indexOf('trailer', startxref)), offsets };
}

/** The object a reference like `12 0 R` names. */
export function resolve(file: PdfFile, reference: string): PdfObject {
  const id = Number(/^\s*(\d+) 0 R/.exec(reference)?.[1]);
  const object = file.objects.get(id);
  if (!object) throw new Error(`no object for reference "${reference}"`);
  return object;
}

/** The pages in order (through the catalog's page tree), each with its content inflated as text. */
export function pagesOf(file: PdfFile): { body: string; content: string }[] {
  const root = resolve(file, /\/Root (\d+ 0 R)/.exec(file.trailer)![1]);
  const tree = resolve(file, /\/Pages (\d+ 0 R)/.exec(root.body)![1]);
  const kids = [.../\/Kids \[([^\]]*)\]/.exec(tree.body)![1].matchAll(/\d+ 0 R/g)].map((m) => resolve(file, m[0]));
  return kids.map((page) => ({
    body: page.body,
    content: resolve(file, /\/Contents (\d+ 0 R)/.exec(page.body)![1]).stream!.toString('latin1'),
  }));
}

/** A `/Key n 0 R` entry's object, looked up in a dictionary's text. */
export function entry(file: PdfFile, dictionary: string, key: string): PdfObject {
  const match = new RegExp(`/${key} (\\d+ 0 R)`).exec(dictionary);
  if (!match) throw new Error(`no /${key} reference in ${dictionary.slice(0, 80)}`);
  return resolve(file, match[1]);
}

/** A ToUnicode CMap's `<glyph><text>` pairs as glyph id → text. */
export function toUnicodeMapOf(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  for (const [, glyph, units] of cmap.matchAll(/<([0-9A-F]{4})><([0-9A-F]+)>/gi)) {
    const codes = units.match(/.{4}/g)!.map((unit) => Number.parseInt(unit, 16));
    map.set(Number.parseInt(glyph, 16), String.fromCharCode(...codes));
  }
  return map;
}

/** A /W array's widths as glyph id → width (the `c [w1 w2 …]` form). */
export function widthsOf(w: string): Map<number, number> {
  const widths = new Map<number, number>();
  for (const [, first, list] of w.matchAll(/(\d+) \[([^\]]*)\]/g)) {
    list
      .trim()
      .split(/\s+/)
      .forEach((width, i) => widths.set(Number(first) + i, Number(width)));
  }
  return widths;
}

/** The text runs a page draws, in order, each read back through its font's ToUnicode map. */
export function textRunsOf(file: PdfFile, page: { body: string; content: string }): string[] {
  const maps = new Map<string, Map<number, string>>();
  return [...page.content.matchAll(/\/(F\d+) [\d.]+ Tf[^<]*?<([0-9A-F]*)> Tj/g)].map(([, name, hex]) => {
    if (!maps.has(name)) {
      const font = entry(file, page.body, name);
      maps.set(name, toUnicodeMapOf(entry(file, font.body, 'ToUnicode').stream!.toString('latin1')));
    }
    const map = maps.get(name)!;
    return (hex.match(/.{4}/g) ?? []).map((glyph) => map.get(Number.parseInt(glyph, 16)) ?? '\ufffd').join('');
  });
}
