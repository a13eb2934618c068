import { describe, expect, it } from 'vitest';
import { typedValue } from '../../../src/app/lib/typedValue.ts';

describe('typedValue', () => {
  it('has the expected defaults: a number field stores the number its decimal text reads as', () => {
    expect(typedValue('2.5', 'number')).toBe(2.5);
    // Written as people write numbers: a trailing zero or point, a leading point or zero, an exponent.
    expect(['2.50', '2.', '.5', '06', '-3', '1e6', ' 6.0 '].map((text) => typedValue(text, 'number'))).toEqual([
      2.5, 2, 0.5, 6, -3, 1e6, 6,
    ]);
  });

  it('keeps as typed what is not a decimal number, for the reader to name: hex, words, units, half a number', () => {
    for (const text of ['0x10', 'Infinity', 'abc', '1e', '.', '', '1e400'])
      expect(typedValue(text, 'number')).toBe(text);
    expect(typedValue('480 V', 'quantity')).toBe('480 V');
    expect(typedValue('480', 'quantity')).toBe(480);
  });

  it('stores text in a text field even when it reads as a number (a name "007")', () => {
    expect(typedValue('007', 'text')).toBe('007');
    expect(typedValue('2.50', undefined)).toBe('2.50');
  });
});
