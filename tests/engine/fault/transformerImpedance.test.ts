import { describe, expect, it } from 'vitest';
import {
  effectivePerUnit,
  fullLoadAmpsOf,
  IMPEDANCE_TOLERANCE,
  transformerImpedanceOf,
} from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

const t1500 = { id: 'T1', rating: 1.5e6, primary: 12470, secondary: 480, impedance: 5.75, phases: 3 as const, xr: 6 };

describe('transformer impedance and full-load current', () => {
  it('has the expected defaults', () => {
    expect(IMPEDANCE_TOLERANCE).toBe(0.925);
    assertInDelta(fullLoadAmpsOf(1.5e6, 480), 1804.22, 1e-6); // three-phase by default
    expect(effectivePerUnit({ impedance: 5.75 }, true)).toBe(0.0575); // tolerance off unless asked
  });

  it('fullLoadAmpsOf 1500 kVA at 480 V and 12.47 kV, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(fullLoadAmpsOf(1.5e6, 480, 3), 1804.22, 1e-6);
    assertInDelta(fullLoadAmpsOf(1.5e6, 12470, 3), 69.449, 1e-5);
  });

  it('fullLoadAmpsOf single-phase is S / V, textbook identity (IEEE 141)', () => {
    assertInDelta(fullLoadAmpsOf(50e3, 240, 1), 208.333, 1e-5);
  });

  it('the −7.5 % option gives 0.0531875 pu and 33 921.9 A for 1500 kVA 480 V, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const pu = effectivePerUnit({ impedance: 5.75, impedanceTolerance: true }, true);
    assertInDelta(pu, 0.0531875, 1e-12);
    assertInDelta(fullLoadAmpsOf(1.5e6, 480) / pu, 33921.9, 1e-5);
    expect(effectivePerUnit({ impedance: 5.75, impedanceTolerance: true }, false)).toBe(0.0575);
  });

  it('transformerImpedanceOf on the 1.5 MVA base matches Z_T of IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const { z, steps } = transformerImpedanceOf(t1500);
    const base = 480 ** 2 / 1.5e6;
    assertInDelta(z.r / base, 0.00945294, 1e-6);
    assertInDelta(z.x / base, 0.05671765, 1e-6);
    expect(steps).toHaveLength(1);
  });

  it('transformerImpedanceOf with the tolerance adds a step naming it', () => {
    const { perUnit, steps } = transformerImpedanceOf({ ...t1500, impedanceTolerance: true }, { toleranced: true });
    assertInDelta(perUnit, 0.0531875, 1e-12);
    expect(steps[0].label).toMatch(/−7\.5 % test tolerance/);
  });

  it('transformerImpedanceOf with no X/R is all reactance', () => {
    const { z } = transformerImpedanceOf({ ...t1500, xr: undefined });
    expect(z.r).toBe(0);
  });
});
