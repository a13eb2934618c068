import type { Band } from '../band.ts';
import {
  decrementOperatingTime,
  type CurrentAgainstTime,
  type DecrementOperatingTimeOptions,
} from './decrementOperatingTime.ts';

/** The time (s) `decrementOperatingTime` starts its integral at: a horizon must lie beyond it. */
const START_SECONDS = 1e-6;

/** Options of `edgeTimeOnCurrent`: the integral's, and what is known of the current. */
export interface EdgeTimeOptions extends DecrementOperatingTimeOptions {
  /**
   * The current at t = 0 (A) of a current that never rises after it, as a generator's decrement (X″d ≤ X′d ≤
   * Xd, held at most at its support floor): an element below its pickup there, or no faster there than the
   * first element so far, is not followed. Leave it out for a current that may rise.
   */
  fallingFrom?: number;
}

/**
 * The time (s) one edge of a band takes on a current that changes with time: `min` the earliest
 * operation, `max` the latest clearing; `Infinity` where the edge never gets there. Each element of the
 * edge runs on its own, as a device's elements do, and the device acts on the first of them,
 * `max(floor, first) + add` as at a constant current:
 * - an inverse-time element (a relay curve, a long-time or short-time ramp, a thermal curve) by the
 *   integral operating equation on its own curve (IEEE C37.112, `decrementOperatingTime`);
 * - a definite-time or instantaneous element once the current has stayed above its pickup for the
 *   element's own time: the same integral of its flat curve, which stops where the current falls below
 *   the pickup and, on a falling current, never starts again (a real element resets there). The
 *   families give an instantaneous trip the opening time (a relay's operating time) as its own time and
 *   the clearing time as the edge's floor: the trip commits once its current has lasted the opening
 *   time, on both edges, and the breaker clears by the floor whatever the current does after.
 *
 * Integrating the edge whole would carry the progress a fast element made before the current left it
 * into a slower element's part of the curve, which no real element does: a device with a short-time
 * delay left unfinished would be taken to clear early. On a current that rises again a definite-time
 * element is taken to keep its progress, as an integrating one does. A band given without its parts (a
 * fuse's, one curve each edge) is integrated whole.
 *
 * @example edgeTimeOnCurrent(bandOf(feeder.characteristic), 'max', generatorDecrement(g, { external })) // s
 */
export function edgeTimeOnCurrent(
  band: Band,
  edge: 'min' | 'max',
  current: CurrentAgainstTime,
  options: EdgeTimeOptions = {},
): number {
  return edgeOperationOnCurrent(band, edge, current, options).seconds;
}

/**
 * `edgeTimeOnCurrent`, with the element that operates first, by its name where the family gives one
 * (`'long-time'`, `'instantaneous'`…): what tells an engineer why a device with a fast element still
 * clears late on a decaying current.
 *
 * @example edgeOperationOnCurrent(band, 'max', decrement).element // 'long-time'
 */
export function edgeOperationOnCurrent(
  band: Band,
  edge: 'min' | 'max',
  current: CurrentAgainstTime,
  options: EdgeTimeOptions = {},
): { seconds: number; element?: string } {
  const { fallingFrom, ...integration } = options;
  const parts = band.parts?.[edge];
  if (!parts)
    return { seconds: decrementOperatingTime(edge === 'min' ? band.minTime : band.maxTime, current, integration) };
  const horizon = integration.horizonSeconds ?? 1000;
  // Flat elements first: they are quick to read, and once one operates by the floor no other can be
  // faster; each later element is followed only as far as the first so far.
  const elements = [...parts.elements].sort((a, b) => Number(a.reach !== undefined) - Number(b.reach !== undefined));
  let first = Infinity;
  let by: string | undefined;
  for (const element of elements) {
    if (first <= parts.floor) break;
    const { pickup } = element;
    const time = (amps: number) => (amps >= pickup ? element.time(amps) : Infinity);
    // On a falling current an element is at its fastest at the start.
    if (fallingFrom !== undefined && !(time(fallingFrom) < first)) continue;
    // The integral needs a horizon past its start; an element faster than that returns its start-time value anyway.
    const seconds = decrementOperatingTime(time, current, {
      ...integration,
      horizonSeconds: Math.min(horizon, Math.max(first, 2 * START_SECONDS)),
    });
    if (seconds < first) [first, by] = [seconds, element.label];
  }
  return first === Infinity
    ? { seconds: Infinity }
    : { seconds: Math.max(first, parts.floor) + parts.add, element: by };
}
