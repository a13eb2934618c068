import type { EdgeElement } from './composite.ts';
import { exponential } from './exponential.ts';

/** A digitised curve: `[current, seconds]` pairs, current ascending, time strictly descending. */
export type PointTable = Array<[number, number]>;

/** How a table's current column reads in errors: `'a current in amperes'` or `'a multiple of the rating'`. */
export interface PointTableOptions {
  current: string;
  /** Unit written after a current in errors: `' A'` or `'×'`. */
  unit: string;
}

/**
 * What is wrong with point `i` of a table, if anything: the column (0 current, 1 time) and the
 * message. Shared by the schema and the CSV reader so both speak alike.
 */
export function pointProblem(
  points: readonly (readonly [number, number])[],
  i: number,
  { current, unit }: PointTableOptions,
): { column: 0 | 1; message: string } | undefined {
  // Read by index, not destructured: a table's every point is checked, and destructuring goes through
  // an iterator per point.
  const amps = points[i][0];
  const seconds = points[i][1];
  if (!(amps > 0) || !Number.isFinite(amps)) {
    return { column: 0, message: `expected ${current} greater than 0, got "${amps}"` };
  }
  if (!(seconds > 0) || !Number.isFinite(seconds)) {
    return { column: 1, message: `expected a time in seconds greater than 0, got "${seconds}"` };
  }
  if (i === 0) return undefined;
  const previousAmps = points[i - 1][0];
  const previousSeconds = points[i - 1][1];
  if (!(amps > previousAmps)) {
    return {
      column: 0,
      message: `expected a current above the previous point's ${previousAmps}${unit}, got "${amps}"`,
    };
  }
  if (!(seconds < previousSeconds)) {
    return { column: 1, message: `expected a time below the previous point's ${previousSeconds} s, got "${seconds}"` };
  }
  return undefined;
}

/**
 * Whether a table passes every rule of `pointTableSchema` (the cross-table checks run only then).
 * @example isValidTable([[200, 300], [2000, 0.1]]) // true
 */
export function isValidTable(points: readonly (readonly [number, number])[]): boolean {
  const options = { current: '', unit: '' };
  return points.length >= 2 && points.every((_, i) => pointProblem(points, i, options) === undefined);
}

/**
 * A table curve as an edge element, with currents multiplied by `scale` (a thermal band given in
 * multiples of the rating). Between points it interpolates linearly in log-log space (common
 * practice); below the first current it is `Infinity`; beyond the last it holds the last time.
 *
 * @example tableElement([[200, 300], [2000, 0.1]]).time(632.456) // ≈ 5.477 s (half way in log)
 */
export function tableElement(points: PointTable, scale = 1): EdgeElement & { lastAmps: number } {
  const n = points.length;
  // Plain loops read each point by index: a mapping function that destructures a point goes through
  // an iterator per point, and a study builds thousands of tables.
  const logAmps = new Float64Array(n);
  const seconds = new Float64Array(n);
  const logSeconds = new Float64Array(n);
  const joins: number[] = [];
  for (let k = 0; k < n; k++) {
    const amps = points[k][0] * scale;
    logAmps[k] = Math.log(amps);
    seconds[k] = points[k][1];
    logSeconds[k] = Math.log(seconds[k]);
    if (k > 0) joins.push(amps);
  }
  const slopes = new Float64Array(n - 1);
  for (let k = 0; k < n - 1; k++) slopes[k] = (logSeconds[k + 1] - logSeconds[k]) / (logAmps[k + 1] - logAmps[k]);
  const first = points[0][0] * scale;
  const lastAmps = points[n - 1][0] * scale;
  const lastSeconds = points[n - 1][1];
  const time = (amps: number): number => {
    if (amps >= lastAmps) return lastSeconds;
    if (!(amps >= first)) return Infinity;
    const x = Math.log(amps);
    // Binary search for the segment k with logAmps[k] ≤ x < logAmps[k + 1].
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (logAmps[mid] <= x) lo = mid;
      else hi = mid;
    }
    const dx = x - logAmps[lo];
    // On a tabulated point return its time exactly, not through exp(log(t)).
    return dx === 0 ? seconds[lo] : exponential(logSeconds[lo] + dx * slopes[lo]);
  };
  const reach = (level: number): number => {
    const y = Math.log(level);
    if (!(y < logSeconds[0]) || !(y > logSeconds[n - 1])) return Infinity;
    let k = 0;
    while (logSeconds[k + 1] > y) k++;
    return Math.exp(logAmps[k] + (y - logSeconds[k]) / slopes[k]);
  };
  return {
    pickup: first,
    time,
    shape: { kind: 'table', logAmps, seconds, logSeconds, slopes, first, lastAmps, lastSeconds },
    joins,
    levels: [lastSeconds],
    reach,
    lastAmps,
  };
}

/**
 * A point table as data (see `tableElement`): the natural logarithms of its scaled currents and of its
 * times, its times, the log-log slope of each segment, its first and last current (A) and last time (s).
 */
export interface TableShape {
  kind: 'table';
  logAmps: Float64Array;
  seconds: Float64Array;
  logSeconds: Float64Array;
  slopes: Float64Array;
  first: number;
  lastAmps: number;
  lastSeconds: number;
}

