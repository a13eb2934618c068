import type { Band } from '../band.ts';
import {
  decrementOperatingTime,
  type CurrentAgainstTime,
  type DecrementOperatingTimeOptions,
} from './decrementOperatingTime.ts';

/**
 * The time (s) one edge of a band takes on a current that changes with time: `min` the earliest
 * operation, `max` the latest clearing; `Infinity` where the edge never gets there. Each element of the
 * edge runs on its own, as a device's elements do, and the device acts on the first of them,
 * `max(floor, first) + add` as at a constant current:
 * - an inverse-time element (a relay curve, a long-time or short-time ramp, a thermal curve) by the
 *   integral operating equation on its own curve (IEEE C37.112, `decrementOperatingTime`);
 * - a definite-time or instantaneous element once the current has stayed above its pickup for its
 *   delay: the same integral of its flat curve, which stops where the current falls below the pickup
 *   and, on a falling current, never starts again (a real element resets there).
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
  options?: DecrementOperatingTimeOptions,
): number {
  const parts = band.parts?.[edge];
  if (!parts) return decrementOperatingTime(edge === 'min' ? band.minTime : band.maxTime, current, options);
  let first = Infinity;
  for (const element of parts.elements) {
    const { pickup } = element;
    const time = (amps: number) => (amps >= pickup ? element.time(amps) : Infinity);
    first = Math.min(first, decrementOperatingTime(time, current, options));
  }
  return first === Infinity ? Infinity : Math.max(first, parts.floor) + parts.add;
}
