import { HALF_CYCLE_SECONDS, type Band } from './band.ts';

/** How a pair of bands relates over a current interval (DESIGN §4). */
export type IntervalStatus = 'selective' | 'thin margin' | 'overlap' | 'not provable from curves';

/** The point of an interval where the upstream device comes closest to (or furthest inside) the downstream band. */
export interface WorstPoint {
  /** Current in amps (on the bands' common base). */
  amps: number;
  /** Upstream earliest operating time there (s). */
  upTime: number;
  /** Downstream latest clearing time there (s). */
  downTime: number;
  /** `upTime · timeRatio − (downTime + margin)` in seconds; negative inside an overlap, `-Infinity` if the downstream device never clears. */
  marginSeconds: number;
  /** `upTime · timeRatio / (downTime + margin)`; below 1 inside an overlap. */
  ratio: number;
}

/** One classified interval of the pair's current range; intervals are ordered, adjacent and non-overlapping. */
export interface OverlapInterval {
  fromAmps: number;
  toAmps: number;
  status: IntervalStatus;
  worst: WorstPoint;
}

export interface OverlapOptions {
  /** Lowest current to check (A). @default the lowest current at which either device can operate */
  fromAmps?: number;
  /**
   * Highest current to check (A): the maximum fault current at the downstream device's location.
   * `Infinity` (an infinite bus) checks up to ten times the largest breakpoint of either band.
   */
  toAmps: number;
  /** Required time margin in seconds above the downstream clearing time. @default 0 */
  margin?: number;
  /**
   * Fraction of the upstream earliest time that the downstream clearing time must stay under (the
   * fuse–fuse "75 % rule", REFERENCE §4.3, is 0.75). @default 1
   */
  timeRatio?: number;
  /** A positive margin smaller than this (s) is a "thin margin". @default 0.1 */
  thinMargin?: number;
  /** Below this time curves prove nothing (s). @default HALF_CYCLE_SECONDS (0.01) */
  halfCycle?: number;
  /**
   * An upstream device whose earliest operation is at or after this time (s) is not affected by the
   * first-half-cycle behaviour of a current-limiting device, so curves still decide there. Our choice.
   * @default 0.1
   */
  instantaneousRegion?: number;
  /**
   * Times beyond this (s) count as never: a TCC sheet ends at about 1000 s, and an inverse curve's
   * thousands of seconds just above pickup prove nothing about coordination. @default 1000
   */
  horizon?: number;
  /** Log-grid density on each smooth segment. @default 24 */
  samplesPerDecade?: number;
  /** Relative current tolerance of every interval edge. @default 1e-6 */
  tolerance?: number;
}

const STATUSES: IntervalStatus[] = ['selective', 'thin margin', 'overlap', 'not provable from curves'];

/**
 * Finds, exactly, where an upstream band and a downstream band (on one voltage base) can and cannot be
 * told apart (DESIGN §4). The range is split at every breakpoint of both bands, each smooth segment is
 * sampled on a log grid, every change of class is bracketed and refined by bisection to `tolerance`.
 *
 * At each current: `overlap` where `up.minTime · timeRatio < down.maxTime + margin` (so also where the
 * upstream device operates on a current the downstream one carries indefinitely); `thin margin` where the
 * slack is below `thinMargin`; `not provable from curves` where both bands reach down to the
 * half-cycle and the downstream device surely clears within the instantaneous region (two
 * instantaneous trips), or where either device is current-limiting while the upstream one responds
 * within the instantaneous region; otherwise `selective`.
 *
 * @example findOverlaps(mainBand, feederBand, { toAmps: 28_421, margin: 0 })
 */
