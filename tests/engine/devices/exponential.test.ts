import { describe, expect, it } from 'vitest';
import { exponential } from '../../../src/engine/devices/exponential.ts';

/** Seeded values spread over `[-limit, limit]`, with the integer multiples of ln 2 / 64 and their neighbours. */
function valuesWithin(limit: number, seed: number): number[] {
  let state = seed;
  const random = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
  const spread = Array.from({ length: 50000 }, () => (2 * random() - 1) * limit);
  const tableEdges = Array.from({ length: 2000 }, (_, i) => ((i - 1000) * Math.LN2) / 64).flatMap((x) => [
    x,
    x * (1 + 1e-15),
    x + (Math.LN2 / 128) * (1 - 1e-12),
    x - (Math.LN2 / 128) * (1 - 1e-12),
  ]);
  return [...spread, ...tableEdges, 0, 1e-300, -1e-300, 699.99, -699.99];
}

describe('exponential', () => {
  it('agrees with Math.exp to a relative 4.5e-16 (two ulps) over its whole table range', () => {
    for (const x of valuesWithin(700, 11)) {
      const expected = Math.exp(x);
      expect(Math.abs(exponential(x) - expected) <= 4.5e-16 * expected, `at ${x}`).toBe(true);
    }
  });

  it('is Math.exp itself from |x| = 700 on, and keeps its infinities and NaN', () => {
    for (const x of [700, -700, 709.7, 710, -745, -746, 1e6]) expect(exponential(x)).toBe(Math.exp(x));
    expect(exponential(0)).toBe(1);
    expect(exponential(Infinity)).toBe(Infinity);
    expect(exponential(-Infinity)).toBe(0);
    expect(exponential(NaN)).toBeNaN();
  });

  it('returns a log-log interpolation of a tabulated time close to the table value', () => {
    // ln(300) through the table and back: the round trip of a digitised point.
    expect(exponential(Math.log(300))).toBeCloseTo(300, 12);
  });
});
