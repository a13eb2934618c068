import { describe, expect, it } from 'vitest';
import { asymmetryOf } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('asymmetryOf', () => {
  it('has the expected defaults', () => {
    // All reactance: the limits √3 (RMS) and 2√2 (peak).
    const limit = asymmetryOf(Infinity);
    assertInDelta(limit.rms, Math.sqrt(3), 1e-12);
    assertInDelta(limit.peak, 2 * Math.SQRT2, 1e-12);
  });

  it.each([
    [4.9, 1.2469, 2.1591],
    [6.6, 1.3311, 2.2928],
    [15, 1.5217, 2.5612],
  ])('X/R %d gives RMS %d and peak %d, R-L circuit asymmetry formula (textbook), hand calculation', (xr, rms, peak) => {
    assertInDelta(asymmetryOf(xr).rms, rms, 1e-4);
    assertInDelta(asymmetryOf(xr).peak, peak, 1e-4);
  });

  it('the demo secondary at X/R 6.300 is 1.31825 × 28 421 A = 37 466 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const xr = 0.06269693 / 0.00995121; // Z_tot of the 1500 kVA demo unit on 250 MVA, X/R 6.300
    assertInDelta(asymmetryOf(xr).rms, 1.31825, 1e-5);
    assertInDelta(asymmetryOf(xr).rms * 28421.1, 37466, 1e-4);
  });

  it('refuses an X/R that is not positive', () => {
    expect(() => asymmetryOf(0)).toThrow(/^expected an X\/R ratio greater than 0, got "0"$/);
  });
});
