import { describe, expect, it } from 'vitest';
import { inferCurrentRange } from '../../src/plot/currentRange.ts';
import { fixtureInput } from './fixtures.ts';

describe('inferCurrentRange', () => {
  it('has the expected defaults', () => {
    // Nothing to show: 1 A to 10 kA.
    expect(
      inferCurrentRange(
        fixtureInput({ bands: [], withstand: [], markers: [], starting: [], faultLines: [], regions: [] }),
      ),
    ).toEqual([1, 10_000]);
  });

  it('inferCurrentRange spans decades from the lowest pickup up to the largest fault line', () => {
    // Lowest: FLC 124 A and R2's 150 A pickup → 100 A; top: SWBD 28.4 kA (not the 65 kA rating, nor the 52 kA curve end) → 100 kA.
    expect(inferCurrentRange(fixtureInput())).toEqual([100, 100_000]);
    // A 5 kA fault line caps the sheet at 10 kA although the breaker's band runs to 65 kA.
    const small = fixtureInput({
      faultLines: [{ ...fixtureInput().faultLines[0], amps: 5000, ownAmps: 5000 }],
      regions: [],
    });
    expect(inferCurrentRange(small)).toEqual([100, 10_000]);
    const open = fixtureInput({
      faultLines: [],
      withstand: [],
      markers: [],
      starting: [],
      regions: [],
      bands: [fixtureInput().bands[0]],
    });
    // An open-ended relay with no fault line shows a decade past its last breakpoint: 84 kA, with room → 1 MA.
    expect(inferCurrentRange(open)).toEqual([100, 1_000_000]);
  });
});
