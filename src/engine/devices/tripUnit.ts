import { z } from 'zod';
import type { Band } from '../band.ts';
import { boundedNumber, nameField, percentField, quantityField } from '../study/fields.ts';
import { bandOfEdges, compositeEdge, definiteElement, i2tElement, type EdgeElement } from './composite.ts';

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
  const percent = (description: string, value: number) => percentField({ min: 0, max: 90, description }).default(value);
  const delayed = (pickup: string, through: string, throughDefault: number) =>
    z
      .object({
        pickup: multiple(pickup),
        delay: time('band time (s) of the flat part'),
        i2t: z.boolean().default(false).meta({ description: 'I²t in (ramp) rather than flat' }),
        i2tThrough: multiple(through).default(throughDefault),
      })
      .strict();

  return z
    .object({
      kind: z.literal('trip-unit'),
      label: nameField.optional(),
      sensor: quantityField('current', { min: 0, exclusiveMin: true, description: 'sensor or rating-plug amps I_n' }),
      longTime: z
        .object({
          pickup: multiple('long-time pickup × I_n (usual 0.4–1.0)'),
          delay: quantityField('time', {
            frequency,
            min: 0,
            exclusiveMin: true,
            description: 'band time at delayAt × I_r',
          }),
          delayAt: multiple('multiple of I_r where the delay is read').default(6),
        })
        .strict(),
      shortTime: delayed('short-time pickup × I_r (usual 1.5–10)', 'I²t reference × I_r', 10).optional(),
      instantaneous: z
        .object({ pickup: multiple('instantaneous pickup × I_n (usual 2–15)') })
        .strict()
        .optional(),
      ground: delayed('ground-fault pickup × I_n (usual 0.2–1.0)', 'I²t reference × I_n', 1).optional(),
      tolerance: z
        .object({
          pickup: percent('pickup tolerance ± %', 10),
          groundPickup: percent('ground-fault pickup tolerance ± %', 10),
          longTimeBelow: percent('long-time time band below the setting, %', 10),
          longTimeAbove: percent('long-time time band above the setting, %', 20),
          shortTimeBelow: time('short-time and ground band below the set delay (s)').default(0),
          shortTimeAbove: time('short-time and ground band above the set delay (s)').default(0.05),
        })
        .strict()
        .prefault({}),
      openingTime: time('fastest operation at high current').prefault('0.5 cycles'),
      clearingTime: time('latest clearing at high current').prefault('3 cycles'),
      currentLimiting: z.boolean().default(false),
      currentLimitingFrom: quantityField('current', { min: 0, exclusiveMin: true }).optional(),
      longTimeRamp: z
        .enum(LONG_TIME_RAMPS)
        .default('independent')
        .meta({
          description:
            'independent: every function acts on its own and the first to act trips the breaker; ' +
            "ends-at-short-time-pickup: the long-time ramp hands over to the short-time function at its pickup, as some trip units' published curves show",
        }),
    })
    .strict()
    .superRefine((unit, ctx) => {
      if (unit.openingTime > unit.clearingTime) {
        ctx.addIssue({
          code: 'custom',
          path: ['openingTime'],
          message: `expected an opening time no later than the clearing time ${unit.clearingTime} s, got "${unit.openingTime}"`,
        });
      }
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
    })
    .meta({
      description: 'electronic trip unit of a low-voltage breaker (long-time, short-time, instantaneous, ground)',
    });
}

/** Schema of a trip-unit characteristic at 60 Hz (see `createTripUnitSchema`). */
export const tripUnitSchema = createTripUnitSchema(60);

/** A parsed trip unit: multiples as set, `sensor` in amperes, times in seconds. */
export type TripUnit = z.output<typeof tripUnitSchema>;

