/**
 * Reads what a PDF needs from a TrueType font (OpenType spec, chapters "cmap", "head", "hhea",
 * "hmtx", "maxp", "OS/2", "loca" and "glyf"): the glyph of each character, advance widths, the
 * metrics a font descriptor states, and the raw tables, for subsetting.
 */
export interface TrueTypeFont {
  /** The font's bytes. */
  bytes: Uint8Array;
  /** Font units per em (2048 for DejaVu Sans). */
  unitsPerEm: number;
  numGlyphs: number;
  /** In font units: ascender and descender (negative) from `hhea`, cap height from `OS/2` when it has one. */
  ascent: number;
  descent: number;
  capHeight: number;
  /** In font units: the union of all glyphs' boxes, `[xMin, yMin, xMax, yMax]`. */
  bbox: [number, number, number, number];
  /** Each table's offset and length in `bytes`, by tag. */
  tables: Map<string, { offset: number; length: number }>;
  /** The glyph id a Unicode code point maps to, 0 (.notdef) when the font has none. */
  glyphIdOf(codePoint: number): number;
  /** A glyph's advance width in font units. */
  advanceOf(glyphId: number): number;
}

/**
 * Reads a TrueType font's tables; a file that is not one is a one-line error naming `fonts`.
 * @example readTrueType(bytes).glyphIdOf(0x3a9) // DejaVu Sans's glyph for Ω
 */
export function readTrueType(bytes: Uint8Array): TrueTypeFont {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = bytes.length >= 12 ? view.getUint32(0) : 0;
  if (version !== 0x00010000 && version !== 0x74727565)
    throw new RangeError(`options.fonts: expected TrueType font bytes, got ${bytes.length} bytes of something else`);
  const tables = new Map<string, { offset: number; length: number }>();
  for (let i = 0; i < view.getUint16(4); i++) {
    const record = 12 + 16 * i;
    const tag = String.fromCharCode(...bytes.subarray(record, record + 4));
    tables.set(tag, { offset: view.getUint32(record + 8), length: view.getUint32(record + 12) });
  }
  const at = (tag: string) => {
    const table = tables.get(tag);
    if (!table) throw new RangeError(`options.fonts: expected a TrueType "${tag}" table, got none`);
    return table.offset;
  };
  const head = at('head');
  const hhea = at('hhea');
  const hmtx = at('hmtx');
  const numberOfHMetrics = view.getUint16(hhea + 34);
  const ascent = view.getInt16(hhea + 4);
  const os2 = tables.get('OS/2');
  const lookup = cmapLookup(view, at('cmap'));
  const cache = new Map<number, number>();
  return {
    bytes,
    unitsPerEm: view.getUint16(head + 18),
    numGlyphs: view.getUint16(at('maxp') + 4),
    ascent,
    descent: view.getInt16(hhea + 6),
    // sCapHeight arrived with OS/2 version 2; before it, 70 % of the ascent is the usual stand-in.
    capHeight: os2 && view.getUint16(os2.offset) >= 2 ? view.getInt16(os2.offset + 88) : Math.round(ascent * 0.7),
    bbox: [view.getInt16(head + 36), view.getInt16(head + 38), view.getInt16(head + 40), view.getInt16(head + 42)],
    tables,
    glyphIdOf(codePoint) {
      let glyph = cache.get(codePoint);
      if (glyph === undefined) cache.set(codePoint, (glyph = lookup(codePoint)));
      return glyph;
    },
    advanceOf(glyphId) {
      return view.getUint16(hmtx + 4 * Math.min(glyphId, numberOfHMetrics - 1));
    },
  };
}

// Accepts the font and its cmap's offset; a lookup from code point to glyph id through the best Unicode
// subtable: format 12 (all planes) when there is one, else format 4 (the Basic Multilingual Plane).
function cmapLookup(view: DataView, cmap: number): (codePoint: number) => number {
  let format4 = -1;
  let format12 = -1;
  for (let i = 0; i < view.getUint16(cmap + 2); i++) {
    const record = cmap + 4 + 8 * i;
    const [platform, encoding] = [view.getUint16(record), view.getUint16(record + 2)];
    const table = cmap + view.getUint32(record + 4);
    const unicode = platform === 0 || (platform === 3 && (encoding === 1 || encoding === 10));
    if (!unicode) continue;
    const format = view.getUint16(table);
    if (format === 12 && format12 < 0) format12 = table;
    if (format === 4 && format4 < 0) format4 = table;
  }
  if (format12 >= 0) return (code) => format12Glyph(view, format12, code);
  if (format4 >= 0) return (code) => format4Glyph(view, format4, code);
  throw new RangeError('options.fonts: expected a Unicode cmap of format 4 or 12, got none');
}

// Accepts a format 4 subtable and a code point; its glyph id (segments of BMP codes with a delta or an index array).
function format4Glyph(view: DataView, table: number, code: number): number {
  if (code > 0xffff) return 0;
  const segments = view.getUint16(table + 6) / 2;
  const ends = table + 14;
  const starts = ends + 2 * segments + 2;
  const deltas = starts + 2 * segments;
  const rangeOffsets = deltas + 2 * segments;
  // End codes are sorted: binary search for the first segment ending at or after the code.
  let [low, high] = [0, segments - 1];
  while (low < high) {
    const middle = (low + high) >> 1;
    if (view.getUint16(ends + 2 * middle) < code) low = middle + 1;
    else high = middle;
  }
  const start = view.getUint16(starts + 2 * low);
  if (code < start || code > view.getUint16(ends + 2 * low)) return 0;
  const delta = view.getUint16(deltas + 2 * low);
  const rangeOffset = view.getUint16(rangeOffsets + 2 * low);
  if (rangeOffset === 0) return (code + delta) & 0xffff;
  const glyph = view.getUint16(rangeOffsets + 2 * low + rangeOffset + 2 * (code - start));
  return glyph === 0 ? 0 : (glyph + delta) & 0xffff;
}

// Accepts a format 12 subtable and a code point; its glyph id (sorted groups of sequential codes).
function format12Glyph(view: DataView, table: number, code: number): number {
  const groups = view.getUint32(table + 12);
  let [low, high] = [0, groups - 1];
  while (low <= high) {
    const middle = (low + high) >> 1;
    const group = table + 16 + 12 * middle;
    if (code < view.getUint32(group)) high = middle - 1;
    else if (code > view.getUint32(group + 4)) low = middle + 1;
    else return view.getUint32(group + 8) + (code - view.getUint32(group));
  }
  return 0;
}
