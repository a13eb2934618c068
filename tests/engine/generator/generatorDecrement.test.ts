import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { baseOhmsOf, generatorDecrement, ratedAmpsOf } from '../../../src/engine/generator/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { RATED_AMPS, decrementByHand, generatorOf } from './fixtures.ts';

/**
 * |Z + Re + jXe| for a circuit of reactance `reactance` of `generatorOf()` behind an external impedance, in
 * pu: one armature resistance from X″d at the default X/R 20, Ra = 0.12 / √401 = 0.0059925, and
 * Z = Ra + j√(X² − Ra²), whose magnitude at the terminals is X.
 */
function magnitudeBehind(reactance: number, re: number, xe: number): number {
  const ra = 0.12 / Math.sqrt(401);
  return Math.hypot(ra + re, Math.sqrt(reactance ** 2 - ra ** 2) + xe);
}

describe('generatorDecrement', () => {
  it('has the expected defaults', () => {
    const decrement = generatorDecrement(generatorOf());
    expect(decrement.generatorId).toBe('G1');
    expect(decrement.volts).toBe(480);
    assertInDelta(decrement.ratedAmps, 601.4065, 1e-6); // 500 kVA / (√3 × 480 V)
    // Sampled from half a cycle at 60 Hz to 100 s, 20 points a decade.
    assertInDelta(decrement.seconds[0], 1 / 120, 1e-12);
    expect(decrement.seconds[decrement.seconds.length - 1]).toBe(100);
    expect(decrement.seconds.length).toBe(Math.ceil(Math.log10(100 * 120) * 20) + 1);
    expect(decrement.supported).toBe(false);
    expect(decrement.notes.join('\n')).toMatch(/no load, rated voltage/);
  });

  describe('500 kVA 480 V machine, exponential form worked by hand (IEEE Std 551; standard machine theory)', () => {
    const decrement = generatorDecrement(generatorOf());

    it('at t = 0 the current is the subtransient E/X″d = 1/0.12 = 8.3333 pu = 5011.72 A', () => {
      assertInDelta(decrement.perUnitAt(0), 1 / 0.12, 1e-12);
      assertInDelta(decrement.ampsAt(0), 5011.72, 1e-6);
      assertInDelta(decrement.initialAmps, RATED_AMPS / 0.12, 1e-12);
    });

    it('at t = T″d = 0.015 s: 3.3333·e^−1 + 4.5·e^−0.0375 + 0.5 = 6.06064 pu', () => {
      assertInDelta(decrement.perUnitAt(0.015), 6.06064, 1e-5);
      assertInDelta(decrement.perUnitAt(0.015), decrementByHand(0.015), 1e-12);
    });

    it('at t = T′d = 0.4 s: 2.15546 pu = 1296.31 A', () => {
      assertInDelta(decrement.perUnitAt(0.4), 2.15546, 1e-5);
      assertInDelta(decrement.ampsAt(0.4), 1296.31, 1e-5);
    });

    it('at t = 10 s the current has settled at E/Xd = 0.5 pu (no excitation support)', () => {
      assertInDelta(decrement.perUnitAt(10), 0.5, 1e-9);
      assertInDelta(decrement.sustainedAmps, RATED_AMPS / 2, 1e-12);
    });

    it('the sampled curve is the function at the sampled times and falls with time', () => {
      decrement.seconds.forEach((t, i) => assertInDelta(decrement.amps[i], RATED_AMPS * decrementByHand(t), 1e-12));
      for (let i = 1; i < decrement.amps.length; i++)
        expect(decrement.amps[i]).toBeLessThanOrEqual(decrement.amps[i - 1]);
    });
  });

  describe('excitation support (model: max(decaying term, sustained × rated))', () => {
    const decrement = generatorDecrement(generatorOf({ sustained: 3 }));

    it('holds 3 × rated = 1804.22 A once the decaying term falls below it', () => {
      assertInDelta(decrement.perUnitAt(0.4), 3, 1e-12); // decaying term 2.155 pu < 3
      assertInDelta(decrement.ampsAt(10), 3 * RATED_AMPS, 1e-12);
      assertInDelta(decrement.sustainedAmps, 1804.22, 1e-6);
      expect(decrement.supported).toBe(true);
    });

    it('leaves the current alone while the decaying term is higher (4.00885 pu at 0.1 s)', () => {
      assertInDelta(decrement.perUnitAt(0.1), 4.00885, 1e-5);
      assertInDelta(decrement.perUnitAt(0), 1 / 0.12, 1e-12);
    });

    it('behind Ze the field at ceiling (E = k·Xd = 6 pu) drives 6 / |Zd + j0.2| = 2.72727 pu, not k = 3 (IEEE Std 551, from memory)', () => {
      const behind = generatorDecrement(generatorOf({ sustained: 3 }), { external: { r: 0, x: 0.2 } });
      assertInDelta(behind.perUnitAt(10), 6 / magnitudeBehind(2, 0, 0.2), 1e-12); // min(2.72727, 1/0.2 = 5)
      assertInDelta(6 / magnitudeBehind(2, 0, 0.2), 2.72727, 1e-5); // |0.005993 + j2.199991| = 2.2
      assertInDelta(behind.sustainedAmps, (6 / magnitudeBehind(2, 0, 0.2)) * RATED_AMPS, 1e-12);
      // Resistance adds in the magnitude: 6 / |0.165993 + j2.119991| = 2.82156 pu.
      const lossy = generatorDecrement(generatorOf({ sustained: 3 }), { external: { r: 0.16, x: 0.12 } });
      assertInDelta(lossy.perUnitAt(10), 2.82156, 1e-5);
    });

    it('behind an external impedance the floor is at most 1/|Ze| (rated terminal voltage, a simplification)', () => {
      // A loaded machine (E = 1.1 pu) starts at 1.1 / |Z″ + j2| = 0.518902 pu, above what rated voltage drives through Ze.
      const far = generatorDecrement(generatorOf({ sustained: 3 }), { external: { r: 0, x: 2 }, internalVoltage: 1.1 });
      assertInDelta(far.perUnitAt(10), 0.5, 1e-12); // min(6 / 4 = 1.5, 1/2, 0.518902)
      assertInDelta(far.upperAmpsAt(10), far.ampsAt(10), 1e-12);
    });

    it("far behind a long cable the support holds the subtransient start 1/|Z″ + j2| = 0.471730 pu, and the upper reading takes 1/|Ze| = 0.5 pu above it (the regulator's rise)", () => {
      const far = generatorDecrement(generatorOf({ sustained: 3 }), { external: { r: 0, x: 2 } });
      const start = 1 / magnitudeBehind(0.12, 0, 2);
      assertInDelta(start, 0.47173, 1e-5);
      assertInDelta(far.perUnitAt(0), start, 1e-12);
      assertInDelta(far.perUnitAt(10), start, 1e-12); // min(6 / 4 = 1.5, 1/2 = 0.5, 0.471730)
      assertInDelta(far.sustainedAmps, far.initialAmps, 1e-9);
      expect(far.supported).toBe(true); // above E/|Zd + j2| = 0.25
      // The upper reading, for the upstream device: the whole floor from the start.
      assertInDelta(far.upperAmpsAt(0), 0.5 * RATED_AMPS, 1e-12);
      assertInDelta(far.upperSustainedAmps, 0.5 * RATED_AMPS, 1e-12);
      expect(far.notes.join('\n')).toMatch(
        /the regulator may raise it toward 300\.7 A, on which the upstream device is read/,
      );
      // Nearer, 1/|j0.5| = 2 pu would lift the current above its start 1/|Z″ + j0.5| = 1.61322 pu as well.
      const nearer = generatorDecrement(generatorOf({ sustained: 3 }), { external: { r: 0, x: 0.5 } });
      assertInDelta(nearer.perUnitAt(10), 1 / magnitudeBehind(0.12, 0, 0.5), 1e-12);
      assertInDelta(1 / magnitudeBehind(0.12, 0, 0.5), 1.61322, 1e-5);
      assertInDelta(nearer.upperAmpsAt(10), 2 * RATED_AMPS, 1e-12); // min(6 / 2.5 = 2.4, 1/0.5)
    });
  });

  describe('fault behind an external impedance (one armature resistance from the X/R of X″d, time constants unchanged, common practice)', () => {
    it('Xe = 0.1 pu: 1/|Z″ + j0.1| = 4.54686 pu at t = 0 and 1/|Zd + j0.1| at 10 s', () => {
      const decrement = generatorDecrement(generatorOf(), { external: { r: 0, x: 0.1 } });
      assertInDelta(decrement.perUnitAt(0), 4.54686, 1e-5); // |0.005993 + j0.219850| = 0.219932
      const [x2, x1, x] = [0.12, 0.2, 2].map((reactance) => magnitudeBehind(reactance, 0, 0.1));
      assertInDelta(decrement.perUnitAt(0.4), decrementByHand(0.4, x2, x1, x), 1e-12);
      assertInDelta(decrement.perUnitAt(10), 1 / x, 1e-9);
    });

    it('at the terminals each magnitude is the reactance itself, whatever the X/R', () => {
      for (const xr of [2, 20, 200]) {
        const decrement = generatorDecrement(generatorOf({ xr }));
        assertInDelta(decrement.perUnitAt(0), 1 / 0.12, 1e-12);
        assertInDelta(decrement.perUnitAt(0.4), decrementByHand(0.4), 1e-12);
      }
    });

    it('external resistance enters each magnitude: 1/|(0.05 + 0.005993) + j0.219850| at t = 0', () => {
      const decrement = generatorDecrement(generatorOf(), { external: { r: 0.05, x: 0.1 } });
      assertInDelta(decrement.perUnitAt(0), 1 / magnitudeBehind(0.12, 0.05, 0.1), 1e-12);
      assertInDelta(decrement.perUnitAt(0), 1 / Math.hypot(0.055993, 0.21985), 1e-5);
    });

    it('ohms become per unit on the generator base: 0.04608 Ω at 480 V, 500 kVA is 0.1 pu', () => {
      assertInDelta(baseOhmsOf(generatorOf()), 0.4608, 1e-12); // 480² / 500 000
      const decrement = generatorDecrement(generatorOf(), {
        external: { r: 0, x: 0.04608 / baseOhmsOf(generatorOf()) },
      });
      assertInDelta(decrement.perUnitAt(0), 1 / magnitudeBehind(0.12, 0, 0.1), 1e-12);
    });
  });

  it('a prefault internal voltage scales every term (E = 1.1 pu, loaded machine)', () => {
    const decrement = generatorDecrement(generatorOf(), { internalVoltage: 1.1 });
    assertInDelta(decrement.perUnitAt(0.4), 1.1 * decrementByHand(0.4), 1e-12);
  });

  it('rated current is S / (√3 · V)', () => {
    assertInDelta(ratedAmpsOf({ rating: 2e6, voltage: 4160 }), 277.572, 1e-5); // textbook identity
  });

  describe('bad input names the field', () => {
    it('rejects X′d below X″d', () => {
      expect(() => generatorDecrement(generatorOf({ xdTransient: 0.1 }))).toThrow(
        /^generators\.G1\.xdTransient: expected X′d of at least X″d \(0\.12\), got "0\.1"$/,
      );
    });
    it('rejects Xd below X′d', () => {
      expect(() => generatorDecrement(generatorOf({ xd: 0.15 }))).toThrow(
        /^generators\.G1\.xd: expected Xd of at least X′d/,
      );
    });
    it('rejects a rating that is not a positive number', () => {
      expect(() => generatorDecrement(generatorOf({ rating: -5 }))).toThrow(
        /^generators\.G1\.rating: expected a rating in VA greater than 0, got "-5"$/,
      );
    });
    it('rejects T″d longer than T′d', () => {
      expect(() => generatorDecrement(generatorOf({ tdSubtransient: 1 }))).toThrow(/^generators\.G1\.tdSubtransient: /);
    });
    it('rejects a power factor above 1', () => {
      expect(() => generatorDecrement(generatorOf({ powerFactor: 1.2 }))).toThrow(/^generators\.G1\.powerFactor: /);
    });
    it('rejects a negative external reactance', () => {
      expect(() => generatorDecrement(generatorOf(), { external: { r: 0, x: -0.1 } })).toThrow(
        /^options\.external\.x: expected a reactance in pu of at least 0, got "-0\.1"$/,
      );
    });
    it('rejects a negative time', () => {
      expect(() => generatorDecrement(generatorOf()).ampsAt(-1)).toThrow(RangeError);
    });
  });

  it('never rises, with or without excitation support, behind any external impedance: X″d ≤ X′d ≤ Xd makes every term fall to a constant floor (what the decaying-current check relies on, property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 0.35, noNaN: true }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 0.002, max: 0.05, noNaN: true }),
        fc.double({ min: 1, max: 100, noNaN: true }),
        fc.option(fc.double({ min: 0.5, max: 4, noNaN: true })),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 1, max: 100, noNaN: true }),
        (xdSubtransient, transientFactor, synchronousFactor, tdSubtransient, timeFactor, sustained, r, x, xr) => {
          const xdTransient = xdSubtransient * transientFactor;
          const machine = generatorOf({
            xdSubtransient,
            xdTransient,
            xd: xdTransient * synchronousFactor,
            tdSubtransient,
            tdTransient: tdSubtransient * timeFactor,
            xr,
            ...(sustained === null ? {} : { sustained }),
          });
          const decrement = generatorDecrement(machine, { external: { r, x } });
          let last = decrement.ampsAt(0);
          let lastUpper = decrement.upperAmpsAt(0);
          expect(last).toBeLessThanOrEqual(decrement.initialAmps);
          for (let k = 0; k <= 400; k++) {
            const seconds = 1e-6 * 10 ** (k / 40);
            const now = decrement.ampsAt(seconds);
            const upper = decrement.upperAmpsAt(seconds);
            expect(now).toBeLessThanOrEqual(last);
            // The upper reading never rises either, and is never below the other.
            expect(upper).toBeLessThanOrEqual(lastUpper);
            expect(upper).toBeGreaterThanOrEqual(now);
            last = now;
            lastUpper = upper;
          }
        },
      ),
      { seed: 70_103, numRuns: 200 },
    );
  });
});
