import { pdfNumber } from './pdfSyntax.ts';

/**
 * A colour as the sheet writes it (`#rrggbb`, `#rgb`, or `black`/`white`) as the operands of a PDF
 * RGB colour operator, components 0–1 to three decimals; `'none'` or `'transparent'` is `null`. Any
 * other colour is a one-line error naming it.
 * @example rgbOf('#E69F00') // "0.902 0.624 0"
 */
export function rgbOf(colour: string): string | null {
  const text = colour.trim().toLowerCase();
  if (text === 'none' || text === 'transparent') return null;
  const hex = NAMED[text] ?? text;
  const long = /^#[0-9a-f]{6}$/.test(hex) ? hex : /^#[0-9a-f]{3}$/.test(hex) ? hex.replace(/[0-9a-f]/g, '$&$&') : '';
  if (!long) throw new RangeError(`drawing colour: expected #rrggbb, #rgb or none, got "${colour}"`);
  return [1, 3, 5].map((at) => pdfNumber(Number.parseInt(long.slice(at, at + 2), 16) / 255)).join(' ');
}

/**
 * An SVG dash array (`'7 4'`, `'10,3,2.5,3'`) as a PDF dash array; an odd-length list is repeated to
 * make it even, as SVG does. Empty, `'none'`, all zeros or any negative number is a solid line (`null`).
 * @example dashArrayOf('7 4') // "[7 4]"
 */
export function dashArrayOf(dash: string | undefined): string | null {
  if (dash === undefined || dash.trim() === 'none') return null;
  const lengths = dash
    .split(/[\s,]+/)
    .filter((part) => part !== '')
    .map(Number);
  if (lengths.length === 0 || lengths.some((n) => !(n >= 0)) || lengths.every((n) => n === 0)) return null;
  const even = lengths.length % 2 === 1 ? [...lengths, ...lengths] : lengths;
  return `[${even.map((n) => pdfNumber(n)).join(' ')}]`;
}

// The colour keywords the sheet's code might write.
const NAMED: Record<string, string> = { black: '#000000', white: '#ffffff' };
