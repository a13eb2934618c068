import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { reflectAmps, reflectImpedance } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('reflectAmps', () => {
  it('has the expected defaults', () => {
    expect(reflectAmps(100, 480, 480)).toBe(100); // same voltage: unchanged
  });

  it('a 10 kA current at 208 V drawn on a 480 V sheet is 4333.33 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(reflectAmps(10000, 208, 480), 4333.33, 1e-6);
  });

  it('28 421.1 A at 480 V is 1093.99 A at 12.47 kV, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(reflectAmps(28421.1, 480, 12470), 1093.99, 1e-5);
  });

  it('reflectImpedance moves ohms by the square of the ratio: 0.622 Ω at 12.47 kV is 0.0009216 Ω at 480 V, IEEE 141 / IEEE 399 per-unit method', () => {
    const z = reflectImpedance({ r: 0, x: 12470 ** 2 / 250e6 }, 12470, 480);
    assertInDelta(z.x, 0.0009216, 1e-9);
  });

  it('reflecting there and back is the identity (property)', () => {
    const volts = fc.double({ min: 100, max: 500e3, noNaN: true });
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e6, noNaN: true }), volts, volts, (amps, a, b) => {
        const back = reflectAmps(reflectAmps(amps, a, b), b, a);
        return Math.abs(back - amps) <= 1e-9 * amps;
      }),
      { numRuns: 500 },
    );
  });
});
