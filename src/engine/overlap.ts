import { HALF_CYCLE_SECONDS, type Band } from './band.ts';

/** How a pair of bands relates over a current interval (DEVELOPERS.md, bands and overlaps). */
export type IntervalStatus = 'selective' | 'thin margin' | 'overlap' | 'not provable from curves';

/**
 * The point of an interval where the upstream device comes closest to (or furthest inside) the downstream
 * band: the least time ratio, and among equal ratios (two I²t curves keep one) the least slack.
 */
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
   * fuse–fuse "75 % rule", common practice, is 0.75). @default 1
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
   * thousands of seconds just above pickup prove nothing about coordination. Not so for the upstream
   * device where the downstream one never clears at all (below its pickup): however long the upstream
   * device takes there, it operates on a current the downstream one carries indefinitely, an overlap
   * (an upstream pickup below the downstream one). @default 1000
   */
  horizon?: number;
  /** Log-grid density on each smooth segment. @default 12 */
  samplesPerDecade?: number;
  /** Relative current tolerance of every interval edge. @default 1e-6 */
  tolerance?: number;
}

/** Golden-section steps spent on each dip or peak of the slack (its turn to 0.2 % of a cell). */
const TURN_STEPS = 10;
const GOLDEN = (Math.sqrt(5) - 1) / 2;
/** Time ratios within this relative difference are one ratio when the worst point is chosen. */
const RATIO_TIE = 1e-9;
/** Cells of the grid in each smooth segment, however short (its ends and the point just below its top are always evaluated). */
const MIN_CELLS = 1;

const STATUSES: IntervalStatus[] = ['selective', 'thin margin', 'overlap', 'not provable from curves'];
/** How far past its largest breakpoint an infinite bus's pair is checked at most: 10⁴ ×. */
const INFINITE_BUS_REACH = 1e4;
/** A band edge whose time changes by no more than this fraction over a decade is flat there. */
const FLAT = 1e-6;

