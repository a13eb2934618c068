import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  addImpedance,
  formatImpedance,
  impedanceOfMagnitude,
  magnitudeOf,
  parallelImpedance,
  scaleImpedance,
  xrOf,
  ZERO_IMPEDANCE,
} from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('impedance arithmetic', () => {
  it('has the expected defaults', () => {
    expect(ZERO_IMPEDANCE).toEqual({ r: 0, x: 0 });
    // No X/R given: all reactance (common practice: all reactance when X/R is omitted).
    expect(impedanceOfMagnitude(0.003)).toEqual({ r: 0, x: 0.003 });
  });

  it('impedanceOfMagnitude splits 0.003 pu at X/R 15 as IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const z = impedanceOfMagnitude(0.003, 15);
    assertInDelta(z.r, 0.00019956, 1e-4);
    assertInDelta(z.x, 0.00299336, 1e-5);
    assertInDelta(magnitudeOf(z), 0.003, 1e-12);
  });

  it('addImpedance adds phasors: Z_U + Z_T of IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const z = addImpedance({ r: 0.00049827, x: 0.00597927 }, { r: 0.00945294, x: 0.05671765 });
    assertInDelta(z.r, 0.00995121, 1e-6);
    assertInDelta(z.x, 0.06269692, 1e-6);
    assertInDelta(magnitudeOf(z), 0.06348174, 1e-6);
    assertInDelta(xrOf(z), 6.3, 1e-3);
  });

  it('adding magnitudes instead of phasors gives a larger |Z|, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const u = impedanceOfMagnitude(0.003, 15);
    const t = impedanceOfMagnitude(0.0575, 5);
    expect(magnitudeOf(addImpedance(u, t))).toBeLessThan(0.0605);
    assertInDelta(magnitudeOf(addImpedance(u, t)), 0.06047563, 1e-6);
  });

  it('parallelImpedance of two equal reactances halves them; open circuits are skipped', () => {
    expect(parallelImpedance({ r: 0, x: 2 }, { r: 0, x: 2 })).toEqual({ r: 0, x: 1 });
    expect(parallelImpedance({ r: 3, x: 4 }, undefined)).toEqual({ r: 3, x: 4 });
    expect(parallelImpedance(undefined)).toBeUndefined();
    expect(parallelImpedance({ r: 1, x: 1 }, ZERO_IMPEDANCE)).toEqual(ZERO_IMPEDANCE);
  });

  it('xrOf is Infinity with no resistance', () => {
    expect(xrOf({ r: 0, x: 1 })).toBe(Infinity);
  });

  it('scaleImpedance and formatImpedance', () => {
    expect(scaleImpedance({ r: 1, x: -2 }, 3)).toEqual({ r: 3, x: -6 });
    expect(formatImpedance({ r: 0.00995121, x: 0.0626969 })).toBe('0.00995121 + j0.0626969');
    expect(formatImpedance({ r: 1, x: -2 })).toBe('1 − j2');
  });

  it('parallelImpedance never exceeds either branch (property)', () => {
    const z = fc.record({
      r: fc.double({ min: 1e-4, max: 10, noNaN: true }),
      x: fc.double({ min: 1e-4, max: 10, noNaN: true }),
    });
    fc.assert(
      fc.property(z, z, (a, b) => {
        const p = magnitudeOf(parallelImpedance(a, b)!);
        return p <= magnitudeOf(a) * (1 + 1e-12) && p <= magnitudeOf(b) * (1 + 1e-12);
      }),
      { numRuns: 300 },
    );
  });
});
