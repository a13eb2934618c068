import type { TrueTypeFont } from './trueType.ts';

/** The tables a PDF's embedded TrueType program keeps (ISO 32000-1 §9.9: glyf, head, hhea, hmtx, loca, maxp, cvt, fpgm, prep), with OS/2. */
const KEPT_TABLES = ['OS/2', 'cvt ', 'fpgm', 'glyf', 'head', 'hhea', 'hmtx', 'loca', 'maxp', 'prep'];

/**
 * A copy of the font that draws only `glyphIds` (and the glyphs they are built from): every other
 * glyph's outline is emptied but keeps its id, so the PDF's glyph ids and widths stay those of the
 * full font. Tables a PDF does not read (names, layout, kerning, cmap) are left out; checksums are
 * recomputed. Deterministic.
 * @example subsetTrueType(readTrueType(bytes), new Set([0, 36])).length < bytes.length // true
 */
export function subsetTrueType(font: TrueTypeFont, glyphIds: ReadonlySet<number>): Uint8Array {
  const { bytes, numGlyphs } = font;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const head = font.tables.get('head')!.offset;
  const glyf = font.tables.get('glyf')!.offset;
  const loca = font.tables.get('loca')!.offset;
  const longLoca = view.getInt16(head + 50) === 1;
  const glyphStart = (g: number) => (longLoca ? view.getUint32(loca + 4 * g) : 2 * view.getUint16(loca + 2 * g));

  // Stage 1: the glyphs to keep: .notdef, those asked for, and the components of composite glyphs.
  const keep = new Set<number>();
  const pending = [0, ...glyphIds].filter((g) => g >= 0 && g < numGlyphs);
  while (pending.length > 0) {
    const g = pending.pop()!;
    if (keep.has(g)) continue;
    keep.add(g);
    for (const part of componentsOf(view, glyf + glyphStart(g), glyphStart(g + 1) - glyphStart(g)))
      if (!keep.has(part) && part < numGlyphs) pending.push(part);
  }

  // Stage 2: new glyf and loca tables (long offsets, each outline padded to four bytes).
  const sizes = Array.from({ length: numGlyphs }, (_, g) =>
    keep.has(g) ? (glyphStart(g + 1) - glyphStart(g) + 3) & ~3 : 0,
  );
  const newGlyf = new Uint8Array(sizes.reduce((a, b) => a + b, 0));
  const newLoca = new Uint8Array(4 * (numGlyphs + 1));
  const locaView = new DataView(newLoca.buffer);
  let at = 0;
  for (let g = 0; g < numGlyphs; g++) {
    locaView.setUint32(4 * g, at);
    if (sizes[g] > 0) newGlyf.set(bytes.subarray(glyf + glyphStart(g), glyf + glyphStart(g + 1)), at);
    at += sizes[g];
  }
  locaView.setUint32(4 * numGlyphs, at);

  // Stage 3: the kept tables, head marked for long offsets and its checksum adjustment cleared until the end.
  const tables = new Map<string, Uint8Array>();
  for (const tag of KEPT_TABLES) {
    const table = font.tables.get(tag);
    if (tag === 'glyf') tables.set(tag, newGlyf);
    else if (tag === 'loca') tables.set(tag, newLoca);
    // A copy: a Node Buffer's slice would share (and let us write into) the caller's bytes.
    else if (table) tables.set(tag, new Uint8Array(bytes.subarray(table.offset, table.offset + table.length)));
  }
  const newHead = new DataView(tables.get('head')!.buffer);
  newHead.setUint32(8, 0);
  newHead.setInt16(50, 1);
  return assembleFont(tables);
}

// Accepts a glyph's outline; the glyph ids a composite glyph is made of (none for a simple glyph).
function componentsOf(view: DataView, offset: number, length: number): number[] {
  if (length <= 0 || view.getInt16(offset) >= 0) return [];
  const parts: number[] = [];
  let at = offset + 10;
  for (;;) {
    const flags = view.getUint16(at);
    parts.push(view.getUint16(at + 2));
    // Arguments are words or bytes; then an optional scale, x/y scale or 2×2 matrix (glyf chapter).
    at += 4 + (flags & 0x0001 ? 4 : 2) + (flags & 0x0008 ? 2 : flags & 0x0040 ? 4 : flags & 0x0080 ? 8 : 0);
    if (!(flags & 0x0020)) return parts;
  }
}

// Accepts tables by tag; a TrueType file of them in tag order, with the table directory and checksums.
function assembleFont(tables: Map<string, Uint8Array>): Uint8Array {
  const tags = [...tables.keys()].sort();
  const n = tags.length;
  const directory = 12 + 16 * n;
  const padded = tags.map((tag) => (tables.get(tag)!.length + 3) & ~3);
  const out = new Uint8Array(directory + padded.reduce((a, b) => a + b, 0));
  const view = new DataView(out.buffer);
  const entrySelector = Math.floor(Math.log2(n));
  view.setUint32(0, 0x00010000);
  view.setUint16(4, n);
  view.setUint16(6, 16 * 2 ** entrySelector);
  view.setUint16(8, entrySelector);
  view.setUint16(10, 16 * n - 16 * 2 ** entrySelector);
  let at = directory;
  let headAt = 0;
  tags.forEach((tag, i) => {
    const table = tables.get(tag)!;
    out.set(table, at);
    const record = 12 + 16 * i;
    for (let k = 0; k < 4; k++) view.setUint8(record + k, tag.charCodeAt(k));
    view.setUint32(record + 4, checksumOf(view, at, padded[i]));
    view.setUint32(record + 8, at);
    view.setUint32(record + 12, table.length);
    if (tag === 'head') headAt = at;
    at += padded[i];
  });
  // The whole font's checksum, subtracted from a fixed number, goes in head (head chapter).
  view.setUint32(headAt + 8, (0xb1b0afba - checksumOf(view, 0, out.length)) >>> 0);
  return out;
}

// Accepts a span of whole 32-bit words; their sum modulo 2³².
function checksumOf(view: DataView, offset: number, length: number): number {
  let sum = 0;
  for (let i = offset; i < offset + length; i += 4) sum = (sum + view.getUint32(i)) >>> 0;
  return sum;
}