/**
 * Finds, exactly, where an upstream band and a downstream band (on one voltage base) can and cannot be
 * told apart (DEVELOPERS.md, bands and overlaps). The range is split at every breakpoint of both
 * bands, each smooth segment is sampled on a log grid (evaluated once), the class just past every
 * jump of the upstream time from never inside a cell (a pickup, the horizon) is probed, so is every
 * local dip or peak of the slack (`up.minTime · timeRatio − down.maxTime − margin`) at its turn, and
 * every change of class is bracketed and refined to `tolerance`: at a breakpoint in one step, elsewhere
 * by Illinois regula falsi on the logarithm of the times, which needs a handful of evaluations where
 * bisection needs twenty.
 *
 * At each current: `overlap` where `up.minTime · timeRatio < down.maxTime + margin` (so also where the
 * upstream device operates on a current the downstream one carries indefinitely); `thin margin` where the
 * slack is below `thinMargin`; `not provable from curves` where both bands reach down to the
 * half-cycle and the downstream device surely clears within the instantaneous region (two
 * instantaneous trips), or where either device is current-limiting while the upstream one responds
 * within the instantaneous region and the downstream one may act within the half-cycle; otherwise `selective`.
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
    samplesPerDecade = 12,
    tolerance = 1e-6,
  } = options;
  // An infinite bus has no top current. Past their last breakpoints the bands change only as their
  // curves run on: a flat element not at all, an inverse curve with no definite-time floor for decades
  // (an extremely inverse relay over a very inverse one crosses it well past ten times its pickup). So
  // the range runs on by decades until both deciding edges are flat or below the half-cycle over the
  // last one, and at most to 10⁴ × the largest breakpoint, beyond any fault a real system delivers.
  if (toAmps === Infinity) {
    const largest = Math.max(fromAmps, ...up.breakpoints, ...down.breakpoints);
    let top = 10 * largest;
    while (top < INFINITE_BUS_REACH * largest && !settledAbove(up, down, top, halfCycle)) top *= 10;
    return findOverlaps(up, down, { ...options, toAmps: top });
  }
  if (!(fromAmps > 0) || !(toAmps > fromAmps)) return [];
  const pair = compared;
  pair.upFast = up.minTime;
  pair.downSlow = down.maxTime;
  pair.downFast = down.minTime;
  pair.margin = margin;
  pair.timeRatio = timeRatio;
  pair.thinMargin = thinMargin;
  pair.halfCycle = halfCycle;
  pair.instantaneousRegion = instantaneousRegion;
  pair.horizon = horizon;
  pair.tolerance = tolerance;
  pair.limitingFrom = Math.min(up.currentLimitingFrom, down.currentLimitingFrom);

  // Stage 1: the grid — range ends, every breakpoint inside, and log-spaced samples between them —
  // evaluated once; where an edge's time jumps from never inside a cell the class just past the jump
  // is probed (`probeJumpsFromNever`), and each local dip or peak of the slack at its turn (a
  // golden-section search between its neighbours, `probeDipsAndPeaks`), so that a narrow class cannot
  // hide inside a cell.
  let count = gridOf(fromAmps, toAmps, up.breakpoints, down.breakpoints, samplesPerDecade, tolerance);
  const { points, upTimes, downTimes, classes, probed } = scratch;
  if (up.evaluateInto && down.evaluateInto) {
    // The two edges the finder compares over the whole grid, one call each (the same doubles as one
    // current at a time, by the band contract): the upstream earliest and the downstream latest.
    const amps = points.subarray(0, count);
    up.evaluateInto(amps, upTimes, undefined);
    down.evaluateInto(amps, undefined, downTimes);
    for (let i = 0; i < count; i++) {
      const u = upTimes[i] > horizon && downTimes[i] !== Infinity ? Infinity : upTimes[i];
      const d = downTimes[i] > horizon ? Infinity : downTimes[i];
      upTimes[i] = u;
      downTimes[i] = d;
      classes[i] = classOf(points[i], u, d);
    }
  } else {
    for (let i = 0; i < count; i++) {
      classes[i] = probe(points[i]);
      upTimes[i] = probed[0];
      downTimes[i] = probed[1];
    }
  }
  count = probeJumpsFromNever(count);
  count = probeDipsAndPeaks(count);

  // Stage 2: refine every change of class (several may share one cell); collect the intervals, each
  // with its worst point.
  const intervals: OverlapInterval[] = [];
  const edge = scratch.edge;
  let start = fromAmps;
  let current = classes[0];
  // The interval's worst point so far, as numbers: its object is built once, when the interval closes.
  let worstAmps = points[0];
  let worstUp = upTimes[0];
  let worstDown = downTimes[0];
  let worstRatio = ratioOf(worstUp, worstDown);
  let worstMargin = marginOf(worstUp, worstDown);
  for (let i = 1; i < count; i++) {
    let lo = points[i - 1];
    let loUp = upTimes[i - 1];
    let loDown = downTimes[i - 1];
    while (classes[i] !== current) {
      refineEdge(lo, loUp, loDown, points[i], upTimes[i], downTimes[i], current);
      const lastRatio = ratioOf(edge[LO_UP], edge[LO_DOWN]);
      const lastMargin = marginOf(edge[LO_UP], edge[LO_DOWN]);
      if (isWorse(lastRatio, lastMargin, edge[LO_UP], worstRatio, worstMargin, worstUp)) {
        worstAmps = edge[LO];
        worstUp = edge[LO_UP];
        worstDown = edge[LO_DOWN];
      }
      const worst = pointOf(worstAmps, worstUp, worstDown);
      intervals.push({ fromAmps: start, toAmps: edge[HI], status: STATUSES[current], worst });
      start = edge[HI];
      lo = edge[HI];
      loUp = edge[HI_UP];
      loDown = edge[HI_DOWN];
      current = edge[HI_CLASS];
      worstAmps = lo;
      worstUp = loUp;
      worstDown = loDown;
      worstRatio = ratioOf(loUp, loDown);
      worstMargin = marginOf(loUp, loDown);
    }
    const ratio = ratioOf(upTimes[i], downTimes[i]);
    const slack = upTimes[i] * timeRatio - (downTimes[i] + margin);
    if (isWorse(ratio, slack, upTimes[i], worstRatio, worstMargin, worstUp)) {
      worstAmps = points[i];
      worstUp = upTimes[i];
      worstDown = downTimes[i];
      worstRatio = ratio;
      worstMargin = marginOf(worstUp, worstDown);
    }
  }
  const worst = pointOf(worstAmps, worstUp, worstDown);
  intervals.push({ fromAmps: start, toAmps, status: STATUSES[current], worst });
  // An exact-size copy (an array grown by `push` keeps room for 17 items): a study keeps thousands.
  return intervals.slice();
}

/**
 * Whether a point (its time ratio, slack and upstream time) is worse than the interval's worst so far:
 * a lower ratio, or, where the ratios agree to a relative 1e-9 (two I²t curves keep a constant ratio,
 * and rounding alone then picks among their points), less slack, the closest the curves come in
 * seconds; where the downstream device never clears at either (no slack at all), the sooner the
 * upstream device operates.
 */
