/**
 * Text measurement without a DOM: advance widths of DejaVu Sans (the face the sheet names first and
 * the PNG and PDF exports embed), so label boxes, the legend and wrapping are laid out the same in
 * Node, a Worker and the browser. Widths are in font units of a 2048-unit em, read from the
 * DejaVu Sans 2.37 `hmtx` table; printable ASCII by code, a few engineering symbols by name.
 */

/** Font units per em of DejaVu Sans. */
const UNITS_PER_EM = 2048;

// Printable ASCII 32–126, DejaVu Sans Book.
const REGULAR = [
  651, 821, 942, 1716, 1303, 1946, 1597, 563, 799, 799, 1024, 1716, 651, 739, 651, 690, 1303, 1303, 1303, 1303, 1303,
  1303, 1303, 1303, 1303, 1303, 690, 690, 1716, 1716, 1716, 1087, 2048, 1401, 1405, 1430, 1577, 1294, 1178, 1587, 1540,
  604, 604, 1343, 1141, 1767, 1532, 1612, 1235, 1612, 1423, 1300, 1251, 1499, 1401, 2025, 1403, 1251, 1403, 799, 690,
  799, 1716, 1024, 1024, 1255, 1300, 1126, 1300, 1260, 721, 1300, 1298, 569, 569, 1186, 569, 1995, 1298, 1253, 1300,
  1300, 842, 1067, 803, 1298, 1212, 1675, 1212, 1212, 1075, 1303, 690, 1303, 1716,
];

// Printable ASCII 32–126, DejaVu Sans Bold.
const BOLD = [
  713, 934, 1067, 1716, 1425, 2052, 1786, 627, 936, 936, 1071, 1716, 778, 850, 778, 748, 1425, 1425, 1425, 1425, 1425,
  1425, 1425, 1425, 1425, 1425, 819, 819, 1716, 1716, 1716, 1188, 2048, 1585, 1561, 1503, 1700, 1399, 1399, 1681, 1714,
  762, 762, 1587, 1305, 2038, 1714, 1741, 1501, 1741, 1577, 1475, 1397, 1663, 1585, 2259, 1579, 1483, 1485, 936, 748,
  936, 1716, 1024, 1024, 1382, 1466, 1214, 1466, 1389, 891, 1466, 1458, 702, 702, 1362, 702, 2134, 1458, 1407, 1466,
  1466, 1010, 1219, 979, 1458, 1335, 1892, 1321, 1335, 1192, 1458, 748, 1458, 1716,
];

// Symbols beyond ASCII that engineering labels use: [regular, bold].
// prettier-ignore
const SYMBOLS: Record<string, [number, number]> = {
  'Ω': [1565, 1741], 'µ': [1303, 1507], 'μ': [1303, 1507], '°': [1024, 1024], '±': [1716, 1716], '×': [1716, 1716],
  '²': [821, 897], '³': [821, 897], '·': [651, 778], '–': [1024, 1024], '—': [2048, 2048], '‘': [651, 778],
  '’': [651, 778], '“': [1061, 1346], '”': [1061, 1346], '…': [2048, 2048], '≥': [1716, 1716], '≤': [1716, 1716],
  '½': [1985, 2120], '→': [1716, 1716], 'Δ': [1401, 1585], 'φ': [1351, 1602], '√': [1305, 1366], '≈': [1716, 1716],
  'é': [1260, 1389], '\u00a0': [651, 713],
};

// Width of a character we have no entry for: a digit's width, a little above the average letter.
const FALLBACK = [1303, 1425];

/** Weight of a face; the sheet uses only these two. */
export type FontWeight = 'normal' | 'bold';

/**
 * Advance width in px of `text` set in DejaVu Sans at `size` px (no kerning, which DejaVu applies
 * little of at label sizes), composed as the PDF fonts draw it (Unicode NFC).
 * @example textWidth('480 V', 11) // ≈ 28.2
 */
