import type { Characteristic } from '../devices/characteristic.ts';
import type { Device } from '../study/index.ts';
import type { Constraint, ConstraintResult } from './constraints.ts';
import type { Trial } from './trial.ts';

/**
 * Results already computed for one state of the rest of the study: by trial settings (the
 * characteristic's JSON text), then by constraint id. A window computation keeps one while only its
 * own device changes; it must be dropped as soon as another device is moved.
 */
export type Memo = Map<string, Map<string, ConstraintResult>>;

/** The JSON text of each object met, by identity: one trial setting is asked for many constraints. */
const texts = new WeakMap<object, string>();

/**
 * Per trial, the first characteristic object placed with each text. Placing that object again for an
 * equal setting lets the band caches find its bands by identity instead of by text.
 */
const placedByTrial = new WeakMap<Trial, Map<string, Characteristic>>();

/**
 * `JSON.stringify(characteristic)`, written once per object. A trial setting is a new characteristic
 * sharing every element but the changed one with the one it came from, so the elements' texts are
 * remembered too and only the changed one is written again.
 */
function characteristicText(characteristic: Characteristic): string {
  let text = texts.get(characteristic);
  if (text !== undefined) return text;
  const parts: string[] = [];
  for (const [key, value] of Object.entries(characteristic)) {
    if (value === undefined) continue;
    parts.push(`${JSON.stringify(key)}:${isRecord(value) ? elementText(value) : JSON.stringify(value)}`);
  }
  text = `{${parts.join(',')}}`;
  texts.set(characteristic, text);
  return text;
}

/** `JSON.stringify` of one element of a characteristic, written once per object. */
function elementText(element: object): string {
  let text = texts.get(element);
  if (text === undefined) texts.set(element, (text = JSON.stringify(element)));
  return text;
}

/** A plain object (not an array, not null). */
function isRecord(value: unknown): value is object {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** The two devices differ in their characteristic at most (as every trial setting of one device does). */
function sameBesidesCharacteristic(a: Device, b: Device): boolean {
  const keys = Object.keys(a) as (keyof Device)[];
  if (keys.length !== Object.keys(b).length) return false;
  return keys.every((key) => key === 'characteristic' || a[key] === b[key]);
}

/**
 * Evaluates a constraint with `device` placed in the trial, reusing a result for the same settings.
 * A device equal in settings to the one in place is not placed again.
 *
 * @example evaluateAt(trial, constraint, deviceWith(main, { 'shortTime.delay': 0.3 }), memo).ok
 */
export function evaluateAt(trial: Trial, constraint: Constraint, device: Device, memo?: Memo): ConstraintResult {
  const text = characteristicText(device.characteristic);
  const results = memo?.get(text);
  const known = results?.get(constraint.id);
  if (known) return known;
  const inPlace = trial.deviceOf(device.id);
  if (
    inPlace !== device &&
    !(characteristicText(inPlace.characteristic) === text && sameBesidesCharacteristic(inPlace, device))
  ) {
    let placed = placedByTrial.get(trial);
    if (!placed) placedByTrial.set(trial, (placed = new Map()));
    const first = placed.get(text);
    if (!first) placed.set(text, device.characteristic);
    trial.place(!first || first === device.characteristic ? device : { ...device, characteristic: first });
  }
  const result = constraint.evaluate(trial);
  if (memo) {
    if (results) results.set(constraint.id, result);
    else memo.set(text, new Map([[constraint.id, result]]));
  }
  return result;
}
