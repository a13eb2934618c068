import type { Band } from '../engine/band.ts';
import type { DrawWindow } from './scales.ts';

/**
 * A band sampled for drawing over the currents where it shows in the window.
 * `minTimes`/`maxTimes` hold each edge's time at `amps` with crossings of the window's top and
 * bottom inserted as exact boundary samples; they are not clamped (use {@link clampTime} for the fill).
 */
export interface BandTrace {
  /** Ascending currents (A): a log grid, each breakpoint with its two sides, and every crossing. */
  amps: Float64Array;
  minTimes: Float64Array;
  maxTimes: Float64Array;
  /** True when the two edges are the same curve (a single line is drawn). */
  coincident: boolean;
}

/** Relative step either side of a breakpoint, so a pickup's vertical edge is drawn at its exact current. */
const BREAKPOINT_SIDE = 1e-9;

/**
 * Samples a band for drawing: `samplesPerDecade` log-spaced currents per decade (one per pixel column
 * when it is the axis's pixels per decade) across the part of the window's
 * current range where the band is defined (`minAmps`–`maxAmps`), plus each breakpoint and its two
 * sides, plus the currents where either edge crosses the window's top or bottom time, found by
 * bisection to a relative current of 1e-12. Returns null when the band does not reach the window.
 * @example traceBand(relayBand, { amps: [10, 1e5], seconds: [0.01, 1000] }, 120)?.amps.length
 */
export function traceBand(band: Band, window: DrawWindow, samplesPerDecade: number): BandTrace | null {
  const low = Math.max(window.amps[0], Number.isFinite(band.minAmps) ? band.minAmps : 0);
  const high = Math.min(window.amps[1], band.maxAmps);
  if (!(high > low)) return null;

  // Stage 1: a log grid over the span, with every breakpoint inside it and its two sides.
  const grid: number[] = [];
  const n = Math.max(2, Math.ceil(Math.log10(high / low) * samplesPerDecade) + 1);
  const step = Math.log(high / low) / (n - 1);
  for (let i = 0; i < n; i++) grid.push(i === n - 1 ? high : low * Math.exp(step * i));
  for (const b of band.breakpoints) {
    for (const a of [b * (1 - BREAKPOINT_SIDE), b, b * (1 + BREAKPOINT_SIDE)]) if (a > low && a < high) grid.push(a);
  }
  grid.sort((a, b) => a - b);
  const amps = grid.filter((a, i) => i === 0 || a > grid[i - 1]);

  // Stage 2: the currents where each edge crosses the window's top or bottom, with the edge's exact boundary time.
  const [bottom, top] = window.seconds;
  const crossings = new Map<number, { min?: number; max?: number }>();
  for (const edge of ['min', 'max'] as const) {
    const time = edge === 'min' ? band.minTime : band.maxTime;
    let previous = time(amps[0]);
    for (let i = 1; i < amps.length; i++) {
      const t = time(amps[i]);
      for (const bound of [top, bottom]) {
        if (previous > bound !== t > bound) {
          const at = bisect((a) => time(a) > bound, amps[i - 1], amps[i]);
          const entry = crossings.get(at) ?? {};
          entry[edge] = bound;
          crossings.set(at, entry);
        }
      }
      previous = t;
    }
  }

  // Stage 3: both edges at every current, crossings taking their boundary time.
  const all = [...amps, ...[...crossings.keys()].filter((a) => !amps.includes(a))].sort((a, b) => a - b);
  const minTimes = new Float64Array(all.length);
  const maxTimes = new Float64Array(all.length);
  let coincident = true;
  all.forEach((a, i) => {
    const crossing = crossings.get(a);
    minTimes[i] = crossing?.min ?? band.minTime(a);
    maxTimes[i] = crossing?.max ?? band.maxTime(a);
    const same = maxTimes[i] === minTimes[i] || Math.abs(maxTimes[i] - minTimes[i]) <= 1e-12 * minTimes[i];
    if (!same) coincident = false;
  });
  return { amps: Float64Array.from(all), minTimes, maxTimes, coincident };
}

/**
 * A time held inside the window's time range (Infinity becomes the top).
 * @example clampTime(Infinity, [0.01, 1000]) // 1000
 */
export function clampTime(seconds: number, range: [number, number]): number {
  return Math.min(range[1], Math.max(range[0], seconds));
}

// Accepts a predicate that changes value once between a and b; returns the current where it does, to 1e-12 relative.
function bisect(above: (amps: number) => boolean, a: number, b: number): number {
  const atA = above(a);
  let lo = a;
  let hi = b;
  // At most 200 halvings of the log-width: enough for any range of doubles, and bounded even for a
  // degenerate bracket.
  for (let step = 0; step < 200 && hi / lo - 1 > 1e-12; step++) {
    const mid = Math.sqrt(lo * hi);
    if (above(mid) === atA) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}
