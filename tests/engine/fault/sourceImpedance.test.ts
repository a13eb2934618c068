import { describe, expect, it } from 'vitest';
import { sourceImpedanceOf, sourcePowerOf } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('sourceImpedanceOf', () => {
  it('has the expected defaults', () => {
    // No X/R: the utility is all reactance.
    const { z } = sourceImpedanceOf({ available: { va: 250e6 } }, 480);
    expect(z.r).toBe(0);
    assertInDelta(z.x, 0.0009216, 1e-9);
  });

  it('gives 0.0009216 Ω at 480 V for 250 MVA, ohmic method (IEEE 141), hand calculation', () => {
    const { z, steps } = sourceImpedanceOf({ available: { va: 250e6 }, xr: 15 }, 480);
    assertInDelta(Math.hypot(z.r, z.x), 0.0009216, 1e-9);
    assertInDelta(z.x / z.r, 15, 1e-12);
    expect(steps.at(-1)!.formula).toBe('|Z_U| = V² / S_sc');
  });

  it('utility alone at 4.16 kV gives 34 696.5 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const { z } = sourceImpedanceOf({ available: { va: 250e6 }, xr: 15 }, 4160);
    assertInDelta(4160 / (Math.sqrt(3) * Math.hypot(z.r, z.x)), 34696.5, 1e-5);
  });

  it('reads a fault current as S = √3 · V · I: 11 574.8 A at 12.47 kV is 250 MVA, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(sourcePowerOf({ available: { amps: 11574.8 } }, 12470), 250e6, 1e-5);
    const { steps } = sourceImpedanceOf({ available: { amps: 11574.8 }, xr: 12 }, 12470);
    expect(steps[0].formula).toBe('S_sc = √3 · V · I_sc');
    expect(steps).toHaveLength(2);
  });
});
