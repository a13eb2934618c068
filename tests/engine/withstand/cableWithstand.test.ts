import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  CABLE_OVERLOAD_NOTE,
  cableWithstandOf,
  ICEA_CONDUCTOR,
  ICEA_TEMPERATURES,
} from '../../../src/engine/withstand/cableWithstand.ts';
import { assertInDelta } from '../../asserts.ts';
import { cableOf } from './fixtures.ts';

/** The drawn current at a time the polyline carries exactly (10, 1, 0.1, 0.01 s). */
function ampsAtDrawnTime(curve: { amps: Float64Array; seconds: Float64Array }, seconds: number): number {
  const i = curve.seconds.findIndex((t) => Math.abs(t - seconds) <= 1e-12 * seconds);
  expect(i, `a drawn point at ${seconds} s`).toBeGreaterThanOrEqual(0);
  return curve.amps[i];
}

describe('cableWithstandOf', () => {
  it('has the expected defaults', () => {
    // ICEA P-32-382 constants (as cable makers restate them): Cu K 0.0297 λ 234; Al K 0.0125 λ 228
    expect(ICEA_CONDUCTOR.copper).toMatchObject({ k: 0.0297, lambda: 234 });
    expect(ICEA_CONDUCTOR.aluminium).toMatchObject({ k: 0.0125, lambda: 228 });
    expect(ICEA_TEMPERATURES).toEqual({ thermoplastic: [75, 150], xlpe: [90, 250], 'epr-105': [105, 250] });
    const curve = cableWithstandOf(cableOf(), { volts: 480 });
    expect(curve.kind).toBe('cable');
    expect(curve.elementId).toBe('C1');
    expect(curve.volts).toBe(480);
    expect(curve.label).toBe('ICEA P-32-382 short-circuit limit, 4/0 Cu 90 to 250 °C');
    expect(Array.from(curve.seconds)).toEqual([10, 1, 0.1, 0.01]);
  });

  describe('ICEA P-32-382 cable points, worked by hand (computed)', () => {
    it('cableWithstandOf(4/0 Cu XLPE) withstands 15 224.5 A for 1 s, 48 144.1 A for 0.1 s and 117 928 A for one cycle', () => {
      // ICEA P-32-382 (computed by hand): 211 600 cmil, 90→250 °C
      const curve = cableWithstandOf(cableOf({ size: '4/0' }), { volts: 480 });
      assertInDelta(ampsAtDrawnTime(curve, 1), 15_224.5, 1e-5);
      assertInDelta(ampsAtDrawnTime(curve, 0.1), 48_144.1, 1e-5);
      assertInDelta(curve.timeAt(117_928), 1 / 60, 1e-5);
    });

    it('cableWithstandOf(4/0 Cu XLPE) withstands 30 kA for 0.25754 s', () => {
      // t = 0.0297 · log10(484/324) · (211 600/30 000)² (computed)
      const curve = cableWithstandOf(cableOf({ size: '4/0' }), { volts: 480 });
      assertInDelta(curve.timeAt(30_000), 0.25754, 1e-5);
      assertInDelta(curve.timeAt(30_000), 0.0297 * Math.log10(484 / 324) * (211_600 / 30_000) ** 2, 1e-12);
    });

    it('cableWithstandOf(500 kcmil Al XLPE) withstands 33 260.4 A for 0.5 s', () => {
      const curve = cableWithstandOf(cableOf({ size: '500 kcmil', material: 'aluminium' }), { volts: 480 });
      assertInDelta(curve.timeAt(33_260.4), 0.5, 1e-5);
      expect(curve.label).toBe('ICEA P-32-382 short-circuit limit, 500 kcmil Al 90 to 250 °C');
    });

    it('cableWithstandOf(500 kcmil Cu XLPE) withstands 25 438.0 A for 2 s', () => {
      const curve = cableWithstandOf(cableOf({ size: '500 kcmil' }), { volts: 480 });
      assertInDelta(curve.timeAt(25_438.0), 2, 1e-5);
    });

    it('cableWithstandOf(2/0 Cu thermoplastic) withstands 22 283.3 A for 0.1 s', () => {
      const curve = cableWithstandOf(cableOf({ size: '2/0', insulation: 'thermoplastic' }), { volts: 208 });
      assertInDelta(ampsAtDrawnTime(curve, 0.1), 22_283.3, 1e-5);
      expect(curve.label).toBe('ICEA P-32-382 short-circuit limit, 2/0 Cu 75 to 150 °C');
    });
  });

  it('cableWithstandOf meets the published coefficients c in I = c · A / √t', () => {
    // Coefficients c in I = c · A / √t (computed; Cu and Al 90→250 °C published values confirmed)
    const c = (input: Parameters<typeof cableOf>[0]) =>
      ampsAtDrawnTime(cableWithstandOf(cableOf({ size: '1000 kcmil', ...input }), { volts: 480 }), 1) / 1e6;
    assertInDelta(c({}), 0.07195, 1e-4);
    assertInDelta(c({ material: 'aluminium' }), 0.04704, 1e-4);
    assertInDelta(c({ insulation: 'epr-105' }), 0.06777, 1e-4);
    assertInDelta(c({ insulation: 'thermoplastic' }), 0.05294, 1e-4);
    assertInDelta(c({ material: 'aluminium', insulation: 'thermoplastic' }), 0.03465, 1e-4);
  });

  it('cableWithstandOf multiplies the area by the parallel sets', () => {
    // A feeder of 2 sets of 500 kcmil Cu = 1 000 000 cmil; at 1 s: 0.07195 × 10⁶ (computed)
    const curve = cableWithstandOf(cableOf({ size: '500 kcmil', sets: 2 }), { volts: 480 });
    assertInDelta(ampsAtDrawnTime(curve, 1), 71_950, 1e-4);
    expect(curve.label).toBe('ICEA P-32-382 short-circuit limit, 2 × 500 kcmil Cu 90 to 250 °C');
  });

  it('cableWithstandOf takes the conductor area as an option when the size text should not set it', () => {
    const curve = cableWithstandOf(cableOf({ size: '4/0' }), { volts: 480, conductorAreaCmil: 250_000 });
    assertInDelta(ampsAtDrawnTime(curve, 1), Math.sqrt(0.0297 * Math.log10(484 / 324)) * 250_000, 1e-12);
    expect(curve.notes.some((note) => /area given/.test(note))).toBe(true);
  });

  it('cableWithstandOf is Infinity below its 10 s current and holds 0.01 s beyond its half-cycle current', () => {
    const curve = cableWithstandOf(cableOf(), { volts: 480 });
    const at10 = curve.amps[0];
    expect(curve.timeAt(at10 * 0.999)).toBe(Infinity);
    assertInDelta(curve.timeAt(at10), 10, 1e-12);
    assertInDelta(curve.timeAt(1e7), 0.01, 1e-12);
    expect(curve.timeAt(Number.NaN)).toBe(Infinity);
  });

  it('cableWithstandOf is a short-circuit limit only: nothing below the 10 s current, and it says so', () => {
    const curve = cableWithstandOf(cableOf(), { volts: 480 });
    const at10 = 211_600 * Math.sqrt((0.0297 * Math.log10(484 / 324)) / 10); // 4814.4 A (computed)
    expect(curve.timeAt(at10 * (1 - 1e-9))).toBe(Infinity);
    expect(curve.timeAt(at10 / 3)).toBe(Infinity); // the overload region is left to the ampacity rules
    expect(Math.max(...curve.seconds)).toBe(10);
    expect(curve.notes.at(-1)).toBe(CABLE_OVERLOAD_NOTE);
    expect(CABLE_OVERLOAD_NOTE).toMatch(/overload region beyond 10 s is not covered/);
    expect(() => cableWithstandOf(cableOf(), { volts: 480, longestSeconds: 60 })).toThrow(
      /^options\.longestSeconds: expected a time of at most 10 s \(a short-circuit limit only\), got "60"$/,
    );
  });

  it('cableWithstandOf draws between other times when asked', () => {
    const curve = cableWithstandOf(cableOf(), { volts: 480, longestSeconds: 5, shortestSeconds: 1 / 60 });
    expect(Array.from(curve.seconds)).toEqual([5, 1, 0.1, 1 / 60]);
  });

  describe('bad input', () => {
    it('cableWithstandOf rejects a missing or non-positive voltage', () => {
      expect(() => cableWithstandOf(cableOf(), {} as { volts: number })).toThrow(
        /^options\.volts: expected a voltage in V greater than 0, got nothing$/,
      );
      expect(() => cableWithstandOf(cableOf(), { volts: -480 })).toThrow(
        /^options\.volts: expected a voltage in V greater than 0, got "-480"$/,
      );
    });

    it('cableWithstandOf rejects a size it cannot read, naming the cable field', () => {
      expect(() => cableWithstandOf(cableOf({ size: 'big' }), { volts: 480 })).toThrow(
        /^cables\.C1\.size: expected a conductor size such as "4\/0", "12 AWG" or "500 kcmil", got "big"$/,
      );
    });

    it('cableWithstandOf rejects a bad area, sets count or insulation', () => {
      expect(() => cableWithstandOf(cableOf(), { volts: 480, conductorAreaCmil: 0 })).toThrow(
        /^options\.conductorAreaCmil: expected an area in cmil greater than 0, got "0"$/,
      );
      expect(() => cableWithstandOf({ ...cableOf(), sets: 1.5 }, { volts: 480 })).toThrow(
        /^cables\.C1\.sets: expected a whole number of at least 1, got "1\.5"$/,
      );
      expect(() => cableWithstandOf({ ...cableOf(), insulation: 'paper' as 'xlpe' }, { volts: 480 })).toThrow(
        /^cables\.C1\.insulation: expected "thermoplastic", "xlpe" or "epr-105", got "paper"$/,
      );
      expect(() => cableWithstandOf(cableOf(), { volts: 480, longestSeconds: 0.001 })).toThrow(
        /^options\.longestSeconds: expected a time in s greater than 0\.01, got "0\.001"$/,
      );
    });
  });

  describe('properties', () => {
    const material = fc.constantFrom('copper' as const, 'aluminium' as const);
    const insulation = fc.constantFrom('thermoplastic' as const, 'xlpe' as const, 'epr-105' as const);

    it('cableWithstandOf current scales with the area and with 1/√t (property)', () => {
      fc.assert(
        fc.property(
          material,
          insulation,
          fc.double({ min: 4000, max: 2e6, noNaN: true }),
          fc.double({ min: 1.01, max: 8, noNaN: true }),
          fc.double({ min: 0.0101, max: 9.9, noNaN: true }),
          (m, ins, area, k, seconds) => {
            const one = cableWithstandOf(cableOf({ material: m, insulation: ins }), {
              volts: 480,
              conductorAreaCmil: area,
            });
            const bigger = cableWithstandOf(cableOf({ material: m, insulation: ins }), {
              volts: 480,
              conductorAreaCmil: area * k,
            });
            const amps = one.amps[1]; // the 1 s current
            // same time at k times the current for k times the area; I·√t constant along the line
            const sameTime = Math.abs(bigger.timeAt(amps * k) - one.timeAt(amps)) <= 1e-9 * one.timeAt(amps);
            const scaled = one.timeAt(amps / Math.sqrt(seconds));
            return sameTime && Math.abs(scaled - seconds) <= 1e-9 * seconds;
          },
        ),
        { numRuns: 300 },
      );
    });

    it('cableWithstandOf is non-increasing in current and never NaN (property)', () => {
      fc.assert(
        fc.property(
          material,
          insulation,
          fc.double({ min: 0, max: 1e7, noNaN: true }),
          fc.double({ min: 0, max: 1e7, noNaN: true }),
          (m, ins, a, b) => {
            const curve = cableWithstandOf(cableOf({ material: m, insulation: ins }), { volts: 480 });
            const [low, high] = a <= b ? [a, b] : [b, a];
            const tLow = curve.timeAt(low);
            const tHigh = curve.timeAt(high);
            return !Number.isNaN(tLow) && !Number.isNaN(tHigh) && tHigh <= tLow;
          },
        ),
        { numRuns: 300 },
      );
    });
  });
});