function isWorse(
  ratio: number,
  slack: number,
  upTime: number,
  worstRatio: number,
  worstSlack: number,
  worstUp: number,
): boolean {
  if (ratio < worstRatio * (1 - RATIO_TIE)) return true;
  if (!(ratio <= worstRatio * (1 + RATIO_TIE))) return false;
  return slack < worstSlack || (slack === -Infinity && worstSlack === -Infinity && upTime < worstUp);
}

/**
 * Whether nothing can change above `amps`: over the decade from it, the upstream device's fast edge and
 * the downstream device's slow edge are each flat, or at or below the half-cycle at both ends.
 */
function settledAbove(up: Band, down: Band, amps: number, halfCycle: number): boolean {
  return [up.minTime, down.maxTime].every((time) => {
    const [here, tenfold] = [time(amps), time(10 * amps)];
    return here === tenfold || Math.abs(here - tenfold) <= FLAT * here || (here <= halfCycle && tenfold <= halfCycle);
  });
}

/**
 * The pair being compared by the running `findOverlaps` call: its three edges and its settings. The
 * finder's steps are module functions that read it here, not closures made per call: a closure's
 * numbers live in a context object where each is boxed, so every call allocated its settings anew and
 * every step read them through boxes (a study checks thousands of pairs). Set at the start of each
 * call, before any step runs; a band never calls the finder.
 */
const compared = {
  upFast: (amps: number): number => amps,
  downSlow: (amps: number): number => amps,
  downFast: (amps: number): number => amps,
  margin: 0.5,
  timeRatio: 0.5,
  thinMargin: 0.5,
  halfCycle: 0.5,
  instantaneousRegion: 0.5,
  horizon: 0.5,
  tolerance: 0.5,
  limitingFrom: 0.5,
};

/** The class of a current (0 selective, 1 thin margin, 2 overlap, 3 not provable), from the two edges' times there. */
function classOf(amps: number, upTime: number, downTime: number): number {
  if (upTime === Infinity) return 0;
  const pair = compared;
  // A current-limiting device (either one) decides within the first half-cycle, so where the upstream
  // device responds within the instantaneous region the curves cannot tell, but only if the downstream
  // device may act within that half-cycle too. One that waits longer (a short-time delay) cuts nothing:
  // the upstream device sees the whole current and operates first, as the curves show.
  const limiting =
    amps >= pair.limitingFrom && upTime < pair.instantaneousRegion && pair.downFast(amps) <= pair.halfCycle;
  // Two instantaneous trips: the upstream band and the downstream band both reach the half-cycle,
  // and the downstream device surely clears within the instantaneous region.
  if (
    limiting ||
    (upTime <= pair.halfCycle && downTime <= pair.instantaneousRegion && pair.downFast(amps) <= pair.halfCycle)
  )
    return 3;
  const slack = upTime * pair.timeRatio - (downTime + pair.margin);
  if (!(slack >= 0)) return 2;
  return slack < pair.thinMargin ? 1 : 0;
}

function ratioOf(upTime: number, downTime: number): number {
  const needed = downTime + compared.margin;
  if (upTime === Infinity) return Infinity;
  if (needed === Infinity) return 0;
  return needed === 0 ? Infinity : (upTime * compared.timeRatio) / needed;
}

function marginOf(upTime: number, downTime: number): number {
  return upTime === Infinity ? Infinity : upTime * compared.timeRatio - (downTime + compared.margin);
}

function pointOf(amps: number, upTime: number, downTime: number): WorstPoint {
  return {
    amps,
    upTime,
    downTime,
    marginSeconds: marginOf(upTime, downTime),
    ratio: ratioOf(upTime, downTime),
  };
}

