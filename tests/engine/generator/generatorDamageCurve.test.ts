import { describe, expect, it } from 'vitest';
import {
  ARMATURE_THERMAL_CONSTANT,
  ARMATURE_THERMAL_SECONDS,
  generatorDamageCurve,
} from '../../../src/engine/generator/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { RATED_AMPS, generatorOf } from './fixtures.ts';

describe('generatorDamageCurve', () => {
  it('has the expected defaults', () => {
    expect(ARMATURE_THERMAL_CONSTANT).toBe(37.5); // IEEE C50.13, from memory
    expect(ARMATURE_THERMAL_SECONDS).toEqual({ shortest: 10, longest: 120 });
    const curve = generatorDamageCurve(generatorOf());
    expect(curve.kind).toBe('generator');
    expect(curve.elementId).toBe('G1');
    expect(curve.volts).toBe(480);
    expect(curve.label).toBe('G1 armature short-time thermal capability');
    expect(curve.seconds.length).toBe(16);
    expect(curve.seconds[0]).toBe(120);
    expect(curve.seconds[15]).toBe(10);
  });

  describe('armature short-time thermal capability (I² − 1)·t = 37.5 (IEEE C50.13, from memory)', () => {
    const curve = generatorDamageCurve(generatorOf());

    it('withstands 1.5 × rated for 30 s, the IEC 60034-1 clause 9.3.2 point (from memory): (1.5² − 1) × 30 = 37.5', () => {
      assertInDelta(curve.timeAt(1.5 * RATED_AMPS), 30, 1e-12);
    });

    it('spans 1.14564 × rated at 120 s to 2.17945 × rated at 10 s (computed)', () => {
      assertInDelta(curve.amps[0] / RATED_AMPS, 1.14564, 1e-5);
      assertInDelta(curve.amps[curve.amps.length - 1] / RATED_AMPS, 2.17945, 1e-5);
    });

    it('every drawn point lies on the curve and current rises as time falls', () => {
      curve.seconds.forEach((t, i) => {
        const perUnit = curve.amps[i] / RATED_AMPS;
        assertInDelta((perUnit * perUnit - 1) * t, 37.5, 1e-12);
        assertInDelta(curve.timeAt(curve.amps[i]), t, 1e-9);
        if (i > 0) expect(curve.amps[i]).toBeGreaterThan(curve.amps[i - 1]);
      });
    });

    it('is Infinity below its 120 s current', () => {
      expect(curve.timeAt(1.1 * RATED_AMPS)).toBe(Infinity);
      expect(curve.timeAt(0)).toBe(Infinity);
      expect(curve.timeAt(Number.NaN)).toBe(Infinity);
    });

    it('goes on by its formula past its 10 s current, not held at 10 s: 37.5 / (5² − 1) = 1.5625 s at 5 × rated', () => {
      assertInDelta(curve.timeAt(5 * RATED_AMPS), 1.5625, 1e-12);
      assertInDelta(curve.timeAt(10 * RATED_AMPS), 37.5 / 99, 1e-12);
    });

    it('notes say where the curve comes from', () => {
      expect(curve.notes.join('\n')).toMatch(/IEEE C50\.13 .*from memory/);
      expect(curve.notes.join('\n')).toMatch(/IEC 60034-1 clause 9\.3\.2/);
    });
  });

  describe('user damage points (A, s), straight in log-log between them', () => {
    const curve = generatorDamageCurve(generatorOf({ name: 'Standby 1' }), {
      points: [
        { amps: 6000, seconds: 2 },
        { amps: 1000, seconds: 100 },
        { amps: 2000, seconds: 20 },
      ],
    });

    it('orders the points by current and passes through each', () => {
      expect(Array.from(curve.amps)).toEqual([1000, 2000, 6000]);
      expect(Array.from(curve.seconds)).toEqual([100, 20, 2]);
      expect(curve.timeAt(2000)).toBe(20);
      expect(curve.label).toBe('Standby 1 damage curve (given points)');
    });

    it('interpolates in log-log: halfway in log current between 1000 A and 2000 A is √(100 × 20) s', () => {
      assertInDelta(curve.timeAt(Math.SQRT2 * 1000), Math.sqrt(100 * 20), 1e-12);
    });

    it('is Infinity below the lowest point and goes on at constant I²t beyond the highest (common practice)', () => {
      expect(curve.timeAt(999)).toBe(Infinity);
      assertInDelta(curve.timeAt(60_000), 2 * (6000 / 60_000) ** 2, 1e-12); // 0.02 s, not a held 2 s
    });

    it('rejects times that do not fall as currents rise, naming the field', () => {
      expect(() =>
        generatorDamageCurve(generatorOf(), {
          points: [
            { amps: 1000, seconds: 10 },
            { amps: 2000, seconds: 20 },
          ],
        }),
      ).toThrow(/^options\.points: expected times that fall as currents rise, got /);
      expect(() => generatorDamageCurve(generatorOf(), { points: [{ amps: 1000, seconds: 10 }] })).toThrow(
        /^options\.points: expected at least two damage points/,
      );
      expect(() =>
        generatorDamageCurve(generatorOf(), {
          points: [
            { amps: 1000, seconds: 10 },
            { amps: -2, seconds: 1 },
          ],
        }),
      ).toThrow(/^options\.points\[1\]\.amps: expected a current in A greater than 0, got "-2"$/);
    });
  });
});