/**
 * For every `i` where `out[i]` is above the floor `bounds[0]`, lowers `out[i]` to the table's time at
 * `amps[i]` (exactly the double `tableElement(…).time` gives) if that is smaller; with `finish`, then
 * raises it to the floor and adds `bounds[1]` (the last pass of a composite edge). `logs[i]` holds
 * `Math.log(amps[i])` (`logarithmsOf`). The segment is found by a cursor (`segmentAt`), kept with its
 * constants while the currents stay within it.
 *
 * @example tableTimesInto(shape, amps, logarithmsOf(amps, 1), out.fill(Infinity), Float64Array.of(0, 0), true)
 */
export function tableTimesInto(
  table: TableShape,
  amps: Float64Array,
  logs: Float64Array,
  out: Float64Array,
  bounds: Float64Array,
  finish: boolean,
): void {
  const floor = bounds[0];
  const added = bounds[1];
  const { logAmps, seconds, logSeconds, slopes, first, lastAmps } = table;
  const lastSegment = logAmps.length - 2;
  // The last time read from the Float64Array (the same number) so the loop sees only doubles.
  const lastSeconds = seconds[lastSegment + 1];
  // The cursor's segment held in locals (its first and next logarithm of current, logarithm of time,
  // slope and time at the first), so a current in the same segment as the last reads no table.
  let k = 0;
  let from = Infinity;
  let to = -Infinity;
  let logTime = 0;
  let slope = 0;
  let time = 0;
  for (let i = 0, n = amps.length; i < n; i++) {
    let fastest = out[i];
    if (fastest > floor) {
      const current = amps[i];
      let t: number;
      if (current >= lastAmps) t = lastSeconds;
      else if (!(current >= first)) t = Infinity;
      else {
        const x = logs[i];
        if (!(x >= from && x < to)) {
          k = segmentAt(logAmps, lastSegment, k, x);
          from = logAmps[k];
          to = k < lastSegment ? logAmps[k + 1] : Infinity;
          logTime = logSeconds[k];
          slope = slopes[k];
          time = seconds[k];
        }
        const dx = x - from;
        t = dx === 0 ? time : exponential(logTime + dx * slope);
      }
      if (t < fastest) fastest = t;
    }
    out[i] = finish ? (fastest > floor ? fastest : floor) + added : fastest;
  }
}

/**
 * Where a batch pass's cursor moves for logarithm of current `x`: from segment `k`, a step or two for
 * ascending currents, to the segment the binary search of `tableElement(…).time` finds (the last one,
 * at most `lastSegment`, whose first logarithm is at or below `x`).
 *
 * @example segmentAt(shape.logAmps, shape.logAmps.length - 2, 0, Math.log(450))
 */
export function segmentAt(logAmps: Float64Array, lastSegment: number, k: number, x: number): number {
  while (k < lastSegment && logAmps[k + 1] <= x) k++;
  while (k > 0 && logAmps[k] > x) k--;
  return k;
}

/**
 * Where a slower table (`upper`, e.g. total clearing) is faster than `lower` (minimum melting), or
 * starts at a lower current, checked at every tabulated current of both (exact for log-log
 * interpolation, which is linear in between). Returns the first offending current, or undefined.
 *
 * @example upperBelowLower([[100, 10], [1000, 0.01]], [[100, 12], [1000, 0.02]]) // undefined
 */
export function upperBelowLower(
  lower: PointTable,
  upper: PointTable,
): { amps: number; lowerSeconds: number; upperSeconds: number } | undefined {
  // Read while the study is read, for every fuse and breaker: each table is interpolated where it is
  // needed (`timeOnTable`) rather than built as an element.
  if (upper[0][0] < lower[0][0]) return { amps: upper[0][0], lowerSeconds: Infinity, upperSeconds: upper[0][1] };
  // Every tabulated current of both tables in ascending order: the two ascending columns merged.
  for (let i = 0, j = 0; i < lower.length || j < upper.length;) {
    const amps = j === upper.length || (i < lower.length && lower[i][0] <= upper[j][0]) ? lower[i++][0] : upper[j++][0];
    const x = Math.log(amps);
    const lowerSeconds = timeOnTable(lower, amps, x);
    const upperSeconds = timeOnTable(upper, amps, x);
    // A relative slack of 1e-12 forgives the round trip through logarithms at shared points.
    if (upperSeconds < lowerSeconds * (1 - 1e-12)) return { amps, lowerSeconds, upperSeconds };
  }
  return undefined;
}

/**
 * `tableElement(points).time(amps)`, the same double, for a table read once: `x` is `Math.log(amps)`.
 * The segment is the last one whose first current's logarithm is at or below `x`, as the element's
 * binary search finds it (a logarithm is monotone, so the currents themselves find it but for two
 * currents whose logarithms are equal).
 */
function timeOnTable(points: PointTable, amps: number, x: number): number {
  const last = points.length - 1;
  if (amps >= points[last][0]) return points[last][1];
  if (!(amps >= points[0][0])) return Infinity;
  let k = 0;
  while (k < last - 1 && points[k + 1][0] <= amps) k++;
  while (k < last - 1 && Math.log(points[k + 1][0]) <= x) k++;
  const logAmps = Math.log(points[k][0]);
  const dx = x - logAmps;
  if (dx === 0) return points[k][1];
  const logSeconds = Math.log(points[k][1]);
  const slope = (Math.log(points[k + 1][1]) - logSeconds) / (Math.log(points[k + 1][0]) - logAmps);
  return exponential(logSeconds + dx * slope);
}
