import { z } from 'zod/mini';
import { requireOpeningBeforeClearing } from './breakerTimes.ts';
import { boundedNumber, nameField, percentField, quantityField } from '../study/fields.ts';

/** How the long-time ramp meets the short-time function (see `createTripUnitSchema`). */
export const LONG_TIME_RAMPS = ['independent', 'ends-at-short-time-pickup'] as const;

/**
 * Builds the electronic trip-unit (LSIG) schema for a system frequency; `tripUnitSchema` is the
 * 60 Hz instance. Terms as the trade uses them (IEEE 1015 / IEEE 3004.5 application practice), with
 * `I_n` the sensor or rating-plug amps and `I_r = longTime.pickup × I_n`:
 * - `longTime`: `pickup` (× I_n), `delay` (band time at `delayAt` × I_r, default 6), an I²t ramp;
 * - `shortTime`: `pickup` (× I_r), `delay` (s), `i2t` (I²t in: ramp through (`i2tThrough` × I_r, delay),
 *   default 10) or flat;
 * - `instantaneous`: `pickup` (× I_n);
 * - `ground`: `pickup` (× I_n), `delay`, `i2t` with `i2tThrough` (× I_n, default 1 — our choice);
 * - `tolerance` (common practice): pickup ±10 %, ground pickup ±10 %, long-time time −10/+20 %,
 *   short-time (and ground) band −0/+0.05 s around the set delay;
 * - `openingTime` (default "0.5 cycles") and `clearingTime` (default "3 cycles"): the fastest
 *   operation and the latest clearing at high current; every edge is floored to them;
 * - `currentLimiting` / `currentLimitingFrom`: from the instantaneous upper pickup edge unless given;
 * - `longTimeRamp`: `'independent'` (default: every function acts on its own at every current and the
 *   breaker trips on whichever acts first, so the long-time ramp keeps falling past the short-time
 *   delay) or `'ends-at-short-time-pickup'` (for trip units whose published curve hands the long-time
 *   ramp over to the short-time function at the short-time pickup).
 *
 * @example createTripUnitSchema().parse({ kind: 'trip-unit', sensor: 800, longTime: { pickup: 1, delay: 10 } })
 */
export function createTripUnitSchema(frequency = 60) {
  const time = (description: string) => quantityField('time', { frequency, min: 0, description });
  // Multiples of I_n or I_r: ground-fault pickups go down to about 0.2 ×, instantaneous up to about 15 ×.
  const multiple = (description: string) =>
    boundedNumber(0.05, 100, description, 'trip units offer about 0.2 × to 15 ×');
  const percent = (description: string, value: number) =>
    z._default(percentField({ min: 0, max: 90, description }), value);
  const delayed = (pickup: string, through: string, throughDefault: number) =>
    z.strictObject({
      pickup: multiple(pickup),
      delay: time('band time (s) of the flat part'),
      // A default is described by registering it (see createStudySchema).
      i2t: z._default(z.boolean(), false).register(z.globalRegistry, { description: 'I²t in (ramp) rather than flat' }),
      i2tThrough: z._default(multiple(through), throughDefault),
    });

  return z
    .strictObject({
      kind: z.literal('trip-unit'),
      label: z.optional(nameField),
      sensor: quantityField('current', { min: 0, exclusiveMin: true, description: 'sensor or rating-plug amps I_n' }),
      longTime: z.strictObject({
        pickup: multiple('long-time pickup × I_n (usual 0.4–1.0)'),
        delay: quantityField('time', {
          frequency,
          min: 0,
          exclusiveMin: true,
          description: 'band time at delayAt × I_r',
        }),
        delayAt: z._default(multiple('multiple of I_r where the delay is read'), 6),
      }),
      shortTime: z.optional(delayed('short-time pickup × I_r (usual 1.5–10)', 'I²t reference × I_r', 10)),
      instantaneous: z.optional(z.strictObject({ pickup: multiple('instantaneous pickup × I_n (usual 2–15)') })),
      ground: z.optional(delayed('ground-fault pickup × I_n (usual 0.2–1.0)', 'I²t reference × I_n', 1)),
      tolerance: z.prefault(
        z.strictObject({
          pickup: percent('pickup tolerance ± %', 10),
          groundPickup: percent('ground-fault pickup tolerance ± %', 10),
          longTimeBelow: percent('long-time time band below the setting, %', 10),
          longTimeAbove: percent('long-time time band above the setting, %', 20),
          shortTimeBelow: z._default(time('short-time and ground band below the set delay (s)'), 0),
          shortTimeAbove: z._default(time('short-time and ground band above the set delay (s)'), 0.05),
        }),
        {},
      ),
      openingTime: z.prefault(time('fastest operation at high current'), '0.5 cycles'),
      clearingTime: z.prefault(time('latest clearing at high current'), '3 cycles'),
      currentLimiting: z._default(z.boolean(), false),
      currentLimitingFrom: z.optional(quantityField('current', { min: 0, exclusiveMin: true })),
      longTimeRamp: z._default(z.enum(LONG_TIME_RAMPS), 'independent').register(z.globalRegistry, {
        description:
          'independent: every function acts on its own and the first to act trips the breaker; ' +
          "ends-at-short-time-pickup: the long-time ramp hands over to the short-time function at its pickup, as some trip units' published curves show",
      }),
    })
    .check(
      z.superRefine((unit, ctx) => {
        requireOpeningBeforeClearing(unit, ctx);
        for (const element of ['shortTime', 'ground'] as const) {
          const delay = unit[element]?.delay;
          if (delay !== undefined && delay - unit.tolerance.shortTimeBelow <= 0) {
            ctx.addIssue({
              code: 'custom',
              path: [element, 'delay'],
              message: `expected a delay greater than the band's ${unit.tolerance.shortTimeBelow} s below it, got "${delay}"`,
            });
          }
        }
      }),
      z.meta({
        description: 'electronic trip unit of a low-voltage breaker (long-time, short-time, instantaneous, ground)',
      }),
    );
}

/** Schema of a trip-unit characteristic at 60 Hz (see `createTripUnitSchema`). */
export const tripUnitSchema = createTripUnitSchema(60);

/** A parsed trip unit: multiples as set, `sensor` in amperes, times in seconds. */
export type TripUnit = z.output<typeof tripUnitSchema>;
