import { describe, expect, it } from 'vitest';
import { DEFAULT_MOTOR_XR, motorImpedanceOf } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

const base = { id: 'M', hp: undefined, rating: undefined, fullLoadAmps: undefined, contribution: 4, xr: undefined };

describe('motorImpedanceOf', () => {
  it('has the expected defaults', () => {
    expect(DEFAULT_MOTOR_XR).toBe(6); // common practice for LV groups (a few to ~10)
    const { z } = motorImpedanceOf({ ...base, fullLoadAmps: 451 }, 480);
    assertInDelta(z.x / z.r, 6, 1e-12);
  });

  it('4 × 451 A of motor load contributes 1804 A at 480 V, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const { z, amps } = motorImpedanceOf({ ...base, fullLoadAmps: 451 }, 480);
    assertInDelta(amps, 1804, 1e-12);
    assertInDelta(480 / (Math.sqrt(3) * Math.hypot(z.r, z.x)), 1804, 1e-12);
  });

  it('a 150 hp motor at 480 V: FLA 180 A from NFPA 70 Table 430.250 (460 V column), 4 × FLA', () => {
    const { amps, steps } = motorImpedanceOf({ ...base, hp: 150 }, 480);
    assertInDelta(amps, 4 * 180, 1e-12);
    expect(steps[0].source).toMatch(/common practice/);
    expect(steps[0].label).toMatch(/M \(150 hp\)/);
  });

  it('uses the motor X/R when given', () => {
    const { z } = motorImpedanceOf({ ...base, fullLoadAmps: 100, xr: 10 }, 480);
    assertInDelta(z.x / z.r, 10, 1e-12);
  });
});
