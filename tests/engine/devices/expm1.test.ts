import { describe, expect, it } from 'vitest';
import { expm1 } from '../../../src/engine/devices/expm1.ts';

/** Seeded values spread over `[-limit, limit]`, with tiny ones on both sides. */
function valuesWithin(limit: number, seed: number): number[] {
  let state = seed;
  const random = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
  const spread = Array.from({ length: 20000 }, () => (2 * random() - 1) * limit);
  const tiny = Array.from({ length: 2000 }, (_, i) => (i % 2 === 0 ? 1 : -1) * limit * 10 ** (-15 * random()));
  return [...spread, ...tiny, limit, -limit, 1e-300, -1e-300];
}

describe('expm1', () => {
  it('agrees with Math.expm1 to a relative 1e-15 (a couple of ulps) where it takes its series', () => {
    for (const v of valuesWithin(0.05, 7)) {
      const expected = Math.expm1(v);
      expect(Math.abs(expm1(v) - expected) <= 1e-15 * Math.abs(expected), `at ${v}`).toBe(true);
    }
  });

  it('is Math.expm1 itself beyond its series, and keeps zero, infinities and NaN', () => {
    for (const v of [0.05000000000000001, -0.05000000000000001, 0.1, -0.3, 1, 40, -40, 800]) {
      expect(expm1(v)).toBe(Math.expm1(v));
    }
    expect(expm1(0)).toBe(0);
    expect(expm1(Infinity)).toBe(Infinity);
    expect(expm1(-Infinity)).toBe(-1);
    expect(expm1(NaN)).toBeNaN();
  });
});
