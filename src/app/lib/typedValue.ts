/** A decimal number as people type one: "2.50", "6.0", ".5", "06", "2.", "-3", "1e6"; not "0x10" or "Infinity". */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * What a field stores for the text typed into it: a number field's decimal text as its number ("2.50"
 * is 2.5, so a trailing zero is no problem), anything else as typed ("1e", "abc", a quantity with its
 * unit), which the study's reader then names if it is wrong. While the number stays the same the field
 * is not redrawn, so "2." or "2.50" stays under the cursor as typed.
 *
 * @example typedValue('2.50', 'number') // 2.5
 * @example typedValue('480 V', 'quantity') // "480 V"
 */
export function typedValue(text: string, control: string | undefined): string | number {
  const trimmed = text.trim();
  if ((control === 'number' || control === 'quantity') && DECIMAL.test(trimmed)) {
    const value = Number(trimmed);
    if (Number.isFinite(value)) return value;
  }
  return text;
}
