/**
 * The few pieces of PDF syntax the writer needs (ISO 32000-1 §7.3): numbers, names, literal and text
 * strings, hex strings and dates, each written the one way the writer uses, so the same drawing gives
 * the same bytes.
 */

/**
 * A PDF number with at most `digits` decimals, no trailing zeros, no exponent and no "-0".
 * @example pdfNumber(0.7071068, 4) // "0.7071"
 */
export function pdfNumber(value: number, digits = 3): string {
  const rounded = Number(value.toFixed(digits));
  if (rounded === 0) return '0';
  const text = String(rounded);
  // String() switches to exponent form below 1e-6; toFixed never does.
  return text.includes('e') ? rounded.toFixed(digits).replace(/\.?0+$/, '') : text;
}

/**
 * A literal string of bytes 0–255 (each character's code taken as a byte): `\`, `(` and `)` escaped,
 * bytes outside printable ASCII as octal escapes.
 * @example pdfLiteral('a (b)') // "(a \\(b\\))"
 */
export function pdfLiteral(bytes: string): string {
  let out = '(';
  for (let i = 0; i < bytes.length; i++) {
    const code = bytes.charCodeAt(i) & 0xff;
    const char = bytes[i];
    if (char === '\\' || char === '(' || char === ')') out += `\\${char}`;
    else if (code < 32 || code > 126) out += `\\${code.toString(8).padStart(3, '0')}`;
    else out += char;
  }
  return `${out})`;
}

/**
 * A text string for the document's properties: any Unicode as UTF-16BE with a byte-order mark, in hex.
 * @example pdfTextString('Ω') // "<FEFF03A9>"
 */
export function pdfTextString(text: string): string {
  let hex = 'FEFF';
  for (let i = 0; i < text.length; i++) hex += text.charCodeAt(i).toString(16).padStart(4, '0').toUpperCase();
  return `<${hex}>`;
}

/**
 * A PDF date in UTC (`D:YYYYMMDDHHmmSSZ`) from an ISO date; a date that does not parse is a one-line
 * error naming `options.date`.
 * @example pdfDate('2026-12-02') // "D:20261202000000Z"
 */
export function pdfDate(iso: string): string {
  const time = Date.parse(iso);
  if (Number.isNaN(time)) throw new RangeError(`options.date: expected an ISO date, got "${iso}"`);
  const stamp = new Date(time).toISOString();
  // A PDF date has four digits of year: "+010000-01-01" or "-000001-01-01" has no such form.
  if (!/^\d{4}-/.test(stamp)) throw new RangeError(`options.date: expected a year from 0 to 9999, got "${iso}"`);
  const digits = stamp.replace(/[-:T]|\.\d+Z$/g, '');
  return `D:${digits}Z`;
}

/**
 * Four hex digits of a 16-bit code, as glyph ids and UTF-16 units are written in content and CMaps.
 * @example hex4(937) // "03A9"
 */
export function hex4(code: number): string {
  return code.toString(16).padStart(4, '0').toUpperCase();
}