export function findOverlaps(up: Band, down: Band, options: OverlapOptions): OverlapInterval[] {
  const {
    fromAmps = Math.min(up.minAmps, down.minAmps),
    toAmps,
    margin = 0,
    timeRatio = 1,
    thinMargin = 0.1,
    halfCycle = HALF_CYCLE_SECONDS,
    instantaneousRegion = 0.1,
    horizon = 1000,
    samplesPerDecade = 24,
    tolerance = 1e-6,
  } = options;
  // An infinite bus has no top current; beyond their last breakpoints both bands are flat, so ten
  // times the largest one shows every change there is.
  if (toAmps === Infinity) {
    const largest = Math.max(fromAmps, ...up.breakpoints, ...down.breakpoints);
    return findOverlaps(up, down, { ...options, toAmps: 10 * largest });
  }
  if (!(fromAmps > 0) || !(toAmps > fromAmps)) return [];
  const upMin = (amps: number) => beyond(up.minTime(amps), horizon);
  const downMax = (amps: number) => beyond(down.maxTime(amps), horizon);
  const downFast = down.minTime;
  const limitingFrom = Math.min(up.currentLimitingFrom, down.currentLimitingFrom);

  const classOf = (amps: number, upTime: number, downTime: number): number => {
    if (upTime === Infinity) return 0;
    const limiting = amps >= limitingFrom && upTime < instantaneousRegion;
    // Two instantaneous trips: the upstream band and the downstream band both reach the half-cycle,
    // and the downstream device surely clears within the instantaneous region.
    const bothInstantaneous = upTime <= halfCycle && downTime <= instantaneousRegion && downFast(amps) <= halfCycle;
    if (bothInstantaneous || limiting) return 3;
    const slack = upTime * timeRatio - (downTime + margin);
    if (!(slack >= 0)) return 2;
    return slack < thinMargin ? 1 : 0;
  };
  const classify = (amps: number) => classOf(amps, upMin(amps), downMax(amps));
  const ratioOf = (upTime: number, downTime: number): number => {
    const needed = downTime + margin;
    if (upTime === Infinity) return Infinity;
    if (needed === Infinity) return 0;
    return needed === 0 ? Infinity : (upTime * timeRatio) / needed;
  };
  const pointOf = (amps: number, upTime = upMin(amps), downTime = downMax(amps)): WorstPoint => ({
    amps,
    upTime,
    downTime,
    marginSeconds: upTime === Infinity ? Infinity : upTime * timeRatio - (downTime + margin),
    ratio: ratioOf(upTime, downTime),
  });

  // Stage 1: the grid — range ends, every breakpoint inside, and log-spaced samples between them —
  // evaluated once, with each local minimum of the time ratio refined and added, so that a narrow
  // dip cannot hide inside a cell.
  const grid = gridOf(fromAmps, toAmps, [up.breakpoints, down.breakpoints], samplesPerDecade);
  const ratios = new Float64Array(grid.length);
  for (let i = 0; i < grid.length; i++) ratios[i] = ratioOf(upMin(grid[i]), downMax(grid[i]));
  // Only a dip that comes within twice the required time can cross a class edge unseen.
  const extra = refinedMinima(grid, ratios, (amps) => ratioOf(upMin(amps), downMax(amps)), 2);
  const points = extra.length === 0 ? grid : Float64Array.from([...grid, ...extra]).sort();
  const upTimes = new Float64Array(points.length);
  const downTimes = new Float64Array(points.length);
  const classes = new Int8Array(points.length);
  for (let i = 0; i < points.length; i++) {
    upTimes[i] = upMin(points[i]);
    downTimes[i] = downMax(points[i]);
    classes[i] = classOf(points[i], upTimes[i], downTimes[i]);
  }

  // Stage 2: bisect every change of class to the tolerance (several changes may share one cell);
  // collect the intervals, each with its worst point.
  const intervals: OverlapInterval[] = [];
  let start = fromAmps;
  let current = classes[0];
  let worst = pointOf(points[0], upTimes[0], downTimes[0]);
  const consider = (i: number) => {
    const ratio = ratioOf(upTimes[i], downTimes[i]);
    const margin_ = upTimes[i] * timeRatio - (downTimes[i] + margin);
    if (ratio < worst.ratio || (ratio === worst.ratio && margin_ < worst.marginSeconds)) {
      worst = pointOf(points[i], upTimes[i], downTimes[i]);
    }
  };
  for (let i = 1; i < points.length; i++) {
    let lo = points[i - 1];
    while (classes[i] !== current) {
      let hi = points[i];
      while (hi - lo > tolerance * lo) {
        const mid = Math.sqrt(lo * hi);
        if (classify(mid) === current) lo = mid;
        else hi = mid;
      }
      worst = worse(worst, pointOf(lo));
      intervals.push({ fromAmps: start, toAmps: hi, status: STATUSES[current], worst });
      start = hi;
      lo = hi;
      current = classify(hi);
      worst = pointOf(hi);
    }
    consider(i);
  }
  intervals.push({ fromAmps: start, toAmps, status: STATUSES[current], worst });
  return intervals;
}

