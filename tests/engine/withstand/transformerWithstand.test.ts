import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { MECHANICAL_FRACTION, transformerWithstandOf } from '../../../src/engine/withstand/transformerWithstand.ts';
import type { WithstandCurve } from '../../../src/engine/withstand/withstand.ts';
import { assertInDelta } from '../../asserts.ts';
import { transformerOf } from './fixtures.ts';

/** Rated current of the hand-worked Category II unit at 480 V and 13.8 kV (hand-worked IEEE C57.109 Category II case, computed). */
const BASE_480 = 2_500_000 / (Math.sqrt(3) * 480);
const TO_13_8_KV = 480 / 13_800;

/** The index of the first point of a vertical step (two points at one current), or -1. */
function stepIndex(curve: WithstandCurve): number {
  for (let i = 1; i < curve.amps.length; i++) if (curve.amps[i] === curve.amps[i - 1]) return i - 1;
  return -1;
}

describe('transformerWithstandOf', () => {
  it('has the expected defaults', () => {
    const curve = transformerWithstandOf(transformerOf());
    // the study's default duty is infrequent faults; currents at the secondary winding
    expect(curve.label).toBe('C57.109 Category II, infrequent faults');
    expect(curve.kind).toBe('transformer');
    expect(curve.elementId).toBe('T1');
    expect(curve.volts).toBe(480);
    expect(MECHANICAL_FRACTION).toEqual({ II: 0.7, III: 0.5, IV: 0.5 });
    expect(stepIndex(curve)).toBe(-1);
    expect(curve.notes.some((note) => /continuous rule is a choice/.test(note))).toBe(true);
  });

  describe('hand-worked IEEE C57.109 Category II case: 2500 kVA, 13.8 kV–480 V, 5.75 %Z, Category II', () => {
    // IEEE C57.109 and the hand-worked Category II case (computed); the thermal table points are C57.109 Table 1 (from memory)
    const frequent = transformerWithstandOf(transformerOf({ faultFrequency: 'frequent' }));
    const infrequent = transformerWithstandOf(transformerOf({ faultFrequency: 'infrequent' }));
    /** The hand-worked Category II table's currents are at 13.8 kV; the curve is at 480 V. */
    const at13kV = (curve: WithstandCurve, amps13kV: number) => curve.timeAt(amps13kV / TO_13_8_KV);

    it('transformerWithstandOf(Category II) passes the thermal table rows at 13.8 kV', () => {
      for (const curve of [frequent, infrequent]) {
        assertInDelta(at13kV(curve, 209.185), 1800, 1e-5);
        assertInDelta(at13kV(curve, 313.777), 300, 1e-5);
        assertInDelta(at13kV(curve, 496.814), 60, 1e-5);
        assertInDelta(at13kV(curve, 658.932), 30, 1e-5);
        assertInDelta(at13kV(curve, 1169.374), 10, 1e-5); // thermal join, IEEE C57.109 rule (table lists 11.3 pu)
        assertInDelta(curve.timeAt(5 * BASE_480), 52.902, 1e-5); // IEEE C57.109 check value (computed)
        assertInDelta(curve.timeAt(8 * BASE_480), 18.985, 1e-4);
      }
    });

    it('transformerWithstandOf(Category II, frequent) drops vertically at 0.7 · I_max from 8.43431 s to 4.08163 s', () => {
      const i = stepIndex(frequent);
      expect(i).toBeGreaterThan(0);
      assertInDelta(frequent.amps[i] * TO_13_8_KV, 1273.299, 1e-6);
      assertInDelta(frequent.amps[i] / BASE_480, 12.1739, 1e-5);
      assertInDelta(frequent.seconds[i], 8.43431, 1e-5);
      assertInDelta(frequent.seconds[i + 1], 4.08163, 1e-5);
      // at the step itself the lower (conservative) time is returned
      assertInDelta(frequent.timeAt(frequent.amps[i]), 4.08163, 1e-5);
      assertInDelta(frequent.timeAt(frequent.amps[i] * (1 - 1e-9)), 8.43431, 1e-5);
    });

    it('transformerWithstandOf(Category II, frequent) ends on the mechanical curve at (I_max, 2 s)', () => {
      const last = frequent.amps.length - 1;
      assertInDelta(frequent.amps[last] * TO_13_8_KV, 1818.999, 1e-6);
      assertInDelta(frequent.amps[last], 52_296.2, 1e-6);
      assertInDelta(frequent.seconds[last], 2, 1e-12);
      assertInDelta(at13kV(frequent, 1818.999), 2.0, 1e-5);
      // K = 2 · 17.3913² = 604.915 pu²·s: t = K / I² between the step and I_max
      assertInDelta(frequent.timeAt(15 * BASE_480), 604.915 / 225, 1e-5);
      expect(frequent.notes.some((note) => /K = 2·I_max² = 604\.915 pu²·s/.test(note))).toBe(true);
    });

    it('transformerWithstandOf(Category II, infrequent) ends on the thermal curve at 1250 / I_max² = 4.13281 s', () => {
      const last = infrequent.amps.length - 1;
      assertInDelta(infrequent.amps[last] * TO_13_8_KV, 1818.999, 1e-6);
      assertInDelta(infrequent.seconds[last], 4.13281, 1e-5);
      assertInDelta(at13kV(infrequent, 1273.299), 8.43431, 1e-5);
    });

    it('transformerWithstandOf holds the last time beyond I_max and is Infinity below 2 pu', () => {
      assertInDelta(frequent.timeAt(100_000), 2, 1e-12);
      assertInDelta(infrequent.timeAt(Infinity), 4.13281, 1e-5);
      expect(frequent.timeAt(1.99 * BASE_480)).toBe(Infinity);
      expect(frequent.timeAt(0)).toBe(Infinity);
      expect(frequent.timeAt(Number.NaN)).toBe(Infinity);
    });

    it('transformerWithstandOf draws log-spaced points with exact corners at the table points', () => {
      for (const curve of [frequent, infrequent]) {
        assertInDelta(curve.amps[0] / BASE_480, 2, 1e-12);
        assertInDelta(curve.seconds[0], 1800, 1e-9);
        for (const pu of [3, 4.75, 6.3, Math.sqrt(125)]) {
          expect(
            curve.amps.some((a) => Math.abs(a / BASE_480 - pu) < 1e-9),
            `corner at ${pu} pu`,
          ).toBe(true);
        }
        for (let i = 1; i < curve.amps.length; i++) {
          expect(curve.amps[i]).toBeGreaterThanOrEqual(curve.amps[i - 1]);
          expect(curve.seconds[i]).toBeLessThanOrEqual(curve.seconds[i - 1]);
          expect(Math.log10(curve.amps[i] / curve.amps[i - 1])).toBeLessThanOrEqual(1 / 32 + 1e-12);
        }
        expect(curve.amps.length).toBeGreaterThan(25);
      }
    });

    it('transformerWithstandOf agrees with its own polyline at every drawn point below the step', () => {
      for (const curve of [frequent, infrequent]) {
        const i = stepIndex(curve);
        for (let k = 0; k < curve.amps.length; k++) {
          if (k === i) continue; // the top of the vertical step; timeAt returns the lower time there
          assertInDelta(curve.timeAt(curve.amps[k]), curve.seconds[k], 1e-9, `point ${k}`);
        }
      }
    });
  });

  it('transformerWithstandOf(Category III) uses I_max = 1/(Z_T + Z_S) and the mechanical curve from 0.5 · I_max', () => {
    // hand-worked IEEE C57.109 Category II case Category III example (computed): 10 MVA, Z_T 8 %, Z_S 1 % → I_max 11.1111 pu, K 246.914;
    // at 0.5 · I_max = 5.5556 pu: mechanical 8.000 s, thermal 40.848 s. Voltages invented: 69 kV–13.8 kV.
    const unit = { rating: '10 MVA', primary: '69 kV', secondary: '13.8 kV', impedance: 8 };
    const base = 10e6 / (Math.sqrt(3) * 13_800);
    const frequent = transformerWithstandOf(transformerOf({ ...unit, faultFrequency: 'frequent' }), {
      sourceImpedancePu: 0.01,
    });
    const infrequent = transformerWithstandOf(transformerOf(unit), { sourceImpedancePu: 0.01 });
    expect(frequent.label).toBe('C57.109 Category III, frequent faults');
    const i = stepIndex(frequent);
    assertInDelta(frequent.amps[i] / base, 5.5556, 1e-4);
    assertInDelta(frequent.seconds[i], 40.848, 1e-4);
    assertInDelta(frequent.seconds[i + 1], 8.0, 1e-9);
    assertInDelta(frequent.amps[frequent.amps.length - 1] / base, 11.1111, 1e-5);
    assertInDelta(frequent.seconds[frequent.seconds.length - 1], 2, 1e-12);
    assertInDelta(frequent.timeAt(10 * base), 246.914 / 100, 1e-5);
    assertInDelta(infrequent.timeAt((50 / 9) * base), 40.848, 1e-4);
    // I_max = 11.111 pu lies below the 11.180 pu join: log-log between 6.3 pu/30 s and 11.180 pu/10 s (computed)
    const tail = Math.exp(
      Math.log(30) + (Math.log(100 / 9 / 6.3) / Math.log(Math.sqrt(125) / 6.3)) * Math.log(10 / 30),
    );
    assertInDelta(infrequent.seconds[infrequent.seconds.length - 1], tail, 1e-9);
    assertInDelta(tail, 10.1197, 1e-5);
  });

  it('transformerWithstandOf(Category I) is one curve ending at I_max, whatever the fault frequency', () => {
    // hand-worked IEEE C57.109 Category II case Category I example (computed): 300 kVA, 4.5 % → I_max 22.222 pu, curve ends at 2.5313 s
    const base = 300_000 / (Math.sqrt(3) * 480);
    for (const faultFrequency of ['frequent', 'infrequent'] as const) {
      const curve = transformerWithstandOf(transformerOf({ rating: 300, impedance: 4.5 }), { faultFrequency });
      expect(curve.label).toBe('C57.109 Category I');
      expect(stepIndex(curve)).toBe(-1);
      const last = curve.amps.length - 1;
      assertInDelta(curve.amps[last] / base, 22.222, 1e-4);
      assertInDelta(curve.seconds[last], 2.5313, 1e-4);
    }
  });

  it('transformerWithstandOf(Category I, Z_T < 4 %) continues I²t = 1250 below 2 s to I_max', () => {
    // IEEE C57.109 Category I extension, IEEE C57.109 (from memory): 300 kVA, 3 % → I_max 33.333 pu, 1.125 s (computed)
    const curve = transformerWithstandOf(transformerOf({ rating: 300, impedance: 3 }));
    const base = 300_000 / (Math.sqrt(3) * 480);
    assertInDelta(curve.timeAt(30 * base), 1250 / 900, 1e-9);
    assertInDelta(curve.seconds[curve.seconds.length - 1], 1.125, 1e-9);
    expect(curve.notes.some((note) => /Z_T < 4 %/.test(note))).toBe(true);
  });

  it('transformerWithstandOf(Category IV) always uses the frequent-fault construction with f = 0.5', () => {
    // IEEE C57.109 Category IV, IEEE C57.109 (from memory); 40 MVA, 10 %, Z_S 0 → I_max 10 pu, step at 5 pu, 8 s
    const curve = transformerWithstandOf(
      transformerOf({ rating: '40 MVA', primary: '115 kV', secondary: '13.8 kV', impedance: 10 }),
      {
        faultFrequency: 'infrequent',
      },
    );
    expect(curve.label).toBe('C57.109 Category IV, frequent faults');
    const i = stepIndex(curve);
    assertInDelta(curve.amps[i] / (40e6 / (Math.sqrt(3) * 13_800)), 5, 1e-12);
    assertInDelta(curve.seconds[i + 1], 8, 1e-12);
  });

  it('transformerWithstandOf(Category II) ignores the source impedance (I_max = 1/Z_T) and says so', () => {
    const curve = transformerWithstandOf(transformerOf({ faultFrequency: 'frequent' }), { sourceImpedancePu: 0.02 });
    assertInDelta(curve.amps[curve.amps.length - 1], 52_296.2, 1e-6);
    expect(curve.notes.some((note) => /source impedance not used/.test(note))).toBe(true);
  });

  it('transformerWithstandOf lets the mechanical fraction be set', () => {
    const curve = transformerWithstandOf(transformerOf({ faultFrequency: 'frequent' }), { mechanicalFraction: 0.6 });
    const i = stepIndex(curve);
    assertInDelta(curve.amps[i] / BASE_480, 0.6 / 0.0575, 1e-12);
    assertInDelta(curve.seconds[i + 1], 2 / 0.36, 1e-12); // t = 2 / f² at f · I_max (IEEE C57.109)
  });

  it('transformerWithstandOf(Category II, Z_T < 4 %, frequent) lets the thermal curve govern where the mechanical one lies above it', () => {
    // K = 2 · I_max² ≥ 1250 once I_max ≥ 25 pu, so K/I² is above I²t = 1250 (IEEE C57.109, computed)
    const curve = transformerWithstandOf(transformerOf({ rating: 1000, impedance: 3.5, faultFrequency: 'frequent' }));
    const base = 1e6 / (Math.sqrt(3) * 480);
    expect(stepIndex(curve)).toBe(-1);
    assertInDelta(curve.timeAt(20 * base), 1250 / 400, 1e-12);
    expect(curve.notes.some((note) => /thermal curve governs/.test(note))).toBe(true);
  });

  it('transformerWithstandOf builds a single-phase unit on S / V', () => {
    const curve = transformerWithstandOf(
      transformerOf({ rating: 167, phases: 1, primary: 7200, secondary: 240, impedance: 2.5 }),
    );
    assertInDelta(curve.amps[0], 2 * (167_000 / 240), 1e-12);
    assertInDelta(curve.amps[curve.amps.length - 1], 40 * (167_000 / 240), 1e-12);
  });

  describe('dry-type (IEEE C57.12.59)', () => {
    it('transformerWithstandOf(dry) starts at 100 s, follows I²t = 1250 and asks to verify against C57.12.59', () => {
      // IEEE C57.12.59 (from memory): thermal I²t = 1250 from 2 s to 100 s; mechanical fractions unconfirmed
      const curve = transformerWithstandOf(
        transformerOf({ rating: 1000, construction: 'dry', faultFrequency: 'frequent' }),
      );
      const base = 1e6 / (Math.sqrt(3) * 480);
      expect(curve.label).toBe('C57.12.59 Category II (dry-type), frequent faults');
      assertInDelta(curve.amps[0] / base, Math.sqrt(12.5), 1e-12);
      assertInDelta(curve.seconds[0], 100, 1e-12);
      expect(curve.timeAt(3.5 * base)).toBe(Infinity);
      assertInDelta(curve.timeAt(5 * base), 50, 1e-12);
      const i = stepIndex(curve);
      assertInDelta(curve.amps[i] / base, 0.7 / 0.0575, 1e-12); // liquid-immersed default f = 0.7
      assertInDelta(curve.seconds[i + 1], 2 / 0.49, 1e-12);
      expect(curve.notes.some((note) => /verify against C57\.12\.59/.test(note))).toBe(true);
    });

    it('transformerWithstandOf(dry, Category I, 3.5 %) continues past 25 pu to I_max and notes the 25 × limit', () => {
      // demo-style 112.5 kVA 480–208Y/120 V dry-type, 3.5 %Z (invented): I_max 28.571 pu, 1250/I_max² = 1.53125 s (computed)
      const curve = transformerWithstandOf(
        transformerOf({ rating: 112.5, primary: 480, secondary: 208, impedance: 3.5, construction: 'dry' }),
      );
      expect(curve.label).toBe('C57.12.59 Category I (dry-type)');
      assertInDelta(curve.seconds[curve.seconds.length - 1], 1.53125, 1e-9);
      expect(curve.notes.some((note) => /at most 25 × rated current/.test(note))).toBe(true);
    });

    it('transformerWithstandOf(dry) takes a dry-type mechanical fraction as a parameter', () => {
      const curve = transformerWithstandOf(
        transformerOf({ rating: 1000, construction: 'dry', faultFrequency: 'frequent' }),
        { mechanicalFraction: 0.5 },
      );
      const i = stepIndex(curve);
      assertInDelta(curve.seconds[i + 1], 8, 1e-12);
    });
  });

  describe('bad input', () => {
    it('transformerWithstandOf rejects an impedance that is not positive', () => {
      expect(() => transformerWithstandOf({ ...transformerOf(), impedance: -5 })).toThrow(
        /^transformers\.T1\.impedance: expected a percentage greater than 0, got "-5"$/,
      );
    });

    it('transformerWithstandOf rejects a denormal impedance, whose through-fault current is infinite', () => {
      expect(() => transformerWithstandOf({ ...transformerOf(), impedance: 1e-310 })).toThrow(
        /^transformers\.T1\.impedance: expected a percentage of at least 1e-9, got "1e-310"$/,
      );
    });

    it('transformerWithstandOf rejects an impedance so large the curve would end before it starts', () => {
      expect(() => transformerWithstandOf({ ...transformerOf(), impedance: 60 })).toThrow(
        /^transformers\.T1\.impedance: expected a percentage giving a maximum through-fault current above 2 pu, got "60"$/,
      );
    });

    it('transformerWithstandOf rejects a negative source impedance, an unknown duty and a fraction above 1', () => {
      expect(() => transformerWithstandOf(transformerOf(), { sourceImpedancePu: -0.01 })).toThrow(
        /^options\.sourceImpedancePu: expected a per-unit impedance of at least 0, got "-0\.01"$/,
      );
      expect(() => transformerWithstandOf(transformerOf(), { faultFrequency: 'often' as 'frequent' })).toThrow(
        /^options\.faultFrequency: expected "frequent" or "infrequent", got "often"$/,
      );
      expect(() =>
        transformerWithstandOf(transformerOf(), { faultFrequency: 'frequent', mechanicalFraction: 1.5 }),
      ).toThrow(/^options\.mechanicalFraction: expected a fraction greater than 0 and at most 1, got "1\.5"$/);
    });

    it('transformerWithstandOf rejects a secondary voltage that is not positive', () => {
      expect(() => transformerWithstandOf({ ...transformerOf(), secondary: 0 })).toThrow(
        /^transformers\.T1\.secondary: expected a voltage in V greater than 0, got "0"$/,
      );
    });
  });

  it('transformerWithstandOf is non-increasing in current and never NaN, for any unit (property)', () => {
    const unit = fc.record({
      kva: fc.double({ min: 5, max: 60_000, noNaN: true }),
      impedance: fc.double({ min: 1.5, max: 20, noNaN: true }),
      phases: fc.constantFrom(1 as const, 3 as const),
      construction: fc.constantFrom('liquid' as const, 'dry' as const),
      faultFrequency: fc.constantFrom('frequent' as const, 'infrequent' as const),
      sourceImpedancePu: fc.double({ min: 0, max: 0.05, noNaN: true }),
    });
    const current = fc.oneof(fc.double({ min: 0, max: 1e6, noNaN: true }), fc.constant(Infinity));
    fc.assert(
      fc.property(unit, current, current, (u, a, b) => {
        const curve = transformerWithstandOf(
          transformerOf({
            rating: u.kva,
            impedance: u.impedance,
            phases: u.phases,
            construction: u.construction,
            faultFrequency: u.faultFrequency,
          }),
          { sourceImpedancePu: u.sourceImpedancePu },
        );
        const [low, high] = a <= b ? [a, b] : [b, a];
        const tLow = curve.timeAt(low);
        const tHigh = curve.timeAt(high);
        if (Number.isNaN(tLow) || Number.isNaN(tHigh) || tHigh > tLow) return false;
        for (let i = 1; i < curve.amps.length; i++) {
          if (!(curve.amps[i] >= curve.amps[i - 1]) || !(curve.seconds[i] <= curve.seconds[i - 1])) return false;
        }
        return curve.seconds.every((t) => Number.isFinite(t) && t > 0);
      }),
      { numRuns: 300 },
    );
  });
});
