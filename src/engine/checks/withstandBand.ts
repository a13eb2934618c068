import type { Band } from '../band.ts';
import { findOverlaps, type OverlapInterval, type WorstPoint } from '../overlap.ts';
import type { WithstandCurve } from '../withstand/index.ts';

/**
 * A withstand curve seen as the "upstream" side of the overlap finder: the equipment lasts until
 * `timeAt(I)`, so a device protects it where its clearing time stays below that. `scale` moves the
 * curve's currents onto the sheet's base (and applies a Δ–Y shift, IEEE C37.91 / IEEE C57.109 delta–wye shift factors).
 *
 * @example findOverlaps(withstandBandOf(curve, 480 / 12470), primaryFuseBand, { toAmps, halfCycle: 0 })
 */
export function withstandBandOf(curve: WithstandCurve, scale: number): Band {
  const { timeAt } = curve;
  const inverse = 1 / scale;
  const time = (amps: number) => timeAt(amps * inverse);
  return {
    minTime: time,
    maxTime: time,
    breakpoints: scaledCurrentsOf(curve.amps, scale),
    minAmps: curve.amps[0] * scale,
    maxAmps: curve.amps[curve.amps.length - 1] * scale,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/**
 * Each current of a curve once, times `scale`: the curve's currents never fall (a vertical step repeats
 * one), so a repeat is always the current before it. A loop, not a set and a mapping: a study builds a
 * withstand band for every cable and transformer.
 */
function scaledCurrentsOf(amps: Float64Array, scale: number): Float64Array {
  let distinct = 0;
  for (let i = 0; i < amps.length; i++) if (i === 0 || amps[i] !== amps[i - 1]) distinct++;
  const scaled = new Float64Array(distinct);
  for (let i = 0, k = 0; i < amps.length; i++) if (i === 0 || amps[i] !== amps[i - 1]) scaled[k++] = amps[i] * scale;
  return scaled;
}

/** Finder options that turn off the half-cycle rules, which do not apply to equipment limits. */
const PROTECTION_FINDER = { margin: 0, thinMargin: 0, halfCycle: 0, instantaneousRegion: 0 } as const;

/**
 * Whether `band` clears below `withstand` from `fromAmps` to `toAmps` (both on one base): the intervals
 * where it does not (`failures`), or, where there are none, the point where it comes closest (`closest`,
 * the least time ratio). The one comparison behind the cable, transformer and generator protection checks.
 *
 * @example protectionOf(withstandBandOf(curve, 1), breakerBand, 700, 30_000, 1000).failures.length // 0
 */
export function protectionOf(
  withstand: Band,
  band: Band,
  fromAmps: number,
  toAmps: number,
  horizon: number,
): { failures: OverlapInterval[]; closest?: WorstPoint } {
  const intervals = findOverlaps(withstand, band, { fromAmps, toAmps, horizon, ...PROTECTION_FINDER });
  const failures = intervals.filter((interval) => interval.status === 'overlap');
  if (failures.length > 0) return { failures };
  return { failures, closest: intervals.reduce((a, b) => (b.worst.ratio < a.worst.ratio ? b : a)).worst };
}
