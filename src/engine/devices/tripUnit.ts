import type { Band } from '../band.ts';
import { bandOfEdges, compositeEdge, definiteElement, i2tElement, named, type EdgeElement } from './composite.ts';
import type { TripUnit } from './tripUnitSchema.ts';

/**
 * The phase band of a trip unit in amperes: `minTime` uses the low pickup edges and the fast time
 * edges, `maxTime` the high pickup edges and slow time edges (common practice). Each function acts on
 * its own and the breaker operates on whichever acts first, so at every current each edge is the
 * smallest of the functions' edges: where the long-time I²t ramp falls below the short-time delay,
 * even before the short-time pickup, the band follows the ramp down. Never faster than
 * `openingTime`, and cleared by `clearingTime` at the latest once any function acts at high current.
 *
 * With `longTimeRamp: 'ends-at-short-time-pickup'` the long-time function stops at the unit's actual
 * short-time pickup, which may lie anywhere in the pickup tolerance band [low, high]. Each edge bounds
 * every unit in that band and stays non-increasing:
 * - the fast edge follows the ramp up to the high pickup (a unit picking up there is still on its ramp)
 *   and holds the ramp's time there above it; the short-time function acts from the low pickup;
 * - the slow edge follows the ramp until it meets the short-time curve and holds that time up to where
 *   the short-time function may act. Where the ramp lies below the short-time curve at the low pickup,
 *   that is the curve from the low pickup (a unit picking up there leaves the ramp for a slower curve);
 *   otherwise from the high pickup, as without the hand-over.
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
      const shortDelay = bandDelay(unit, side, shortTime.delay);
      let short = delayedElement(shortTime, ratedAmps, shortPickup, shortDelay);
      if (handOver && shortPickup < instantaneousPickup) {
        const ramp = (amps: number) => longSeconds * (longThrough / amps) ** 2;
        const shortAtPickup = short.time(shortPickup);
        if (side < 0) {
          // A unit whose pickup is at the top of the band is still on its ramp up to there.
          longFlatFrom = shortTime.pickup * ratedAmps * (1 + tolerance.pickup / 100);
          if (ramp(shortPickup) < shortAtPickup)
            diagnostics.push(
              `long-time ramp is at ${round(ramp(shortPickup))} s at the short-time pickup ${round(shortPickup)} A, ` +
                `below the short-time ${round(shortAtPickup)} s: the band spans both there`,
            );
        } else {
          // A unit whose pickup is at the bottom of the band leaves its ramp there for the short-time
          // curve, which (an I²t one) lies above that curve's time at the high pickup.
          const lowPickup = shortTime.pickup * ratedAmps * (1 - tolerance.pickup / 100);
          const fromLow = delayedElement(shortTime, ratedAmps, lowPickup, shortDelay);
          const shortAtLow = fromLow.time(lowPickup);
          if (ramp(lowPickup) < shortAtLow) {
            short = fromLow;
            longFlatFrom = longThrough * Math.sqrt(longSeconds / shortAtLow);
          } else if (ramp(shortPickup) >= shortAtPickup) longFlatFrom = shortPickup;
          else longFlatFrom = longThrough * Math.sqrt(longSeconds / shortAtPickup);
        }
      }
      elements.push(named(short, 'short-time'));
    }
    elements.push(named(i2tElement(ratedAmps * pickupFactor, longSeconds, longThrough, longFlatFrom), 'long-time'));
    // An instantaneous trip commits once the current has lasted the opening time; the breaker then
    // clears by the edge's floor whatever the current does after (what a decaying current reads).
    if (instantaneous) elements.push(named(definiteElement(instantaneousPickup, unit.openingTime), 'instantaneous'));
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
    const element = named(delayedElement(ground, sensor, pickup, bandDelay(unit, side, ground.delay)), 'ground-fault');
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
