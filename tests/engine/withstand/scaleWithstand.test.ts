import { describe, it, expect } from 'vitest';
import { cableWithstandOf } from '../../../src/engine/withstand/cableWithstand.ts';
import { scaleWithstand } from '../../../src/engine/withstand/scaleWithstand.ts';
import { transformerWithstandOf } from '../../../src/engine/withstand/transformerWithstand.ts';
import { assertInDelta } from '../../asserts.ts';
import { cableOf, transformerOf } from './fixtures.ts';

describe('scaleWithstand', () => {
  it('has the expected defaults', () => {
    const curve = transformerWithstandOf(transformerOf());
    expect(scaleWithstand(curve, { toVolts: 480 })).toBe(curve); // factor 1 on its own base: unchanged
    const primary = scaleWithstand(curve, { toVolts: 13_800 });
    expect(primary.volts).toBe(13_800);
    expect(primary.label).toBe(curve.label);
    expect(primary.notes.at(-1)).toBe('drawn at 13800 V: currents × 480/13800');
  });

  it('scaleWithstand(hand-worked Category II curve) moves it to 13.8 kV and, × 0.577, to the Δ–Yg secondary L-G view', () => {
    // hand-worked IEEE C57.109 Category II case table (computed): I_max 1818.999 A at 13.8 kV, 1049.6 A × 0.577; step at 1273.299 A / 734.7 A;
    // connection factor per IEEE C37.91 / IEEE C57.109 delta–wye shift factors
    const frequent = transformerWithstandOf(transformerOf({ faultFrequency: 'frequent' }));
    const primary = scaleWithstand(frequent, { toVolts: 13_800 });
    const groundFault = scaleWithstand(frequent, { toVolts: 13_800, factor: 0.577 });
    const last = primary.amps.length - 1;
    assertInDelta(primary.amps[last], 1818.999, 1e-6);
    assertInDelta(groundFault.amps[last], 1049.6, 1e-4);
    assertInDelta(primary.amps[0], 209.185, 1e-5);
    assertInDelta(groundFault.amps[0], 120.7, 1e-3);
    assertInDelta(primary.timeAt(1273.3), 4.08163, 1e-5); // just past the step current 1273.299 A
    assertInDelta(groundFault.timeAt(734.7 * (1 - 1e-4)), 8.43431, 1e-3);
    assertInDelta(groundFault.timeAt(286.7), 60, 1e-3);
    expect(groundFault.label).toBe('C57.109 Category II, frequent faults × 0.577');
    expect(primary.seconds).toEqual(frequent.seconds);
  });

  it('scaleWithstand draws a 208 V cable curve on a 480 V sheet at I · 208/480', () => {
    // hand-worked reflection case (112.5 kVA, 480–208 V): a 10 kA current at 208 V drawn on a 480 V sheet is 4333.33 A
    const cable = cableWithstandOf(cableOf(), { volts: 208 });
    const onSheet = scaleWithstand(cable, { toVolts: 480 });
    assertInDelta(onSheet.timeAt(4333.33), cable.timeAt(10_000), 1e-5);
    assertInDelta(onSheet.amps[0], (cable.amps[0] * 208) / 480, 1e-12);
  });

  it('scaleWithstand rejects a voltage base or factor that is not positive', () => {
    const curve = cableWithstandOf(cableOf(), { volts: 480 });
    expect(() => scaleWithstand(curve, { toVolts: 0 })).toThrow(
      /^options\.toVolts: expected a voltage in V greater than 0, got "0"$/,
    );
    expect(() => scaleWithstand(curve, { toVolts: 480, factor: -1 })).toThrow(
      /^options\.factor: expected a connection factor greater than 0, got "-1"$/,
    );
  });
});
