import { describe, it, expect } from 'vitest';
import { transformerRatedAmps } from '../../../src/engine/withstand/transformerRatedAmps.ts';
import { assertInDelta } from '../../asserts.ts';
import { transformerOf } from './fixtures.ts';

describe('transformerRatedAmps', () => {
  it('has the expected defaults', () => {
    // three-phase unless the study says 1: S / (√3 · V), IEEE 141 per-unit method (textbook identity)
    assertInDelta(transformerRatedAmps(transformerOf(), 480), 3007.03, 1e-6);
  });

  it('transformerRatedAmps gives the hand-worked Category II full-load currents on both windings', () => {
    // hand-worked IEEE C57.109 Category II case (computed): 3007.03 A at 480 V, 104.592 A at 13.8 kV
    const t = transformerOf();
    assertInDelta(transformerRatedAmps(t, t.secondary), 3007.03, 1e-6);
    assertInDelta(transformerRatedAmps(t, t.primary), 104.592, 1e-5);
  });

  it('transformerRatedAmps uses S / V for a single-phase unit', () => {
    // IEEE 141 per-unit method: single-phase FLA = S / V (240 V for a 120/240 V winding); 167 kVA / 240 V (computed)
    assertInDelta(transformerRatedAmps(transformerOf({ rating: 167, phases: 1, secondary: 240 }), 240), 695.8333, 1e-6);
  });

  it('transformerRatedAmps rejects a winding voltage that is not positive', () => {
    expect(() => transformerRatedAmps(transformerOf(), 0)).toThrow(
      /^transformers\.T1\.volts: expected a winding voltage in V greater than 0, got "0"$/,
    );
  });
});