/**
 * The phase band of a trip unit in amperes: `minTime` uses the low pickup edges and the fast time
 * edges, `maxTime` the high pickup edges and slow time edges (common practice). Each function acts on
 * its own and the breaker operates on whichever acts first, so at every current each edge is the
 * smallest of the functions' edges: where the long-time I²t ramp falls below the short-time delay,
 * even before the short-time pickup, the band follows the ramp down. Never faster than
 * `openingTime`, and cleared by `clearingTime` at the latest once any function acts at high current.
 *
 * With `longTimeRamp: 'ends-at-short-time-pickup'` the long-time function stops at the short-time
 * pickup (each edge at its own pickup tolerance). Where the ramp has already fallen below the
 * short-time delay there, a device would operate later above the pickup than just below it; the
 * band keeps its edges non-increasing and still bounds the device: the fast edge holds the ramp's
 * time at the pickup, the slow edge holds the short-time delay from where the ramp meets it.
 *
 * @example tripUnitBand(tripUnitSchema.parse({ kind: 'trip-unit', sensor: 800,
 *   longTime: { pickup: 1, delay: 10 } })).maxTime(4800) // 12 s (10 s + 20 %)
 */
export function tripUnitBand(unit: TripUnit): Band {
  const { sensor, longTime, shortTime, instantaneous, tolerance } = unit;
  const ratedAmps = longTime.pickup * sensor;
  const handOver = Boolean(shortTime) && unit.longTimeRamp === 'ends-at-short-time-pickup';
  const diagnostics = tripUnitDiagnostics(unit);
  // The default needs no word; the hand-over is a choice the sheet and the findings should name.
  if (handOver) diagnostics.push(longTimeRampBasis(unit)!);
  const edge = (side: -1 | 1) => {
    const pickupFactor = 1 + (side * tolerance.pickup) / 100;
    const longFactor = side < 0 ? 1 - tolerance.longTimeBelow / 100 : 1 + tolerance.longTimeAbove / 100;
    const longSeconds = longTime.delay * longFactor;
    const longThrough = longTime.delayAt * ratedAmps;
    const instantaneousPickup = instantaneous ? instantaneous.pickup * sensor * pickupFactor : Infinity;
    const elements: EdgeElement[] = [];
    let longFlatFrom = Infinity;
    if (shortTime) {
      const shortPickup = shortTime.pickup * ratedAmps * pickupFactor;
      const short = delayedElement(shortTime, ratedAmps, shortPickup, bandDelay(unit, side, shortTime.delay));
      elements.push(short);
      if (handOver && shortPickup < instantaneousPickup) {
        const rampAtPickup = longSeconds * (longThrough / shortPickup) ** 2;
        const shortAtPickup = short.time(shortPickup);
        // Fast edge: the ramp's time at the pickup is the earliest the device may act above it.
        // Slow edge: the short-time time at the pickup is the latest it may take below it.
        if (rampAtPickup >= shortAtPickup || side < 0) longFlatFrom = shortPickup;
        else longFlatFrom = longThrough * Math.sqrt(longSeconds / shortAtPickup);
        if (rampAtPickup < shortAtPickup && side < 0)
          diagnostics.push(
            `long-time ramp is at ${round(rampAtPickup)} s at the short-time pickup ${round(shortPickup)} A, ` +
              `below the short-time ${round(shortAtPickup)} s: the band spans both there`,
          );
      }
    }
    elements.push(i2tElement(ratedAmps * pickupFactor, longSeconds, longThrough, longFlatFrom));
    if (instantaneous) {
      elements.push(definiteElement(instantaneousPickup, side < 0 ? unit.openingTime : unit.clearingTime));
    }
    return compositeEdge(elements, side < 0 ? unit.openingTime : unit.clearingTime);
  };
  const flagged = unit.currentLimiting || unit.currentLimitingFrom !== undefined;
  let currentLimitingFrom = Infinity;
  if (unit.currentLimitingFrom !== undefined) currentLimitingFrom = unit.currentLimitingFrom;
  else if (flagged && instantaneous) currentLimitingFrom = instantaneous.pickup * sensor * (1 + tolerance.pickup / 100);
  else if (flagged)
    diagnostics.push(
      'current-limiting is flagged but there is no instantaneous pickup or currentLimitingFrom to start it',
    );
  const low = edge(-1);
  return bandOfEdges(low, edge(1), currentLimitingFrom, diagnostics);
}

