import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { lockedRotorAmpsFromCode } from '../../../src/engine/withstand/lockedRotorCode.ts';
import { motorStartingOf, startingPointsOf, STARTING_TIMES } from '../../../src/engine/withstand/motorStarting.ts';
import { assertInDelta } from '../../asserts.ts';
import { motorOf } from './fixtures.ts';

describe('motorStartingOf', () => {
  it('has the expected defaults', () => {
    // Common practice: LRA 6 × FLA without data, 1.6 × LRA asymmetrical, service factor 1.0
    expect(STARTING_TIMES).toEqual({ halfCycle: 0.01, asymmetricalUntil: 0.1, longest: 1000 });
    const { curve, lockedRotor, fullLoadAmps } = motorStartingOf(motorOf(), 460);
    const fla = 124; // 100 hp at 460 V: NFPA 70 Table 430.250 (2008 edition, confirmed against a reproduction)
    assertInDelta(fullLoadAmps, fla, 1e-12);
    expect(curve.notes[0]).toMatch(/FLA 124 A at 460 V \(NFPA 70 Table 430\.250, 100 hp at 460 V\)/);
    expect(Array.from(curve.seconds)).toEqual([0.01, 0.1, 0.1, 5, 5, 1000]);
    const expected = [1.6 * 6 * fla, 1.6 * 6 * fla, 6 * fla, 6 * fla, fla, fla];
    curve.amps.forEach((amps, i) => assertInDelta(amps, expected[i], 1e-12));
    expect(curve.volts).toBe(460);
    expect(lockedRotor).toMatchObject({ kind: 'locked-rotor', volts: 460, seconds: 5, elementId: 'M1' });
    assertInDelta(lockedRotor.amps, 6 * fla, 1e-12);
  });

  it('reads the locked-rotor current from a code letter on the motor, in place of the multiple', () => {
    // The §7.9 motor below with its code letter G on the study: 6.29 kVA/hp · 100 hp at 460 V = 789.46 A,
    // on a 480 V bus too: the letter is read at the motor's rated voltage, as its full-load current is.
    const motor = motorOf({ fullLoadAmps: 124, accelerationTime: 8, codeLetter: 'G', lockedRotor: 9 });
    const { lockedRotor, curve } = motorStartingOf(motor, 460);
    assertInDelta(lockedRotor.amps, 789.46, 1e-5);
    assertInDelta(motorStartingOf(motor, 480).lockedRotor.amps, 789.46, 1e-5);
    expect(curve.notes).toContain(
      "LRA 789.5 A from code letter G: 6.29 kVA per hp, the letter's upper value (NFPA 70 Table 430.7(B)), × 100 hp at 460 V",
    );
    // Single-phase, 5 hp, code K at 230 V: 8.99 · 5 · 1000 / 230 = 195.43 A (no √3 across one phase);
    // on a 480 V bus at 480 V, as its full-load current is (Table 430.248 has no 460 V column).
    assertInDelta(
      motorStartingOf(motorOf({ hp: 5, phases: 1, codeLetter: 'K' }), 480).lockedRotor.amps,
      (8.99 * 5000) / 480,
      1e-12,
    );
    const single = motorOf({ hp: 5, phases: 1, codeLetter: 'K' });
    assertInDelta(motorStartingOf(single, 230).lockedRotor.amps, (8.99 * 5000) / 230, 1e-12);
  });

  it('refuses a code letter without the horsepower it is read with, and letter V, which has no upper value', () => {
    expect(() => motorOf({ hp: undefined, fullLoadAmps: 124, codeLetter: 'G' })).toThrow(
      /expected the horsepower a code letter is read with/,
    );
    expect(() => motorOf({ codeLetter: 'V' as never })).toThrow();
  });

  it('motorStartingOf(§7.9 motor) draws LRA 789.46 A to the acceleration time and 1263.1 A asymmetrical', () => {
    // 100 hp 460 V, FLC 124 A (NFPA 70 Table 430.250), code G (NEC Table 430.7(B), from memory) → LRA
    // 6.29 · 100 · 1000 / (√3 · 460) = 789.46 A; 1.6 × LRA = 1263.1 A (common practice)
    const motor = motorOf({ fullLoadAmps: 124, accelerationTime: 8 });
    const { curve, lockedRotor } = motorStartingOf(motor, 460, {
      lockedRotorAmps: lockedRotorAmpsFromCode('G', 100, 460),
    });
    assertInDelta(lockedRotor.amps, 789.46, 1e-5);
    expect(lockedRotor.seconds).toBe(8);
    assertInDelta(curve.amps[0], 1263.1, 1e-4);
    assertInDelta(curve.amps[1], 1263.1, 1e-4);
    assertInDelta(curve.amps[2], 789.46, 1e-5);
    expect(curve.seconds[3]).toBe(8);
    expect(curve.amps[4]).toBe(124);
    assertInDelta(lockedRotor.amps / 124, 6.4, 1e-2); // "≈ 6.4 × FLC"
    expect(curve.notes.some((note) => /nameplate/.test(note))).toBe(true);
  });

  it('motorStartingOf takes a small motor FLA and LRA from NFPA 70 Table 430.250, not 1 kVA per hp', () => {
    // 5 hp at 480 V: the 460 V column lists 7.6 A (2008 edition, confirmed); 1 kVA/hp would give 6.01 A.
    const { fullLoadAmps, lockedRotor } = motorStartingOf(motorOf({ hp: 5 }), 480);
    expect(fullLoadAmps).toBe(7.6);
    assertInDelta(lockedRotor.amps, 6 * 7.6, 1e-12);
  });

  it('motorStartingOf multiplies the running current by the service factor', () => {
    const { curve } = motorStartingOf(motorOf({ fullLoadAmps: 124 }), 460, { serviceFactor: 1.15 });
    assertInDelta(curve.amps[curve.amps.length - 1], 142.6, 1e-12);
    assertInDelta(curve.amps[2], 6 * 124, 1e-12); // LRA stays on nameplate FLA
  });

  it('motorStartingOf ends the asymmetrical current at an acceleration time shorter than 0.1 s', () => {
    const { curve } = motorStartingOf(motorOf({ fullLoadAmps: 10, accelerationTime: 0.05 }), 480);
    expect(Array.from(curve.seconds)).toEqual([0.01, 0.05, 0.05, 0.05, 1000]);
    expect(Array.from(curve.amps)).toEqual([96, 96, 60, 10, 10]);
  });

  it('startingPointsOf gives the motor check the drawn curve’s points, without its words', () => {
    for (const motor of [motorOf(), motorOf({ fullLoadAmps: 10, accelerationTime: 0.05 }), motorOf({ hp: 7.5 })]) {
      const { curve, lockedRotor, fullLoadAmps } = motorStartingOf(motor, 480);
      const points = startingPointsOf(motor, 480);
      expect([points.amps, points.seconds, points.fullLoadAmps]).toEqual([curve.amps, curve.seconds, fullLoadAmps]);
      expect([points.lockedRotorAmps, points.accelerationTime]).toEqual([lockedRotor.amps, lockedRotor.seconds]);
    }
  });

  it('motorStartingOf falls in current as time rises, for any motor (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.double({ min: 1.5, max: 12, noNaN: true }),
        fc.double({ min: 0.011, max: 60, noNaN: true }),
        fc.double({ min: 1, max: 1.4, noNaN: true }),
        (fullLoadAmps, lockedRotor, accelerationTime, serviceFactor) => {
          const { curve } = motorStartingOf(motorOf({ fullLoadAmps, lockedRotor, accelerationTime }), 480, {
            serviceFactor,
          });
          for (let i = 1; i < curve.amps.length; i++) {
            if (!(curve.amps[i] <= curve.amps[i - 1]) || !(curve.seconds[i] >= curve.seconds[i - 1])) return false;
          }
          return [...curve.amps, ...curve.seconds].every(Number.isFinite);
        },
      ),
      { numRuns: 300 },
    );
  });

  describe('bad input', () => {
    it('motorStartingOf rejects a motor with no way to find its full-load current', () => {
      const motor = { ...motorOf(), hp: undefined };
      expect(() => motorStartingOf(motor, 460)).toThrow(
        /^motors\.M1\.fullLoadAmps: expected a full-load current, or hp or rating to infer it, got nothing$/,
      );
    });

    it('motorStartingOf rejects a voltage, service factor or acceleration time out of range', () => {
      expect(() => motorStartingOf(motorOf(), 0)).toThrow(/^volts: expected a voltage in V greater than 0, got "0"$/);
      expect(() => motorStartingOf(motorOf(), 460, { serviceFactor: 0.9 })).toThrow(
        /^options\.serviceFactor: expected a service factor of at least 1, got "0\.9"$/,
      );
      expect(() => motorStartingOf({ ...motorOf(), accelerationTime: 0.005 }, 460)).toThrow(
        /^motors\.M1\.accelerationTime: expected a time in s greater than 0\.01, got "0\.005"$/,
      );
    });

    it('motorStartingOf rejects a locked-rotor current at or below the running current', () => {
      expect(() =>
        motorStartingOf(motorOf({ fullLoadAmps: 100, lockedRotor: 1.1 }), 460, { serviceFactor: 1.15 }),
      ).toThrow(
        /^motors\.M1\.lockedRotor: expected a locked-rotor current above the running current 115 A, got "110"$/,
      );
      expect(() => motorStartingOf(motorOf({ fullLoadAmps: 100 }), 460, { lockedRotorAmps: 90 })).toThrow(
        /^options\.lockedRotorAmps: expected a locked-rotor current above the running current 100 A, got "90"$/,
      );
    });
  });
});
