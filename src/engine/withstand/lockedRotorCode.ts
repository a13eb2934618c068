import { InputError, expectedGot } from '../errors.ts';
import { requireNumberAbove } from './inputs.ts';

/**
 * Locked-rotor kVA per horsepower by code letter, `[low, high]`, NEC Table 430.7(B) (NFPA 70 Article 430,
 * from memory). Letter V has no upper value.
 */
export const LOCKED_ROTOR_KVA_PER_HP: Readonly<Record<string, readonly [number, number]>> = {
  A: [0, 3.14],
  B: [3.15, 3.54],
  C: [3.55, 3.99],
  D: [4.0, 4.49],
  E: [4.5, 4.99],
  F: [5.0, 5.59],
  G: [5.6, 6.29],
  H: [6.3, 7.09],
  J: [7.1, 7.99],
  K: [8.0, 8.99],
  L: [9.0, 9.99],
  M: [10.0, 11.19],
  N: [11.2, 12.49],
  P: [12.5, 13.99],
  R: [14.0, 15.99],
  S: [16.0, 17.99],
  T: [18.0, 19.99],
  U: [20.0, 22.39],
  V: [22.4, Infinity],
};

/**
 * Locked-rotor current (A) of a motor from its code letter: `LRA = (kVA/hp) · hp · 1000 / (√3 · V)` for a
 * three-phase motor, `/ V` for a single-phase one, using the letter's upper value (the maximum) unless
 * `bound` is 'lower' (NEC 430.7(B), from memory; the letters' values as public reproductions of NFPA 70
 * Table 430.7(B) give them). A motor of the study with a `codeLetter` has its starting curve from it.
 *
 * @param volts line-to-line voltage (V); for a single-phase motor, the voltage across it.
 * @example lockedRotorAmpsFromCode('G', 100, 460) // 789.46 A (hand-worked NFPA 70 Table 430.7(B) case)
 */
export function lockedRotorAmpsFromCode(
  letter: string,
  hp: number,
  volts: number,
  bound: 'upper' | 'lower' = 'upper',
  phases: 1 | 3 = 3,
): number {
  const range = LOCKED_ROTOR_KVA_PER_HP[typeof letter === 'string' ? letter.trim().toUpperCase() : ''];
  if (!range) throw new InputError('codeLetter', expectedGot('an NEC 430.7(B) code letter A–V (no I, O or Q)', letter));
  const kvaPerHp = bound === 'lower' ? range[0] : range[1];
  if (!Number.isFinite(kvaPerHp)) {
    throw new InputError(
      'codeLetter',
      expectedGot('a letter with an upper kVA/hp value (V has none; give the LRA)', letter),
    );
  }
  requireNumberAbove('hp', hp, 0, 'a horsepower');
  requireNumberAbove('volts', volts, 0, 'a voltage in V');
  return (kvaPerHp * hp * 1000) / (phases === 3 ? Math.sqrt(3) * volts : volts);
}
