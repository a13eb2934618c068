import { evaluateBand, type Band } from './band.ts';

/** Options of `sampleBand`. */
export interface SampleBandOptions {
  /** Lowest current sampled (A), greater than 0. */
  fromAmps: number;
  /** Highest current sampled (A), greater than `fromAmps`. */
  toAmps: number;
  /** Log-spaced currents per decade (about one per pixel column when drawing). @default 100 */
  pointsPerDecade?: number;
}

/** A band sampled for drawing: currents ascending with both edges' times at each (`Infinity` kept). */
export interface SampledBand {
  amps: Float64Array;
  minTimes: Float64Array;
  maxTimes: Float64Array;
}

/** How far below a breakpoint the extra sample sits, relative to it, so vertical edges draw exactly. */
const JUST_BELOW = 1 - 1e-9;

/**
 * Samples a band for drawing (DEVELOPERS.md, bands and overlaps): log-spaced currents from `fromAmps` to `toAmps` (both
 * included), plus every breakpoint inside that range and a point just below each (1e-9 relative) so
 * a vertical edge is exact; sorted ascending, without duplicates. Throws `RangeError` on a bad range.
 *
 * @example sampleBand(bandOf(fuse), { fromAmps: 10, toAmps: 100_000, pointsPerDecade: 50 }).amps.length
 */
export function sampleBand(band: Band, options: SampleBandOptions): SampledBand {
  const { fromAmps, toAmps, pointsPerDecade = 100 } = options;
  if (!(fromAmps > 0) || !Number.isFinite(fromAmps)) {
    throw new RangeError(`fromAmps: expected a current greater than 0, got "${fromAmps}"`);
  }
  if (!(toAmps > fromAmps) || !Number.isFinite(toAmps)) {
    throw new RangeError(`toAmps: expected a current above fromAmps ${fromAmps}, got "${toAmps}"`);
  }
  if (!(pointsPerDecade >= 1) || !Number.isFinite(pointsPerDecade)) {
    throw new RangeError(`pointsPerDecade: expected a number of at least 1, got "${pointsPerDecade}"`);
  }
  const decades = Math.log10(toAmps / fromAmps);
  const steps = Math.max(1, Math.ceil(decades * pointsPerDecade));
  const candidates: number[] = [];
  for (let i = 0; i <= steps; i++) candidates.push(i === steps ? toAmps : fromAmps * 10 ** ((decades * i) / steps));
  for (const breakpoint of band.breakpoints) {
    if (breakpoint < fromAmps || breakpoint > toAmps) continue;
    candidates.push(breakpoint);
    const below = breakpoint * JUST_BELOW;
    if (below >= fromAmps) candidates.push(below);
  }
  candidates.sort((a, b) => a - b);
  const amps = Float64Array.from(candidates.filter((v, i) => i === 0 || v !== candidates[i - 1]));
  return { amps, ...evaluateBand(band, amps) };
}
