import type { PdfFont } from './pdfFont.ts';
import { hex4, pdfNumber } from './pdfSyntax.ts';
import { toUnicodeCMap } from './toUnicodeCMap.ts';
import { readTrueType } from './trueType.ts';
import { subsetTrueType } from './trueTypeSubset.ts';

/** Options of {@link createEmbeddedFont}. */
export interface EmbeddedFontOptions {
  /** The name in a page's `/Font` resources. */
  name: string;
  /** PostScript name the file gives the face, e.g. `DejaVuSans-Bold`. */
  postScriptName: string;
  bold?: boolean;
}

/**
 * A TrueType face embedded as a composite font (ISO 32000-1 §9.7): Type0 with `Identity-H` encoding
 * over a CIDFontType2 whose CIDs are the font's glyph ids, looked up in its cmap. The file carries a
 * subset of the face (the glyphs used, under a subset tag), a `/W` array of their advance widths from
 * `hmtx`, and a ToUnicode CMap so the text copies out as written. Text is composed first (Unicode
 * NFC): glyphs are placed one by one, without shaping, so a letter typed as a base and a combining
 * accent prints as the face's accented letter. A character the face lacks prints as its .notdef box.
 * @example createEmbeddedFont(dejaVuSans, { name: 'F1', postScriptName: 'DejaVuSans' }).encode('A').operand // "<0024>"
 */
export function createEmbeddedFont(bytes: Uint8Array, options: EmbeddedFontOptions): PdfFont {
  const font = readTrueType(bytes);
  const { unitsPerEm } = font;
  // Glyph space is 1000 units per em; widths are kept to 0.01 unit so /W and the measured text agree.
  // Each glyph's width and code are worked out once: a large report writes millions of glyphs of a few
  // hundred kinds.
  const widths = new Map<number, number>();
  const codes = new Map<number, string>();
  const widthOf = (glyph: number) => {
    let width = widths.get(glyph);
    if (width === undefined)
      widths.set(glyph, (width = Number(((font.advanceOf(glyph) * 1000) / unitsPerEm).toFixed(2))));
    return width;
  };
  const codeOf = (glyph: number) => {
    let code = codes.get(glyph);
    if (code === undefined) codes.set(glyph, (code = hex4(glyph)));
    return code;
  };
  const scaled = (units: number) => Math.round((units * 1000) / unitsPerEm);
  const used = new Map<number, string>();
  let id: number | undefined;
  return {
    name: options.name,
    encode(text) {
      let operand = '<';
      let advance = 0;
      for (const char of text.normalize('NFC')) {
        const glyph = font.glyphIdOf(char.codePointAt(0)!);
        if (glyph !== 0 && !used.has(glyph)) used.set(glyph, char);
        operand += codeOf(glyph);
        advance += widthOf(glyph) / 1000;
      }
      return { operand: `${operand}>`, advance };
    },
    reference(writer) {
      id ??= writer.reserve();
      return id;
    },
    write(writer) {
      if (id === undefined) return;
      const [cid, descriptor, file, toUnicode] = [
        writer.reserve(),
        writer.reserve(),
        writer.reserve(),
        writer.reserve(),
      ];
      const baseFont = `${subsetTagOf(used)}+${options.postScriptName}`;
      writer.object(
        id,
        `<< /Type /Font /Subtype /Type0 /BaseFont /${baseFont} /Encoding /Identity-H /DescendantFonts [${cid} 0 R] /ToUnicode ${toUnicode} 0 R >>`,
      );
      writer.object(
        cid,
        `<< /Type /Font /Subtype /CIDFontType2 /BaseFont /${baseFont} /CIDSystemInfo << /Registry (Adobe) /Ordering (Identity) /Supplement 0 >> /FontDescriptor ${descriptor} 0 R /CIDToGIDMap /Identity /DW ${widthOf(0)} /W ${widthsArray([...used.keys()], widthOf)} >>`,
      );
      const bbox = font.bbox.map(scaled).join(' ');
      // Flags 32: a nonsymbolic face (Latin text in the standard character set and more).
      writer.object(
        descriptor,
        `<< /Type /FontDescriptor /FontName /${baseFont} /Flags 32 /FontBBox [${bbox}] /ItalicAngle 0 /Ascent ${scaled(font.ascent)} /Descent ${scaled(font.descent)} /CapHeight ${scaled(font.capHeight)} /StemV ${options.bold ? 140 : 80} /FontWeight ${options.bold ? 700 : 400} /FontFile2 ${file} 0 R >>`,
      );
      const program = subsetTrueType(font, new Set(used.keys()));
      writer.stream(file, program, `/Length1 ${program.length}`);
      writer.stream(toUnicode, toUnicodeCMap(used));
    },
  };
}

// Accepts the glyph ids used and their widths; a /W array, one run of widths per stretch of consecutive ids.
function widthsArray(glyphs: number[], widthOf: (glyph: number) => number): string {
  const sorted = glyphs.sort((a, b) => a - b);
  const runs: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    runs.push(
      `${sorted[i]} [${sorted
        .slice(i, j + 1)
        .map((g) => pdfNumber(widthOf(g), 2))
        .join(' ')}]`,
    );
    i = j + 1;
  }
  return `[${runs.join(' ')}]`;
}

// Accepts the glyphs used; six capital letters naming the subset (§9.6.4), the same for the same glyphs.
function subsetTagOf(used: ReadonlyMap<number, string>): string {
  let hash = 0x811c9dc5;
  for (const glyph of [...used.keys()].sort((a, b) => a - b)) hash = Math.imul(hash ^ glyph, 16777619) >>> 0;
  let tag = '';
  for (let i = 0; i < 6; i++, hash = Math.floor(hash / 26)) tag += String.fromCharCode(65 + (hash % 26));
  return tag;
}
