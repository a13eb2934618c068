import type { Band } from '../band.ts';
import { bandOfEdges, compositeEdge, definiteElement, named } from './composite.ts';
import { tableElement } from './pointTable.ts';
import type { ThermalMagnetic } from './thermalMagneticSchema.ts';

/** A thermal table's first multiple of rating above which it is reported as likely entered in amperes. */
const THERMAL_START_LIMIT = 2;

/**
 * The band of a thermal-magnetic breaker in amperes: the thermal tables scaled by the rating
 * (log-log interpolated, `Infinity` below each table's first current, held beyond its last), and
 * the magnetic trip, vertical at pickup × (1 ∓ tolerance) down to `openingTime` (fast edge) and
 * `clearingTime` (slow edge); the fast edge drops there from the minimum table's last point where
 * that comes first (with a diagnostic). Both edges are floored to those times.
 *
 * @example thermalMagneticBand(breaker).minTime(2000) // 0.00833 s for a 100 A breaker, magnetic 10×
 */
export function thermalMagneticBand(breaker: ThermalMagnetic): Band {
  const { rating, thermal, magnetic, openingTime, clearingTime } = breaker;
  const magneticAmps = magnetic.pickupAmps ?? (magnetic.pickup ?? 10) * rating;
  const minimum = tableElement(thermal.minimum, rating);
  // Past the minimum table's last point the breaker is not known to wait (the curve is not
  // extrapolated): where the table stops short of the magnetic trip's lower edge, the fast edge takes
  // the magnetic opening time from that point, the cautious side for a breaker above another device.
  const magneticLow = magneticAmps * (1 - magnetic.tolerance / 100);
  const fastFrom = Math.min(magneticLow, minimum.lastAmps);
  const low = compositeEdge(
    [named(minimum, 'thermal'), named(definiteElement(fastFrom, openingTime), 'magnetic')],
    openingTime,
  );
  // The magnetic trip commits once the current has lasted the opening time; the breaker then clears by
  // the floor, the clearing time, whatever the current does after (what a decaying current reads).
  const high = compositeEdge(
    [
      named(tableElement(thermal.maximum, rating), 'thermal'),
      named(definiteElement(magneticAmps * (1 + magnetic.tolerance / 100), openingTime), 'magnetic'),
    ],
    clearingTime,
  );
  const diagnostics: string[] = [];
  if (breaker.illustrative) diagnostics.push('illustrative curve, not a product: no selectivity claim may rest on it');
  if (fastFrom < magneticLow) {
    diagnostics.push(
      `the minimum thermal curve ends at ${Number((minimum.lastAmps / rating).toPrecision(4))}× rating, below the magnetic trip's lower edge at ${Number((magneticLow / rating).toPrecision(4))}×: the band takes the magnetic trip from its last point (digitise the curve up to the magnetic trip)`,
    );
  }
  // A thermal element picks up near 1.05–1.35 × rating (common practice); a table starting far above
  // that was most likely entered in amperes where multiples of the rating belong, and would leave the
  // breaker with no overload trip at all.
  const thermalStart = Math.min(thermal.minimum[0][0], thermal.maximum[0][0]);
  if (thermalStart > THERMAL_START_LIMIT) {
    diagnostics.push(
      `the thermal curve starts at ${Number(thermalStart.toPrecision(4))}× rating (${Number((thermalStart * rating).toPrecision(4))} A): its currents are multiples of the rating, not amperes, and a thermal element picks up near 1.05–1.35×; check the table`,
    );
  }
  const setting = magnetic.pickupAmps ?? magnetic.pickup ?? 0;
  if (magnetic.range && (setting < magnetic.range[0] || setting > magnetic.range[1])) {
    diagnostics.push(
      `magnetic pickup ${setting} is outside its adjustable range ${magnetic.range[0]}–${magnetic.range[1]}`,
    );
  }
  let currentLimitingFrom = breaker.currentLimitingFrom ?? Infinity;
  if (breaker.currentLimiting && breaker.currentLimitingFrom === undefined) {
    currentLimitingFrom = magneticAmps * (1 + magnetic.tolerance / 100);
  }
  return bandOfEdges(low, high, currentLimitingFrom, diagnostics);
}
