import type { Device } from '../study/index.ts';
import type { Constraint, ConstraintResult } from './constraints.ts';
import type { Trial } from './trial.ts';

/**
 * Results already computed for one state of the rest of the study, by constraint and trial settings.
 * A window computation keeps one while only its own device changes; it must be dropped as soon as
 * another device is moved.
 */
export type Memo = Map<string, ConstraintResult>;

/**
 * Evaluates a constraint with `device` placed in the trial, reusing a result for the same settings.
 *
 * @example evaluateAt(trial, constraint, deviceWith(main, { 'shortTime.delay': 0.3 }), memo).ok
 */
export function evaluateAt(trial: Trial, constraint: Constraint, device: Device, memo?: Memo): ConstraintResult {
  const key = memo ? `${constraint.id}\u0000${JSON.stringify(device.characteristic)}` : '';
  const known = memo?.get(key);
  if (known) return known;
  if (trial.deviceOf(device.id) !== device) trial.place(device);
  const result = constraint.evaluate(trial);
  memo?.set(key, result);
  return result;
}
