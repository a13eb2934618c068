import { describe, expect, it } from 'vitest';
import {
  E_RATINGS,
  nextERating,
  nextStandardRating,
  STANDARD_RATINGS,
} from '../../../src/engine/checks/standardRatings.ts';

describe('nextStandardRating', () => {
  it('has the expected defaults: the NFPA 70 240.6(A) list from 15 A to 6000 A (from memory)', () => {
    expect(STANDARD_RATINGS[0]).toBe(15);
    expect(STANDARD_RATINGS.at(-1)).toBe(6000);
    expect(STANDARD_RATINGS).toContain(1200);
  });

  it('rounds up to the next standard rating (NEC 450.3 note 1)', () => {
    // 125 % of a 1500 kVA, 480 V secondary: 1.25 × 1804.22 A = 2255.3 A → 2500 A (computed).
    expect(nextStandardRating(1.25 * 1804.22)).toBe(2500);
    expect(nextStandardRating(200)).toBe(200);
    expect(nextStandardRating(208.35)).toBe(225);
  });

  it('offers the additional fuse ratings only for fuses', () => {
    expect(nextStandardRating(5)).toBe(15);
    expect(nextStandardRating(5, true)).toBe(6);
    expect(nextStandardRating(600.5, true)).toBe(601);
  });
});

describe('nextERating', () => {
  it('has the expected defaults: the common E-rating series 10E to 400E (common practice, from memory)', () => {
    expect(E_RATINGS[0]).toBe(10);
    expect(E_RATINGS.at(-1)).toBe(400);
    expect(E_RATINGS).toContain(65);
  });

  it('rounds up within the E series, not the NEC 240.6(A) list', () => {
    expect(nextERating(52.1)).toBe(65); // 240.6(A) would give 60 A
    expect(nextERating(65)).toBe(65);
    expect(nextERating(65.0001)).toBe(80);
    expect(nextERating(400.5)).toBeUndefined();
    expect(nextERating(52.1, [50, 55, 60])).toBe(55); // a maker's series given by the user
  });
});
