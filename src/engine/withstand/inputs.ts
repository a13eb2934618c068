import { InputError, expectedGot } from '../errors.ts';

/**
 * Returns `value` when it is a finite number above `min` (or at least `min` when `inclusive`), else throws
 * an `InputError` naming `path`: `transformers.T1.impedance: expected a percentage greater than 0, got "-5"`.
 * The withstand builders call it on every number they are given, so data that bypassed the study
 * schema still fails with a one-line message.
 *
 * @example requireNumberAbove('options.volts', 480, 0, 'a voltage in V') // 480
 */
export function requireNumberAbove(path: string, value: unknown, min: number, what: string, inclusive = false): number {
  const ok = typeof value === 'number' && Number.isFinite(value) && (inclusive ? value >= min : value > min);
  if (!ok)
    throw new InputError(path, expectedGot(`${what} ${inclusive ? 'of at least' : 'greater than'} ${min}`, value));
  return value;
}

/**
 * The path prefix for an element's fields in messages: `transformers.T1`, `cables.C2`, `motors.M1`.
 * @example elementPath('transformers', 'T1') // 'transformers.T1'
 */
export function elementPath(collection: 'transformers' | 'cables' | 'motors', id: string): string {
  return `${collection}.${id}`;
}