/**
 * The class at one current; its upstream and downstream times (past the horizon: never, the upstream
 * one only where the downstream device clears at all, see `OverlapOptions.horizon`) are left in
 * `scratch.probed`, a typed array, so no number is boxed per probe.
 */
function probe(amps: number): number {
  const pair = compared;
  const u = pair.upFast(amps);
  const d = pair.downSlow(amps);
  const up = u > pair.horizon && d !== Infinity ? Infinity : u;
  const down = d > pair.horizon ? Infinity : d;
  scratch.probed[0] = up;
  scratch.probed[1] = down;
  return classOf(amps, up, down);
}

/**
 * Probes at `e^x` and keeps it in `scratch.best` (current, class, upstream and downstream time,
 * `sign` × slack) if `sign` × its slack is the lowest so far (`sign` 1 seeks a dip, −1 a peak);
 * returns `sign` × the slack.
 */
function probeKeepingLowest(x: number, sign: number): number {
  const amps = Math.exp(x);
  const cls = probe(amps);
  const { probed, best } = scratch;
  const value = sign * marginOf(probed[0], probed[1]);
  if (!(value >= best[4])) {
    best[0] = amps;
    best[1] = cls;
    best[2] = probed[0];
    best[3] = probed[1];
    best[4] = value;
  }
  return value;
}

/**
 * Probes every interior local minimum of the slack outside an overlap that comes within the required
 * time of the line below it (such a dip may cross that line unseen), and every interior local maximum
 * inside a thin margin, or inside an overlap within half the required time of the line (such a peak
 * may cross a line above it), at its turn, found by golden-section search, and inserts that probe into
 * the grid. Returns the new number of points.
 */
function probeDipsAndPeaks(size: number): number {
  const { points, upTimes, downTimes, classes } = scratch;
  const turns: Probe[] = [];
  // The slack, not the time ratio: both lines are lines of the slack (0 for an overlap, `thinMargin` for a
  // thin margin), and the ratio turns at other currents than the slack does.
  let s0 = marginOf(upTimes[0], downTimes[0]);
  let s1 = size > 1 ? marginOf(upTimes[1], downTimes[1]) : Infinity;
  for (let i = 1; i + 1 < size; i++) {
    const s2 = marginOf(upTimes[i + 1], downTimes[i + 1]);
    const cls = classes[i];
    const needed = downTimes[i] + compared.margin;
    // A dip outside an overlap that comes within the needed time of the line below it may cross it; so
    // may a peak inside a thin margin, or inside an overlap within half the needed time of the line.
    const lineBelow = cls === 0 ? compared.thinMargin : 0;
    const dip = cls !== 2 && s1 < s0 && s1 <= s2 && s1 - lineBelow < needed;
    const peak = !dip && s1 > s0 && s1 >= s2 && (cls === 1 || (cls === 2 && s1 > -needed / 2));
    if (dip || peak) {
      const sign = dip ? 1 : -1;
      // Golden-section search in log current between the neighbours, keeping the lowest (or highest)
      // probe (`scratch.best`, NaN: none yet).
      let xa = Math.log(points[i - 1]);
      let xb = Math.log(points[i + 1]);
      const best = scratch.best.fill(NaN);
      let xc = xb - GOLDEN * (xb - xa);
      let xd = xa + GOLDEN * (xb - xa);
      let fc = probeKeepingLowest(xc, sign);
      let fd = probeKeepingLowest(xd, sign);
      for (let step = 0; step < TURN_STEPS; step++) {
        if (fc < fd) {
          xb = xd;
          xd = xc;
          fd = fc;
          xc = xb - GOLDEN * (xb - xa);
          fc = probeKeepingLowest(xc, sign);
        } else {
          xa = xc;
          xc = xd;
          fc = fd;
          xd = xa + GOLDEN * (xb - xa);
          fd = probeKeepingLowest(xd, sign);
        }
      }
      const amps = best[0];
      if (amps > points[i - 1] && amps < points[i + 1] && amps !== points[i]) {
        turns.push({ amps, cls: best[1], up: best[2], down: best[3], at: amps < points[i] ? i : i + 1 });
      }
    }
    s0 = s1;
    s1 = s2;
  }
  return insertProbes(size, turns);
}

