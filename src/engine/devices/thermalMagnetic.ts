import type { Band } from '../band.ts';
import { bandOfEdges, compositeEdge, definiteElement } from './composite.ts';
import { tableElement } from './pointTable.ts';
import type { ThermalMagnetic } from './thermalMagneticSchema.ts';

/**
 * The band of a thermal-magnetic breaker in amperes: the thermal tables scaled by the rating
 * (log-log interpolated, `Infinity` below each table's first current, held beyond its last), and
 * the magnetic trip, vertical at pickup × (1 ∓ tolerance) down to `openingTime` (fast edge) and
 * `clearingTime` (slow edge). Both edges are floored to those times.
 *
 * @example thermalMagneticBand(breaker).minTime(2000) // 0.00833 s for a 100 A breaker, magnetic 10×
 */
export function thermalMagneticBand(breaker: ThermalMagnetic): Band {
  const { rating, thermal, magnetic, openingTime, clearingTime } = breaker;
  const magneticAmps = magnetic.pickupAmps ?? (magnetic.pickup ?? 10) * rating;
  const low = compositeEdge(
    [
      tableElement(thermal.minimum, rating),
      definiteElement(magneticAmps * (1 - magnetic.tolerance / 100), openingTime),
    ],
    openingTime,
  );
  const high = compositeEdge(
    [
      tableElement(thermal.maximum, rating),
      definiteElement(magneticAmps * (1 + magnetic.tolerance / 100), clearingTime),
    ],
    clearingTime,
  );
  const diagnostics: string[] = [];
  if (breaker.illustrative) diagnostics.push('illustrative curve, not a product: no selectivity claim may rest on it');
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
