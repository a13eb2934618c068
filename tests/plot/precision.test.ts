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

  it('pathOf writes a rounded polyline and closes it on request', () => {
    expect(pathOf(new Float64Array([0, 0, 10.00049, 5.1235]))).toBe('M0,0L10,5.124');
    expect(pathOf([0, 0, 1, 1, 2, 0], true)).toBe('M0,0L1,1L2,0Z');
    expect(pathOf([1, 2])).toBe('');
  });
});
