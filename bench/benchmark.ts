/**
 * One benchmark of DESIGN §7: what it measures, its target, and how to run it. `run` returns the
 * measured figure in `unit`; a lower figure is better unless `higherIsBetter`.
 */
export interface Benchmark {
  /** DESIGN §7 id, e.g. 'P1'. */
  id: string;
  what: string;
  unit: string;
  target: number;
  higherIsBetter?: boolean;
  run(): Promise<{ value: number; detail?: string }>;
}

/** Median of repeated timings, in milliseconds, after `warmup` untimed runs. */
export function medianMs(fn: () => void, repeats = 50, warmup = 5): number {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    fn();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}
