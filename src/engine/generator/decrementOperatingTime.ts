import { InputError, expectedGot } from '../errors.ts';
import { requireNumberAbove } from '../withstand/inputs.ts';
import type { GeneratorDecrement } from './generatorDecrement.ts';

/** A fault current against time: a function of seconds giving amps, or a decrement's `ampsAt`. */
export type CurrentAgainstTime = ((seconds: number) => number) | Pick<GeneratorDecrement, 'ampsAt'>;

/** Options of `decrementOperatingTime`. */
export interface DecrementOperatingTimeOptions {
  /** Time (s) after which the device is taken never to operate. @default 1000; range > 1e-6 */
  horizonSeconds?: number;
  /**
   * Allowed error of the integral per unit of log-time (the integral reaches 1 at operation).
   * @default 1e-9; range > 0
   */
  tolerance?: number;
}

/** Time (s) the log-time integration starts at; before it the integrand is taken as its value at t = 0. */
const START_SECONDS = 1e-6;
/** Largest and smallest steps in ln t: the largest keeps every step smooth, the smallest bounds the work at a jump. */
const LARGEST_LOG_STEP = 0.5;
const SMALLEST_LOG_STEP = 1e-10;

/**
 * The operating time of a time-overcurrent device on a current that changes with time: the time T where
 * `∫₀ᵀ dt / t_op(I(t)) = 1`, `t_op(I)` being the device's operating time at constant current I. This is the
 * integral operating equation of IEEE C37.112, which makes an inverse-time device coordinate for a current of
 * varying magnitude as it does for a constant one; here without reset, since a fault current does not fall to
 * zero. With a constant current it gives `t_op(I)` itself.
 *
 * The integral is taken in log-time with adaptive Simpson steps (Richardson-corrected), so the fast
 * subtransient part and the long tail are both resolved; a jump (a pickup crossed, an instantaneous element)
 * is bracketed down to a step of 1e-10 in ln t. `timeAtCurrent` returns `Infinity` below pickup. A zero or
 * negative operating time operates at once. Returns `Infinity` when the integral has not reached 1 by the horizon.
 *
 * @example decrementOperatingTime((i) => relayTime(i), generatorDecrement(g500kVA)) // s
 */
export function decrementOperatingTime(
  timeAtCurrent: (amps: number) => number,
  decrement: CurrentAgainstTime,
  options: DecrementOperatingTimeOptions = {},
): number {
  if (typeof timeAtCurrent !== 'function')
    throw new TypeError(`timeAtCurrent: expected a function of current, got ${typeof timeAtCurrent}`);
  const current = currentFunctionOf(decrement);
  const { horizonSeconds = 1000, tolerance = 1e-9 } = options;
  requireNumberAbove('options.horizonSeconds', horizonSeconds, START_SECONDS, 'a time in s');
  requireNumberAbove('options.tolerance', tolerance, 0, 'a tolerance');

  // Rate of progress toward operation, 1/t_op; Infinity where the device operates at once.
  const rateAt = (seconds: number): number => {
    const time = timeAtCurrent(current(seconds));
    if (Number.isNaN(time)) throw new RangeError(`timeAtCurrent: expected a time or Infinity, got "NaN"`);
    return time <= 0 ? Infinity : 1 / time;
  };

  // Stage 1: from 0 to START_SECONDS, the integrand held at its t = 0 value.
  const initialRate = rateAt(0);
  if (initialRate === Infinity) return 0;
  if (initialRate * START_SECONDS >= 1) return 1 / initialRate;
  let done = initialRate * START_SECONDS;

  // Stage 2: march in u = ln t; the integrand in u is rate(e^u) · e^u.
  const g = (u: number) => {
    const t = Math.exp(u);
    const rate = rateAt(t);
    return rate === Infinity ? Infinity : rate * t;
  };
  const end = Math.log(horizonSeconds);
  let a = Math.log(START_SECONDS);
  let h = 0.05;
  while (a < end) {
    // The grid does not depend on the horizon: a step may pass it, and a time beyond it is never.
    const b = a + h;
    const step = b - a;
    const estimate = simpsonPair(g, a, b);
    if (estimate.value === Infinity) {
      // An instantaneous region: narrow the step until it is found to the smallest step.
      if (step > SMALLEST_LOG_STEP) {
        h = step / 2;
        continue;
      }
      return Math.exp(b) <= horizonSeconds ? Math.exp(b) : Infinity;
    }
    if (estimate.error > tolerance * step && step > SMALLEST_LOG_STEP) {
      h = step / 2;
      continue;
    }
    if (done + estimate.value >= 1) {
      const at = Math.exp(rootInStep(g, a, b, 1 - done));
      return at <= horizonSeconds ? at : Infinity;
    }
    done += estimate.value;
    a = b;
    // A smooth step lets the next one grow.
    if (estimate.error < (tolerance * step) / 32) h = Math.min(step * 2, LARGEST_LOG_STEP);
    else h = step;
  }
  return Infinity;
}

/** Accepts a function of time or an object with `ampsAt`. */
function currentFunctionOf(decrement: CurrentAgainstTime): (seconds: number) => number {
  if (typeof decrement === 'function') return decrement;
  if (decrement && typeof decrement.ampsAt === 'function') return (t) => decrement.ampsAt(t);
  throw new InputError('decrement', expectedGot('a function of time or a decrement with ampsAt', decrement));
}

/**
 * Simpson's rule on [a, b] with one and with two panels; returns the Richardson-corrected value and the
 * error estimate |S2 − S1| / 15. Accepts any integrand that is finite or +Infinity.
 */
function simpsonPair(g: (u: number) => number, a: number, b: number): { value: number; error: number } {
  const h = b - a;
  const f0 = g(a);
  const f1 = g(a + h / 4);
  const f2 = g(a + h / 2);
  const f3 = g(a + (3 * h) / 4);
  const f4 = g(b);
  const one = (h / 6) * (f0 + 4 * f2 + f4);
  const two = (h / 12) * (f0 + 4 * f1 + 2 * f2 + 4 * f3 + f4);
  if (!Number.isFinite(one) || !Number.isFinite(two)) return { value: Infinity, error: Infinity };
  const correction = (two - one) / 15;
  return { value: two + correction, error: Math.abs(correction) };
}

/** The u in (a, b] where the integral from a reaches `need`, by bisection on the same corrected rule. */
function rootInStep(g: (u: number) => number, a: number, b: number, need: number): number {
  let lo = a;
  let hi = b;
  for (let i = 0; i < 200 && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); i++) {
    const mid = (lo + hi) / 2;
    if (simpsonPair(g, a, mid).value >= need) hi = mid;
    else lo = mid;
  }
  return hi;
}
