import type { LogAxis } from './scales.ts';

/** A tick on a log axis: `value` in amps or seconds; `major` at each power of ten. */
export interface Tick {
  value: number;
  major: boolean;
}

/**
 * Every 1–9 × 10^k value inside the axis domain (ends included), ascending; the powers of ten are
 * major. Values are exact decimals (0.02, not 0.020000000000000004).
 * @example logTicks({ domain: [1, 100], range: [0, 1] }).filter((t) => t.major).map((t) => t.value) // [1, 10, 100]
 */
export function logTicks(axis: LogAxis): Tick[] {
  const [low, high] = axis.domain;
  const ticks: Tick[] = [];
  const first = Math.floor(Math.log10(low) + 1e-9);
  const last = Math.ceil(Math.log10(high) - 1e-9);
  for (let k = first; k <= last; k++) {
    for (let m = 1; m <= 9; m++) {
      const value = exactDecimal(m, k);
      // Relative slack so domain ends computed as 10 ** k still count as inside.
      if (value < low * (1 - 1e-9) || value > high * (1 + 1e-9)) continue;
      ticks.push({ value, major: m === 1 });
    }
  }
  return ticks;
}

/**
 * The label of a tick value as the trade's log paper prints it: plain decimals, thousands grouped
 * with a space from 10 000 up ("0.01", "1", "1000", "10 000", "1 000 000").
 * @example tickLabel(0.01) // "0.01"
 * @example tickLabel(100000) // "100 000"
 */
export function tickLabel(value: number): string {
  if (value < 1) return String(Number(value.toPrecision(6)));
  const whole = String(Math.round(value));
  return whole.length <= 4 ? whole : whole.replace(/\B(?=(\d{3})+(?!\d))/g, ' ');
}

// m × 10^k as the nearest double to the decimal, which 10 ** k * m is not for negative k.
function exactDecimal(m: number, k: number): number {
  return k >= 0 ? m * 10 ** k : Number(`${m}e${k}`);
}
