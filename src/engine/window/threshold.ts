import type { SettingSpec } from './settings.ts';

/** Where a monotone condition on one setting holds over the setting's range. */
export type Threshold =
  /** Holds over the whole range. */
  | { kind: 'everywhere' }
  /** Holds nowhere in the range. */
  | { kind: 'nowhere' }
  /** Holds from `value` up (a lower edge) or up to `value` (an upper edge). */
  | { kind: 'from' | 'upTo'; value: number };

/** Relative tolerance of a continuous edge: well inside the 0.1 % the window's edges are held to. */
export const EDGE_TOLERANCE = 1e-6;

/** Options of `thresholdOf`. */
export interface ThresholdOptions {
  /** Lowest and highest value to search. @default the setting's range */
  lo?: number;
  hi?: number;
  /** Which way the condition is met (the constraint's `favours`): the end that decides is read first. */
  favours?: 'slower' | 'faster';
  /** A value where the condition is already known (the present setting): it brackets the edge. */
  pivot?: { value: number; holds: boolean };
}

/**
 * Solves the edge of a condition that is monotone in one setting, by bracketing and bisection: the
 * condition is read at the ends of the setting's range (or at one end and a known `pivot`); where it
 * changes, the edge is bisected — over the step list for a stepped setting (the exact step), or on a
 * log scale to `EDGE_TOLERANCE` for a continuous one (the returned value is on the holding side).
 * Every setting is oriented so that a higher value is slower, so a condition met by slower settings
 * gives `from` and one met by faster settings `upTo`.
 *
 * @example thresholdOf(timeDial, (dial) => coordinates(dial), { favours: 'slower' }) // { kind: 'from', value: 3.172 }
 */
export function thresholdOf(
  spec: Pick<SettingSpec, 'min' | 'max' | 'values'>,
  holds: (value: number) => boolean,
  options: ThresholdOptions = {},
): Threshold {
  const { lo = spec.min, hi = spec.max, favours, pivot } = options;
  const values = spec.values?.filter((v) => v >= lo - 1e-12 && v <= hi + 1e-12);
  if (values && values.length === 0) return { kind: 'nowhere' };
  const first = values ? values[0] : lo;
  const last = values ? values[values.length - 1] : hi;
  const inside = pivot && pivot.value > first && pivot.value < last && (!values || values.includes(pivot.value));
  // The condition is monotone: met by slower settings (rising) or by faster ones (falling).
  const solve = (bad: number, good: number): number => bisect(values, bad, good, holds);
  if (favours && inside) {
    const rising = favours === 'slower';
    const end = rising === pivot.holds ? first : last;
    const atEnd = holds(end);
    if (atEnd === pivot.holds) return { kind: pivot.holds ? 'everywhere' : 'nowhere' };
    const value = pivot.holds ? solve(end, pivot.value) : solve(pivot.value, end);
    return { kind: rising ? 'from' : 'upTo', value };
  }
  let atLow: boolean;
  let atHigh: boolean;
  if (favours === 'faster') {
    atHigh = holds(last);
    if (atHigh) return { kind: 'everywhere' };
    atLow = first === last ? atHigh : holds(first);
  } else {
    atLow = holds(first);
    if (atLow && favours === 'slower') return { kind: 'everywhere' };
    atHigh = first === last ? atLow : holds(last);
  }
  if (atLow && atHigh) return { kind: 'everywhere' };
  if (!atLow && !atHigh) return { kind: 'nowhere' };
  return atHigh ? { kind: 'from', value: solve(first, last) } : { kind: 'upTo', value: solve(last, first) };
}

/** Bisects between a value where the condition fails and one where it holds; returns the holding edge. */
function bisect(values: number[] | undefined, bad: number, good: number, holds: (value: number) => boolean): number {
  if (values) {
    let a = values.indexOf(bad);
    let b = values.indexOf(good);
    while (Math.abs(b - a) > 1) {
      const mid = (a + b) >> 1;
      if (holds(values[mid])) b = mid;
      else a = mid;
    }
    return values[b];
  }
  let a = Math.log(bad);
  let b = Math.log(good);
  while (Math.abs(b - a) > EDGE_TOLERANCE * 0.5) {
    const mid = (a + b) / 2;
    if (holds(Math.exp(mid))) b = mid;
    else a = mid;
  }
  return Math.exp(b);
}