/** A probe to insert into the grid: its current, the index it goes before, its class and its times. */
interface Probe {
  amps: number;
  at: number;
  cls: number;
  up: number;
  down: number;
}

/** Inserts `probes` (ascending, each before its `at`) into the grid of `size` points; returns the new size. */
function insertProbes(size: number, probes: Probe[]): number {
  if (probes.length === 0) return size;
  const { points, upTimes, downTimes, classes } = scratch;
  const total = size + probes.length;
  if (points.length < total) throw new Error('overlap grid scratch too small'); // gridOf leaves room
  // Insert from the last probe backwards, shifting the tail right once per probe.
  let end = size;
  for (let k = probes.length - 1; k >= 0; k--) {
    const probe = probes[k];
    for (let j = end; j > probe.at; j--) {
      points[j + k] = points[j - 1];
      upTimes[j + k] = upTimes[j - 1];
      downTimes[j + k] = downTimes[j - 1];
      classes[j + k] = classes[j - 1];
    }
    end = probe.at;
    points[probe.at + k] = probe.amps;
    upTimes[probe.at + k] = probe.up;
    downTimes[probe.at + k] = probe.down;
    classes[probe.at + k] = probe.cls;
  }
  return total;
}

/**
 * Where the upstream time jumps from never inside a cell (it falls to the horizon there, or the cell
 * starts at its pickup), a class can begin and end unseen by the cell's ends:
 * - where the downstream time also falls to the horizon in the cell, after the upstream one: between
 *   the two the upstream device operates on a current the downstream one carries beyond the horizon,
 *   an overlap;
 * - where the downstream time is close to the upstream one: just past the jump the slack may be thin
 *   or negative.
 * In each, the jump is found (`horizonCrossing`) and a probe just past it (for the first, just before
 * the downstream crossing) is inserted into the grid, so the refinement sees the class there.
 * Elsewhere a jump hides nothing: before it the upstream device never operates (selective), and a
 * downstream time beyond the horizon across the cell makes all past it an overlap, seen at the
 * cell's end. Returns the new number of points.
 */
function probeJumpsFromNever(size: number): number {
  const { points, upTimes, downTimes, probed, crossing } = scratch;
  const pair = compared;
  const probes: Probe[] = [];
  for (let i = 0; i + 1 < size; i++) {
    const upCrosses = upTimes[i] === Infinity && upTimes[i + 1] !== Infinity;
    if (!upCrosses) continue;
    // With the downstream edge beyond the horizon across the cell, all past the upstream crossing is
    // an overlap, seen at the cell's end.
    if (downTimes[i + 1] === Infinity) continue;
    let amps = NaN;
    if (downTimes[i] === Infinity) {
      // Both cross: probe the last current where the downstream edge is beyond the horizon. Where that
      // is the cell's start (a pickup), the downstream edge is within the horizon all along the cell.
      horizonCrossing(pair.downSlow, points[i], points[i + 1]);
      if (crossing[0] > points[i]) amps = crossing[0];
    }
    if (Number.isNaN(amps)) {
      // The slack anywhere past the upstream crossing is at least the upstream time at the cell's end
      // less the downstream time at its start: nothing to see unless that is thin.
      const leastSlack = upTimes[i + 1] * pair.timeRatio - (downTimes[i] + pair.margin);
      if (leastSlack >= pair.thinMargin) continue;
      horizonCrossing(pair.upFast, points[i], points[i + 1]);
      amps = crossing[1];
    }
    if (!(amps > points[i] && amps < points[i + 1])) continue;
    const cls = probe(amps);
    probes.push({ amps, at: i + 1, cls, up: probed[0], down: probed[1] });
  }
  return insertProbes(size, probes);
}

/**
 * The next probe (log current) of a bracket from `x0` to `x1` whose function is `g0` and `g1` at its
 * ends: the regula falsi estimate, kept strictly inside so that the bracket closes once the estimate is
 * near an end; the midpoint while an end is infinite or the two are equal.
 */
function nextProbe(x0: number, x1: number, g0: number, g1: number, tolerance: number): number {
  if (!(Number.isFinite(g0) && Number.isFinite(g1) && g0 !== g1)) return 0.5 * (x0 + x1);
  let x = x1 - (g1 * (x1 - x0)) / (g1 - g0);
  const room = 0.25 * tolerance;
  if (!(x > x0 + room)) x = x0 + room;
  if (!(x < x1 - room)) x = x1 - room;
  return x;
}

