import { describe, expect, it } from 'vitest';
import { DIGITS, fixed, pathOf } from '../../src/plot/precision.ts';

describe('precision', () => {
  it('has the expected defaults', () => {
    expect(DIGITS).toBe(3);
  });

  it('fixed rounds to three decimals without trailing zeros or "-0"', () => {
    expect(fixed(12.34567)).toBe('12.346');
    expect(fixed(2.5)).toBe('2.5');
    expect(fixed(-0.0001)).toBe('0');
    expect(fixed(720)).toBe('720');
  });

  it('fixed writes what Number#toFixed rounds to, halves and negatives too (ECMA-262 Number.prototype.toFixed)', () => {
    // The exact halves round away from zero on either side, as toFixed takes the larger magnitude; 1.0005
    // is stored just below its half, and 999.9995 just above.
    const byToFixed = (value: number) => {
      const rounded = Number(value.toFixed(3));
      return String(rounded === 0 ? 0 : rounded);
    };
    const values = [2.0625, -2.0625, 0.0005, -0.0005, 1.0005, 999.9995, -999.9995, 1e15 + 0.25, NaN, Infinity];
    let seed = 7;
    for (let i = 0; i < 20_000; i++) {
      seed = (seed * 48271) % 2147483647;
      values.push(((seed / 2147483647) * 2 - 0.5) * 10 ** ((i % 9) - 3), Math.round(seed / 1000) / 2000);
    }
    for (const value of values) expect(fixed(value), String(value)).toBe(byToFixed(value));
    expect([fixed(2.0625), fixed(-2.0625), fixed(1.0005)]).toEqual(['2.063', '-2.063', '1']);
  });

  it('pathOf writes a rounded polyline and closes it on request', () => {
    expect(pathOf(new Float64Array([0, 0, 10.00049, 5.1235]))).toBe('M0,0L10,5.124');
    expect(pathOf([0, 0, 1, 1, 2, 0], true)).toBe('M0,0L1,1L2,0Z');
    expect(pathOf([1, 2])).toBe('');
  });
});