/**
 * How the long-time function meets the short-time function in this trip unit, in words for the
 * sheet's legend and the report; undefined without a short-time function (nothing to meet).
 *
 * @example longTimeRampBasis(unit) // "each function acts on its own; the first to act trips (…)"
 */
export function longTimeRampBasis(unit: TripUnit): string | undefined {
  if (!unit.shortTime) return undefined;
  return unit.longTimeRamp === 'ends-at-short-time-pickup'
    ? 'long-time ramp ends at the short-time pickup (as the published curve of this trip unit)'
    : 'each function acts on its own; the first to act trips (long-time ramp not cut at the short-time pickup)';
}

/** A number to four significant figures for a note. */
function round(value: number): number {
  return Number(value.toPrecision(4));
}

/**
 * The ground-fault band of a trip unit in amperes of ground current, or undefined when it has no
 * ground element. Built like the short-time element: pickup ± `tolerance.groundPickup`, flat or I²t
 * delay banded by `shortTimeBelow`/`shortTimeAbove`, floored to `openingTime`/`clearingTime`.
 *
 * @example groundBandOf(unit)?.minTime(1000)
 */
export function groundBandOf(unit: TripUnit): Band | undefined {
  const { ground, sensor, tolerance } = unit;
  if (!ground) return undefined;
  const edge = (side: -1 | 1) => {
    const pickup = ground.pickup * sensor * (1 + (side * tolerance.groundPickup) / 100);
    const element = delayedElement(ground, sensor, pickup, bandDelay(unit, side, ground.delay));
    return compositeEdge([element], side < 0 ? unit.openingTime : unit.clearingTime);
  };
  const diagnostics: string[] = [];
  if (ground.pickup * sensor > 1200) {
    diagnostics.push(`ground-fault pickup ${ground.pickup * sensor} A is above the 1200 A of NEC 230.95`);
  }
  const high = edge(1);
  if (high.time(3000) > 1) diagnostics.push('ground-fault clearing at 3000 A is later than the 1 s of NEC 230.95');
  return bandOfEdges(edge(-1), high, Infinity, diagnostics);
}

/** The band edge's delay: the set delay less the band below it, or plus the band above it. */
function bandDelay(unit: TripUnit, side: -1 | 1, delay: number): number {
  return side < 0 ? delay - unit.tolerance.shortTimeBelow : delay + unit.tolerance.shortTimeAbove;
}

/** A short-time or ground element: flat at `delay`, or I²t in through (`i2tThrough` × `base`, `delay`). */
function delayedElement(
  element: { pickup: number; i2t: boolean; i2tThrough: number },
  base: number,
  pickup: number,
  delay: number,
): EdgeElement {
  const through = element.i2tThrough * base;
  return element.i2t ? i2tElement(pickup, delay, through, through) : definiteElement(pickup, delay);
}

/** Settings outside their usual ranges (common practice); the band is still built. */
function tripUnitDiagnostics({ longTime, shortTime, instantaneous, ground }: TripUnit): string[] {
  const out: string[] = [];
  const check = (name: string, value: number, min: number, max: number, unit: string) => {
    if (value < min || value > max)
      out.push(`${name} ${value}${unit} is outside the usual ${min}–${max}${unit} (common practice)`);
  };
  check('long-time pickup', longTime.pickup, 0.4, 1, ' × I_n');
  check('long-time delay', longTime.delay, 2, 30, ' s');
  if (shortTime) {
    check('short-time pickup', shortTime.pickup, 1.5, 10, ' × I_r');
    check('short-time delay', shortTime.delay, 0.05, 0.5, ' s');
  }
  if (instantaneous) check('instantaneous pickup', instantaneous.pickup, 2, 15, ' × I_n');
  if (ground) check('ground-fault pickup', ground.pickup, 0.2, 1, ' × I_n');
  return out;
}