/**
 * Log-spaced currents from `from` to `to` with every breakpoint inside, sorted and without duplicates;
 * each smooth segment gets at least four cells.
 */
function gridOf(from: number, to: number, breakpointSets: Float64Array[], samplesPerDecade: number): Float64Array {
  const knots = [from];
  for (const set of breakpointSets) for (const amps of set) if (amps > from && amps < to) knots.push(amps);
  knots.push(to);
  knots.sort((a, b) => a - b);
  const points: number[] = [];
  for (let k = 0; k + 1 < knots.length; k++) {
    const a = knots[k];
    const b = knots[k + 1];
    if (!(b > a * (1 + 1e-12))) continue;
    const cells = Math.max(4, Math.ceil(samplesPerDecade * Math.log10(b / a)));
    const step = Math.pow(b / a, 1 / cells);
    let amps = a;
    for (let c = 0; c < cells; c++, amps *= step) points.push(c === 0 ? a : amps);
  }
  points.push(to);
  return Float64Array.from(points);
}

/**
 * The refined position of every interior local minimum of `score` below `below` on a sorted grid
 * (golden-section search between the neighbouring samples), given the grid's scores.
 */
function refinedMinima(
  grid: Float64Array,
  values: Float64Array,
  score: (amps: number) => number,
  below: number,
): number[] {
  const extra: number[] = [];
  const golden = (Math.sqrt(5) - 1) / 2;
  for (let i = 1; i + 1 < grid.length; i++) {
    if (!(values[i] < below) || !(values[i] < values[i - 1]) || !(values[i] <= values[i + 1])) continue;
    let a = Math.log(grid[i - 1]);
    let b = Math.log(grid[i + 1]);
    let c = b - golden * (b - a);
    let d = a + golden * (b - a);
    let fc = score(Math.exp(c));
    let fd = score(Math.exp(d));
    for (let k = 0; k < 40 && b - a > 1e-7; k++) {
      if (fc < fd) {
        b = d;
        d = c;
        fd = fc;
        c = b - golden * (b - a);
        fc = score(Math.exp(c));
      } else {
        a = c;
        c = d;
        fc = fd;
        d = a + golden * (b - a);
        fd = score(Math.exp(d));
      }
    }
    const amps = Math.exp((a + b) / 2);
    if (amps > grid[i - 1] && amps < grid[i + 1] && amps !== grid[i]) extra.push(amps);
  }
  return extra;
}

/** A time past the horizon counts as never. */
function beyond(seconds: number, horizon: number): number {
  return seconds > horizon ? Infinity : seconds;
}

/** The worse of two points: the smaller time ratio (ties broken by the smaller margin). */
function worse(a: WorstPoint, b: WorstPoint): WorstPoint {
  if (b.ratio < a.ratio) return b;
  if (b.ratio === a.ratio && b.marginSeconds < a.marginSeconds) return b;
  return a;
}
