import { textWidth } from '../textWidth.ts';
import type { PdfFont } from './pdfFont.ts';
import { pdfLiteral } from './pdfSyntax.ts';

/**
 * Helvetica or Helvetica-Bold, a standard font every PDF reader has (ISO 32000-1 §9.6.2.2), in
 * WinAnsiEncoding: what prints when no face is given to embed. Text is composed first (Unicode NFC), so
 * a letter typed as a base and a combining accent prints as its accented letter; characters WinAnsi
 * lacks are spelled out ("Ω" as "Ohm", "≥" as ">=") or printed as "?", and an accent with no composed
 * form is left out. Text is measured with the sheet's DejaVu Sans
 * widths (`textWidth`), the widths it was laid out with, so a centred label stays centred within a
 * few per cent.
 * @example createStandardFont('F1', 'normal').encode('≥ 0.3 s').operand // "(>= 0.3 s)"
 */
export function createStandardFont(name: string, weight: 'normal' | 'bold'): PdfFont {
  let id: number | undefined;
  return {
    name,
    encode(text) {
      const spelled = [...text.normalize('NFC')]
        .map((char) => (winAnsiByte(char) === undefined ? (SPELLED[char] ?? (COMBINING.test(char) ? '' : '?')) : char))
        .join('');
      const bytes = [...spelled].map((char) => String.fromCharCode(winAnsiByte(char) ?? 63)).join('');
      return { operand: pdfLiteral(bytes), advance: textWidth(spelled, 1, weight) };
    },
    reference(writer) {
      id ??= writer.reserve();
      return id;
    },
    write(writer) {
      if (id === undefined) return;
      const base = weight === 'bold' ? 'Helvetica-Bold' : 'Helvetica';
      writer.object(id, `<< /Type /Font /Subtype /Type1 /BaseFont /${base} /Encoding /WinAnsiEncoding >>`);
    },
  };
}

// Accepts one character; its byte in WinAnsiEncoding (ISO 32000-1 Annex D.2), or undefined when it has none.
function winAnsiByte(char: string): number | undefined {
  const code = char.codePointAt(0)!;
  if ((code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff)) return code;
  const byte = WIN_ANSI_HIGH.indexOf(code);
  return byte >= 0 ? 0x80 + byte : undefined;
}

// The code points WinAnsiEncoding puts at bytes 0x80–0x9f, in byte order (-1 where it has none).
// prettier-ignore
const WIN_ANSI_HIGH = [
  0x20ac, -1, 0x201a, 0x0192, 0x201e, 0x2026, 0x2020, 0x2021, 0x02c6, 0x2030, 0x0160, 0x2039, 0x0152, -1, 0x017d, -1,
  -1, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x02dc, 0x2122, 0x0161, 0x203a, 0x0153, -1, 0x017e, 0x0178,
];

// A combining mark (Unicode general category M): an accent drawn over the character before it.
const COMBINING = /^\p{M}$/u;

// Engineering symbols the sheets and reports print, spelled in WinAnsi characters.
// prettier-ignore
const SPELLED: Record<string, string> = {
  'Ω': 'Ohm', 'μ': 'µ', '≥': '>=', '≤': '<=', '−': '-', '√': 'sqrt', 'Δ': 'delta ', 'φ': 'phi', 'Σ': 'sum ',
  '→': '->', '≈': '~', '∥': '||', '′': "'", '″': '"', '∞': 'inf', '▲': '^', '◆': '*', '\u2009': ' ', '\u202f': ' ',
};
