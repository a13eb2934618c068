import { availableParallelism } from 'node:os';

/**
 * One benchmark of DEVELOPERS.md, benchmarks: what it measures, its target, and how to run it. `run` returns the
 * measured figure in `unit` and the spread of the runs it came from; a lower figure is better unless
 * `higherIsBetter`.
 */
export interface Benchmark {
  /** DEVELOPERS.md, benchmarks id, e.g. 'P1'. */
  id: string;
  what: string;
  unit: string;
  target: number;
  higherIsBetter?: boolean;
  /** The target itself holds (`≤`), as in "at most twice the need". */
  inclusive?: boolean;
  run(): Promise<Measured>;
}

/** A figure with the spread of the runs behind it (min/median/max, in the figure's unit). */
export interface Measured {
  value: number;
  spread: Spread;
  detail?: string;
}

/** The least, middle and greatest of a set of runs. */
export interface Spread {
  min: number;
  median: number;
  max: number;
  runs: number;
}

/** Min, median and max of some runs. @example spreadOf([3, 1, 2]) // { min: 1, median: 2, max: 3, runs: 3 } */
export function spreadOf(values: readonly number[]): Spread {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  const median = sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
  return { min: sorted[0], median, max: sorted[sorted.length - 1], runs: sorted.length };
}

/** The spread of a figure scaled into another unit (ms → µs, bytes → kB). */
export function scaled(spread: Spread, factor: number): Spread {
  return { ...spread, min: spread.min * factor, median: spread.median * factor, max: spread.max * factor };
}

/** A figure measured once (a size, a count): its spread is the figure itself. */
export function single(value: number, detail?: string): Measured {
  return { value, spread: { min: value, median: value, max: value, runs: 1 }, detail };
}

/** Timings in milliseconds of `repeats` runs of `fn`, after `warmup` untimed runs. */
export function timesMs(fn: () => void, repeats = 50, warmup = 5): number[] {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    fn();
    times.push(performance.now() - start);
  }
  return times;
}

/** Median of repeated timings, in milliseconds, after `warmup` untimed runs. */
export function medianMs(fn: () => void, repeats = 50, warmup = 5): number {
  return spreadOf(timesMs(fn, repeats, warmup)).median;
}

/** A figure taken as the median of its runs. */
export function medianOf(values: readonly number[], detail?: string): Measured {
  const spread = spreadOf(values);
  return { value: spread.median, spread, detail };
}

/**
 * The cores this process may run on, in words for a figure's detail: "on one core" when the runner
 * pinned it (`taskset`), as P2 and P8 are specified.
 */
export function coresText(): string {
  const cores = availableParallelism();
  return cores === 1 ? 'on one core' : `on ${cores} cores`;
}
