import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  DRY_LONGEST_SECONDS,
  LIQUID_JOIN_SECONDS,
  LIQUID_THERMAL_TABLE,
  THERMAL_I2T,
  thermalCurveOf,
} from '../../../src/engine/withstand/transformerThermal.ts';
import { assertInDelta } from '../../asserts.ts';

describe('thermalCurveOf', () => {
  it('has the expected defaults', () => {
    // IEEE C57.109 Table 1 and I²t = 1250, IEEE C57.109 (values from memory)
    expect(THERMAL_I2T).toBe(1250);
    expect(LIQUID_THERMAL_TABLE).toEqual([
      [2, 1800],
      [3, 300],
      [4.75, 60],
      [6.3, 30],
    ]);
    expect(LIQUID_JOIN_SECONDS).toBe(10);
    expect(DRY_LONGEST_SECONDS).toBe(100);
    const liquid = thermalCurveOf('liquid');
    expect(liquid.lowestPu).toBe(2);
    assertInDelta(liquid.breakpointsPu[4], Math.sqrt(125), 1e-12);
  });

  it('thermalCurveOf(liquid) passes through every C57.109 table point and the join at 11.180 pu, 10 s', () => {
    // IEEE C57.109 Table 1, IEEE C57.109 (from memory); join per IEEE C57.109's continuous rule (computed)
    const { secondsAt } = thermalCurveOf('liquid');
    for (const [pu, seconds] of LIQUID_THERMAL_TABLE) assertInDelta(secondsAt(pu), seconds, 1e-9, `${pu} pu`);
    assertInDelta(secondsAt(11.1803), 10, 1e-5);
  });

  it('thermalCurveOf(liquid) meets the IEEE C57.109 check values between table points', () => {
    // IEEE C57.109 check values (computed): 5.0 pu → 52.902 s; 5.5556 pu → 40.848 s; 8.0 pu → 18.985 s
    const { secondsAt } = thermalCurveOf('liquid');
    assertInDelta(secondsAt(5), 52.902, 1e-5);
    assertInDelta(secondsAt(50 / 9), 40.848, 1e-4);
    assertInDelta(secondsAt(8), 18.985, 1e-4);
  });

  it('thermalCurveOf(liquid) follows I²t = 1250 above the join, without end', () => {
    // IEEE C57.109, IEEE C57.109: I²t = 1250 for 2 s ≤ t ≤ 10 s (25 pu at 2 s)
    const { secondsAt } = thermalCurveOf('liquid');
    assertInDelta(secondsAt(25), 2, 1e-12);
    assertInDelta(secondsAt(12.173913), 8.43431, 1e-5); // hand-worked IEEE C57.109 Category II case, 0.7 · I_max of a 5.75 % unit
    assertInDelta(secondsAt(40), 1250 / 1600, 1e-12);
  });

  it('thermalCurveOf(liquid) is Infinity below 2 pu and for a current that is not a number', () => {
    const { secondsAt } = thermalCurveOf('liquid');
    expect(secondsAt(1.999)).toBe(Infinity);
    expect(secondsAt(0)).toBe(Infinity);
    expect(secondsAt(Number.NaN)).toBe(Infinity);
  });

  it('thermalCurveOf(dry) is I²t = 1250 from 100 s (3.536 pu) to 2 s (25 pu)', () => {
    // IEEE C57.12.59 as recalled in IEEE C57.12.59 (from memory): I²t = 1250 from 2 s to 100 s (3.54–25 pu)
    const dry = thermalCurveOf('dry');
    assertInDelta(dry.lowestPu, 3.5355339, 1e-7);
    assertInDelta(dry.secondsAt(dry.lowestPu), 100, 1e-12);
    assertInDelta(dry.secondsAt(25), 2, 1e-12);
    assertInDelta(dry.secondsAt(5), 50, 1e-12);
    expect(dry.secondsAt(3.5)).toBe(Infinity);
    expect(dry.rule).toMatch(/C57\.12\.59/);
  });

  it('thermalCurveOf is non-increasing in current and never NaN (property)', () => {
    for (const construction of ['liquid', 'dry'] as const) {
      const { secondsAt } = thermalCurveOf(construction);
      fc.assert(
        fc.property(
          fc.double({ min: 0, max: 200, noNaN: true }),
          fc.double({ min: 0, max: 200, noNaN: true }),
          (a, b) => {
            const [low, high] = a <= b ? [a, b] : [b, a];
            const tLow = secondsAt(low);
            const tHigh = secondsAt(high);
            return !Number.isNaN(tLow) && !Number.isNaN(tHigh) && tHigh <= tLow;
          },
        ),
        { numRuns: 500 },
      );
    }
  });
});