/**
 * The current where `time` (non-increasing) falls to the horizon between `lo` (beyond it) and `hi`
 * (within it), to the finder's tolerance: the last current beyond and the first within, left in
 * `scratch.crossing`. Illinois regula falsi on the logarithm of the time, bisection while an end is
 * infinite (below a pickup).
 */
function horizonCrossing(time: (amps: number) => number, lo: number, hi: number): void {
  const pair = compared;
  const logHorizon = Math.log(pair.horizon);
  let x0 = Math.log(lo);
  let x1 = Math.log(hi);
  // Most often the jump is the pickup itself, at the cell's start: one probe just past it tells.
  const past = lo * (1 + 0.5 * pair.tolerance);
  if (time(past) <= pair.horizon) {
    scratch.crossing[0] = lo;
    scratch.crossing[1] = past;
    return;
  }
  let g0 = Math.log(time(lo)) - logHorizon;
  let g1 = Math.log(time(hi)) - logHorizon;
  let side = 0;
  for (let step = 0; step < 500 && hi - lo > pair.tolerance * lo; step++) {
    const x = nextProbe(x0, x1, g0, g1, pair.tolerance);
    const amps = Math.exp(x);
    const g = Math.log(time(amps)) - logHorizon;
    if (g > 0) {
      lo = amps;
      x0 = x;
      g0 = g;
      if (side === -1) g1 *= 0.5;
      side = -1;
    } else {
      hi = amps;
      x1 = x;
      g1 = g;
      if (side === 1) g0 *= 0.5;
      side = 1;
    }
  }
  scratch.crossing[0] = lo;
  scratch.crossing[1] = hi;
}

/** Where `refineEdge` leaves an edge in `scratch.edge`: the last current of the class and the first beyond, each with its times, and the class beyond. */
const LO = 0;
const LO_UP = 1;
const LO_DOWN = 2;
const HI = 3;
const HI_UP = 4;
const HI_DOWN = 5;
const HI_CLASS = 6;

/** How far the slack is above `threshold`, on the logarithms (bands are nearly straight on log-log paper). */
function aboveThreshold(upTime: number, downTime: number, threshold: number): number {
  return Math.log(upTime * compared.timeRatio) - Math.log(downTime + compared.margin + threshold);
}

/**
 * The edge where the class stops being `from`, between `lo` (of that class) and `hi` (not): the
 * last current of the class and the first beyond it, `tolerance` apart, left in `scratch.edge`. A
 * crossing of the slack's threshold is solved by Illinois regula falsi on the logarithms; anything
 * else (a pickup or the horizon inside a cell) falls back to bisection.
 */
function refineEdge(
  lo: number,
  loUp: number,
  loDown: number,
  hi: number,
  hiUp: number,
  hiDown: number,
  from: number,
): void {
  const { probed, edge } = scratch;
  const tolerance = compared.tolerance;
  let hiClass = classOf(hi, hiUp, hiDown);
  // The threshold the slack crosses, when the change is a smooth crossing of one.
  const to = hiClass;
  // Leaving or entering "selective" crosses the thin-margin line; anything else the zero line.
  const smooth = from <= 2 && to <= 2 && loUp !== Infinity && hiUp !== Infinity;
  const threshold = !smooth ? -1 : from === 0 || (from === 1 && to === 0) ? compared.thinMargin : 0;
  let x0 = Math.log(lo);
  let x1 = Math.log(hi);
  let g0 = threshold >= 0 ? aboveThreshold(loUp, loDown, threshold) : NaN;
  let g1 = threshold >= 0 ? aboveThreshold(hiUp, hiDown, threshold) : NaN;
  let side = 0;
  // Capped so that a degenerate bracket (a zero or denormal current) can never loop forever; the
  // Illinois steps converge in a few dozen probes on any physical range.
  for (let step = 0; step < 500 && hi - lo > tolerance * lo; step++) {
    const x = nextProbe(x0, x1, g0, g1, tolerance);
    const amps = Math.exp(x);
    const cls = probe(amps);
    const g = threshold >= 0 ? aboveThreshold(probed[0], probed[1], threshold) : NaN;
    if (cls === from) {
      lo = amps;
      loUp = probed[0];
      loDown = probed[1];
      x0 = x;
      g0 = g;
      if (side === -1) g1 *= 0.5;
      side = -1;
    } else {
      hi = amps;
      hiUp = probed[0];
      hiDown = probed[1];
      hiClass = cls;
      x1 = x;
      g1 = g;
      if (side === 1) g0 *= 0.5;
      side = 1;
    }
  }
  edge[LO] = lo;
  edge[LO_UP] = loUp;
  edge[LO_DOWN] = loDown;
  edge[HI] = hi;
  edge[HI_UP] = hiUp;
  edge[HI_DOWN] = hiDown;
  edge[HI_CLASS] = hiClass;
}