export function textWidth(text: string, size: number, weight: FontWeight = 'normal'): number {
  return widthOf(text, size, weight, false);
}

// Text is measured composed (Unicode NFC), as the PDF fonts place it: an accent typed after its letter,
// or the ohm sign (U+2126, the letter Ω once composed). Only text with a character from U+0300 on that
// is not one of the symbols above is composed: below U+0300 NFC changes nothing, and those symbols are
// composed already.
function widthOf(text: string, size: number, weight: FontWeight, composed: boolean): number {
  const face = weight === 'bold' ? 1 : 0;
  const table = face ? BOLD : REGULAR;
  let units = 0;
  for (const char of text) {
    const code = char.codePointAt(0) ?? 32;
    if (code >= 0x300 && !composed && SYMBOLS[char] === undefined)
      return widthOf(text.normalize('NFC'), size, weight, true);
    units += code >= 32 && code < 127 ? table[code - 32] : (SYMBOLS[char]?.[face] ?? FALLBACK[face]);
  }
  return (units / UNITS_PER_EM) * size;
}

/**
 * Breaks `text` into lines no wider than `maxWidth` px at `size` px, at spaces; a single word wider
 * than the line is broken across lines, so that no character is lost (an id in a narrow column of a
 * report). Empty text gives no lines. Each word is measured once.
 * @example wrapText('Results are for review by a qualified engineer', 120, 11) // ['Results are for review', 'by a qualified engineer']
 */
export function wrapText(text: string, maxWidth: number, size: number, weight: FontWeight = 'normal'): string[] {
  const lines: string[] = [];
  const space = textWidth(' ', size, weight);
  let current = '';
  let currentWidth = 0;
  for (const word of text.split(/\s+/).filter((w) => w.length > 0)) {
    const wordWidth = textWidth(word, size, weight);
    if (current && currentWidth + space + wordWidth <= maxWidth) {
      current = `${current} ${word}`;
      currentWidth += space + wordWidth;
      continue;
    }
    if (current) lines.push(current);
    if (wordWidth <= maxWidth) {
      current = word;
      currentWidth = wordWidth;
      continue;
    }
    // Too long for any line: whole lines of its characters, the rest begins the next line.
    current = '';
    currentWidth = 0;
    for (const char of charactersOf(word)) {
      const charWidth = textWidth(char, size, weight);
      if (current && currentWidth + charWidth > maxWidth) {
        lines.push(current);
        current = '';
        currentWidth = 0;
      }
      current += char;
      currentWidth += charWidth;
    }
  }
  if (current) lines.push(current);
  return lines;
}

// Whole characters as a reader sees them (a letter with its accents, an emoji sequence), never split.
const graphemes =
  typeof Intl.Segmenter === 'function' ? new Intl.Segmenter(undefined, { granularity: 'grapheme' }) : undefined;

// Accepts a word; its characters as a reader sees them, or its code points where the runtime cannot tell.
function charactersOf(word: string): Iterable<string> {
  return graphemes ? Array.from(graphemes.segment(word), (part) => part.segment) : word;
}

/**
 * `text` shortened with a trailing "…" so it fits in `maxWidth` px; unchanged when it already fits.
 * Measures each character (a letter with its accents) once, composed as `textWidth` measures it.
 * @example truncateText('FEEDER-TO-COMPRESSOR-MCC', 60, 11) // 'FEEDER-T…'
 */
export function truncateText(text: string, maxWidth: number, size: number, weight: FontWeight = 'normal'): string {
  if (textWidth(text, size, weight) <= maxWidth) return text;
  // Measured as textWidth measures it: composed, a letter with its accents as one.
  text = text.normalize('NFC');
  const room = maxWidth - textWidth('…', size, weight);
  let width = 0;
  let kept = '';
  for (const char of charactersOf(text)) {
    const w = textWidth(char, size, weight);
    if (width + w > room) break;
    width += w;
    kept += char;
  }
  return `${kept}…`;
}