/**
 * Scratch arrays the finder reuses from call to call (a study checks thousands of pairs): the grid's
 * currents and the edges' times and classes there, grown together by `gridOf` (with room for the
 * probes of dips, peaks and jumps), and never read beyond what the current call wrote.
 */
const scratch = {
  points: new Float64Array(256),
  upTimes: new Float64Array(256),
  downTimes: new Float64Array(256),
  classes: new Int8Array(256),
  inside: new Float64Array(64),
  probed: new Float64Array(2),
  best: new Float64Array(5),
  edge: new Float64Array(7),
  crossing: new Float64Array(2),
};

/**
 * Fills `scratch.points` with log-spaced currents from `from` to `to` with every breakpoint inside,
 * ascending and without duplicates; each smooth segment gets at least `MIN_CELLS` cells and the point
 * just below its top. Returns how many points there are.
 */
function gridOf(
  from: number,
  to: number,
  upBreakpoints: Float64Array,
  downBreakpoints: Float64Array,
  samplesPerDecade: number,
  tolerance: number,
): number {
  // The range's ends and the breakpoints inside it, ascending: the two bands' breakpoints are each
  // ascending (the band contract), so they are merged in one pass, in place in scratch and without a
  // call per pair; should either not be, the list is sorted as numbers instead.
  const most = upBreakpoints.length + downBreakpoints.length + 2;
  if (scratch.inside.length < most) scratch.inside = new Float64Array(2 * most);
  const inside = scratch.inside;
  let n = 0;
  inside[n++] = from;
  let i = 0;
  let j = 0;
  let ordered = true;
  while (i < upBreakpoints.length || j < downBreakpoints.length) {
    const fromUp = j >= downBreakpoints.length || (i < upBreakpoints.length && upBreakpoints[i] <= downBreakpoints[j]);
    const amps = fromUp ? upBreakpoints[i++] : downBreakpoints[j++];
    if (amps > from && amps < to) {
      if (amps < inside[n - 1]) ordered = false;
      inside[n++] = amps;
    }
  }
  inside[n++] = to;
  if (!ordered) inside.subarray(0, n).sort();
  // At most: per segment its cells (under samplesPerDecade · its decades + 1) and the point below its
  // top, and the top; with room to spare for rounding, and twice that for the probes inserted later.
  const size = 3 * n + Math.ceil(samplesPerDecade * Math.log10(to / from));
  if (scratch.points.length < 2 * size) {
    scratch.points = new Float64Array(2 * size);
    scratch.upTimes = new Float64Array(2 * size);
    scratch.downTimes = new Float64Array(2 * size);
    scratch.classes = new Int8Array(2 * size);
  }
  const { points } = scratch;
  let count = 0;
  for (let k = 0; k + 1 < n; k++) {
    const a = inside[k];
    const b = inside[k + 1];
    if (!(b > a * (1 + 1e-12))) continue;
    const cells = Math.max(MIN_CELLS, Math.ceil(samplesPerDecade * Math.log10(b / a)));
    const step = Math.pow(b / a, 1 / cells);
    let amps = a;
    for (let c = 0; c < cells; c++, amps *= step) points[count++] = c === 0 ? a : amps;
    // Just below each breakpoint, so that an edge's value on either side of it is seen.
    const below = b / (1 + 0.5 * tolerance);
    if (b < to && below > points[count - 1]) points[count++] = below;
  }
  points[count++] = to;
  return count;
}
