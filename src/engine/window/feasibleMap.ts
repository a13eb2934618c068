import type { Device } from '../study/index.ts';
import type { Constraint } from './constraints.ts';
import { evaluateAt, type Memo } from './evaluation.ts';
import { axisOf, type Binding, type SettingInterval } from './settingInterval.ts';
import { thresholdOf, type Threshold } from './threshold.ts';
import { devicesAlong, type SettingSpec } from './settings.ts';
import type { Trial } from './trial.ts';

/** One axis of a feasible map: the setting and its range. */
export interface MapAxis {
  key: string;
  label: string;
  unit: string;
  min: number;
  max: number;
  /** The steps, when the setting has them. */
  values?: number[];
  current: number;
}

/** One column of the map: at setting `x`, the feasible intervals of `y`, or what closes the column. */
export interface MapColumn {
  x: number;
  intervals: SettingInterval[];
  blocked: Binding[];
}

/**
 * The 2-D feasible region of a device's main pair of settings (pickup across, time setting up), the
 * rest of the study and of the device held: for each pickup column, the exact feasible interval of
 * the time setting with the binding constraint of each edge. Columns are every step of a stepped
 * pickup, or 41 log-spaced pickups (plus the present one and the edges of the 1-D pickup window) of a
 * continuous one.
 */
export interface FeasibleMap {
  label: string;
  x: MapAxis;
  y: MapAxis;
  columns: MapColumn[];
  /** The present setting and whether it lies inside the region. */
  current: { x: number; y: number; inside: boolean };
}

/** What the window's own rows through the present setting already say (`thresholdsOf`, by constraint id). */
export interface MapRows {
  /** Each constraint's threshold over `x` with `y` held at its present value. */
  x: Map<string, Threshold>;
  /** Each constraint's threshold over `y` with `x` held at its present value: the present column itself. */
  y: Map<string, Threshold>;
}

/** Options of `feasibleMapOf`. */
export interface FeasibleMapOptions {
  /** Exact column positions to add (the pickup window's own edges). @default [] */
  extraColumns?: number[];
  /** Results already known for this state of the rest of the study. */
  memo?: Memo;
  /** The rows through the present setting, when already solved: they are not solved again. */
  rows?: MapRows;
}

/**
 * Builds the feasible map of one pair of settings by solving the `y` window in each `x` column
 * (bracketing and bisection per constraint, not a grid). Leaves `base` placed in the trial.
 *
 * @example feasibleMapOf(trial, relay, pickupSpec, dialSpec, constraints, 'pickup × time dial')
 */
export function feasibleMapOf(
  trial: Trial,
  base: Device,
  xSpec: SettingSpec,
  ySpec: SettingSpec,
  constraints: Constraint[],
  label: string,
  options: FeasibleMapOptions = {},
): FeasibleMap {
  const { extraColumns = [], memo, rows } = options;
  const sorted = mapColumnsOf(xSpec, extraColumns);
  const thresholds = sorted.map(() => new Map<string, Threshold>());
  // One device per cell, shared by every constraint that reads it.
  const columnAt = devicesAlong(base, xSpec.key);
  const cells = sorted.map((x) => devicesAlong(columnAt(x), ySpec.key));
  const active = constraints.filter((c) => c.favours !== 'fixed');
  // A column where some constraint holds nowhere shows only the constraints that close it, so those
  // are found first (one check per column at most), and the edges are solved in the open columns only.
  const closed = active.map((c) => closedColumnsOf(trial, cells, xSpec, sorted, ySpec, c, memo, rows));
  const open = sorted.map((_, i) => closed.every((columns) => !columns[i]));
  let first = open.indexOf(true);
  let last = open.lastIndexOf(true);
  // Open columns that are not one run would mean the region is not monotone: solve every column.
  if (first >= 0 && open.slice(first, last + 1).includes(false)) [first, last] = [0, sorted.length - 1];
  active.forEach((constraint, k) => {
    const found =
      first < 0
        ? []
        : columnThresholdsOf(
            trial,
            columnAt,
            cells.slice(first, last + 1),
            xSpec,
            sorted.slice(first, last + 1),
            ySpec,
            constraint,
            memo,
            rows,
          );
    sorted.forEach((_, i) => {
      if (i >= first && i <= last) thresholds[i].set(constraint.id, found[i - first]);
      else if (closed[k][i]) thresholds[i].set(constraint.id, { kind: 'nowhere' });
    });
  });
  const columns: MapColumn[] = sorted.map((x, i) => ({ x, ...axisOf(ySpec, constraints, thresholds[i]) }));
  trial.place(base);
  const here = columns.find((c) => c.x === xSpec.current)!;
  const inside = here.intervals.some((i) => ySpec.current >= i.from * (1 - 1e-9) && ySpec.current <= i.to * (1 + 1e-9));
  const mapAxisOf = (spec: SettingSpec): MapAxis => ({
    key: spec.key,
    label: spec.label,
    unit: spec.unit,
    min: spec.min,
    max: spec.max,
    values: spec.values,
    current: spec.current,
  });
  return {
    label,
    x: mapAxisOf(xSpec),
    y: mapAxisOf(ySpec),
    columns,
    current: { x: xSpec.current, y: ySpec.current, inside },
  };
}

/**
 * The pickups a map has a column at, ascending: every step of a stepped setting, or 41 log-spaced
 * values of a continuous one; with the present value and `extraColumns` inside the range.
 *
 * @example mapColumnsOf(longTimePickup) // [0.4, 0.45, …, 1]
 */
export function mapColumnsOf(xSpec: SettingSpec, extraColumns: number[] = []): number[] {
  const xs = new Set<number>(xSpec.values ?? logSpaced(xSpec.min, xSpec.max, 41));
  xs.add(xSpec.current);
  for (const x of extraColumns) if (x >= xSpec.min && x <= xSpec.max) xs.add(x);
  return [...xs].sort((a, b) => a - b);
}

/**
 * One constraint's threshold over the `y` setting in every column. The region is monotone in the
 * pickup too (a higher pickup is slower): a constraint met by slower settings needs no more of the
 * time setting one column to the right, one met by faster settings allows no more. So a column's
 * threshold lies between those of any column to its left and any to its right, on the scale `rankOf`
 * gives, and on the side of the present `y` that the `x` row says. The present column comes from the
 * `y` row; then the outer columns and the middle of each gap are solved: a column whose bounds meet is
 * known without a check, and a stepped one is otherwise searched only between them.
 */
function columnThresholdsOf(
  trial: Trial,
  columnAt: (x: number) => Device,
  cells: ((y: number) => Device)[],
  xSpec: SettingSpec,
  xs: number[],
  ySpec: SettingSpec,
  constraint: Constraint,
  memo: Memo | undefined,
  rows: MapRows | undefined,
): Threshold[] {
  const favours = constraint.favours as 'slower' | 'faster';
  const steps = ySpec.values;
  const last = xs.length - 1;
  const found: (Threshold | undefined)[] = new Array(xs.length);
  const ranks: number[] = new Array(xs.length);
  const [least, most] = rankRangeOf(favours, steps);
  // Whether the present `y` holds in each column, where the `x` row says so.
  const xRow = rows?.x.get(constraint.id);
  const pivots = xs.map((x) => (xRow ? holdsAt(xRow, x, xSpec.values !== undefined) : undefined));
  const present = steps ? steps.indexOf(ySpec.current) : CONTINUOUS_EDGE;
  const boundsOf = (i: number): [number, number] => {
    let low = least;
    let high = most;
    const pivot = pivots[i];
    if (pivot !== undefined) {
      // Met by slower settings and holding at the present `y`: the first holding step is at or below it.
      const next = steps ? 1 : 0;
      if (favours === 'slower') {
        if (pivot) high = Math.min(high, present);
        else low = Math.max(low, present + next);
      } else if (pivot) low = Math.max(low, present);
      else high = Math.min(high, present - next);
    }
    for (let j = i - 1; j >= 0; j--)
      if (found[j]) {
        high = Math.min(high, ranks[j]);
        break;
      }
    for (let j = i + 1; j <= last; j++)
      if (found[j]) {
        low = Math.max(low, ranks[j]);
        break;
      }
    // Bounds that cross would mean the region is not monotone here: search the whole range.
    return low <= high ? [low, high] : [least, most];
  };
  const solve = (i: number) => {
    const holds = (value: number) => evaluateAt(trial, constraint, cells[i](value), memo).ok;
    const [low, high] = boundsOf(i);
    let threshold: Threshold;
    if (low === high && (steps || low !== CONTINUOUS_EDGE)) threshold = thresholdAt(favours, steps, low);
    else if (steps) threshold = thresholdAt(favours, steps, stepSearch(favours, steps, low, high, holds));
    else
      threshold = thresholdOf(ySpec, holds, {
        favours,
        pivot: { value: ySpec.current, holds: pivots[i] ?? evaluateAt(trial, constraint, columnAt(xs[i]), memo).ok },
      });
    found[i] = threshold;
    ranks[i] = rankOf(favours, steps, threshold);
  };
  const here = xs.indexOf(xSpec.current);
  const column = here >= 0 ? rows?.y.get(constraint.id) : undefined;
  if (column) {
    found[here] = column;
    ranks[here] = rankOf(favours, steps, column);
  }
  if (!found[0]) solve(0);
  if (!found[last]) solve(last);
  const between = (left: number, right: number) => {
    if (right - left < 2) return;
    const middle = (left + right) >> 1;
    solve(middle);
    between(left, middle);
    between(middle, right);
  };
  const anchors = [...new Set([0, ...(column ? [here] : []), last])];
  for (let k = 1; k < anchors.length; k++) between(anchors[k - 1], anchors[k]);
  return found as Threshold[];
}

/**
 * The columns where a constraint holds nowhere: where it fails even at the end of the `y` range that
 * meets it most easily. By the same monotony they are the lowest pickups for a constraint met by
 * slower settings and the highest for one met by faster settings, so the boundary is bisected over
 * the columns, from the rows' knowledge: a column where the present `y` holds is open.
 */
function closedColumnsOf(
  trial: Trial,
  cells: ((y: number) => Device)[],
  xSpec: SettingSpec,
  xs: number[],
  ySpec: SettingSpec,
  constraint: Constraint,
  memo: Memo | undefined,
  rows: MapRows | undefined,
): boolean[] {
  const slower = constraint.favours === 'slower';
  const easiest = slower ? ySpec.max : ySpec.min;
  const xRow = rows?.x.get(constraint.id);
  const known = xs.map((x): boolean | undefined =>
    xRow && holdsAt(xRow, x, xSpec.values !== undefined) ? false : undefined,
  );
  const here = xs.indexOf(xSpec.current);
  const column = rows?.y.get(constraint.id);
  if (column && here >= 0) known[here] = column.kind === 'nowhere';
  const isClosed = (i: number) => known[i] ?? !evaluateAt(trial, constraint, cells[i](easiest), memo).ok;
  // The first open column (slower) or the first closed one (faster), bounded by what is known.
  let low = 0;
  let high = xs.length;
  known.forEach((isKnownClosed, i) => {
    if (isKnownClosed === undefined) return;
    if (isKnownClosed === slower) low = Math.max(low, i + 1);
    else high = Math.min(high, i);
  });
  if (low > high) [low, high] = [0, xs.length];
  while (low < high) {
    const middle = (low + high) >> 1;
    if (isClosed(middle) === slower) low = middle + 1;
    else high = middle;
  }
  return xs.map((_, i) => (slower ? i < low : i >= low));
}

/**
 * Whether a condition holds at `x`, from its threshold over `x`: exact on the holding side; on the
 * other side only for a stepped setting (whose threshold is the exact step), unknown for a continuous
 * one (its edge is known to a tolerance).
 */
function holdsAt(threshold: Threshold, x: number, stepped: boolean): boolean | undefined {
  if (threshold.kind === 'everywhere') return true;
  if (threshold.kind === 'nowhere') return false;
  if (threshold.kind === 'from' ? x >= threshold.value : x <= threshold.value) return true;
  return stepped ? false : undefined;
}

/** The rank of a continuous edge strictly inside the range (its exact place is not compared). */
const CONTINUOUS_EDGE = 1;

/** The least and greatest rank of a threshold (`rankOf`). */
function rankRangeOf(favours: 'slower' | 'faster', steps: number[] | undefined): [number, number] {
  const slower = favours === 'slower';
  const everywhere = rankOf(favours, steps, { kind: 'everywhere' });
  const nowhere = rankOf(favours, steps, { kind: 'nowhere' });
  return slower ? [everywhere, nowhere] : [nowhere, everywhere];
}

/**
 * A threshold's place on a scale that never rises with the pickup: for a stepped setting the index
 * of the first holding step (`slower`, the range's length when none holds) or of the last holding one
 * (`faster`, -1 when none holds); for a continuous one 0, `CONTINUOUS_EDGE` or 2 from the least room
 * to the most.
 */
function rankOf(favours: 'slower' | 'faster', steps: number[] | undefined, threshold: Threshold): number {
  const slower = favours === 'slower';
  if (!steps) {
    if (threshold.kind === 'everywhere') return slower ? 0 : 2;
    if (threshold.kind === 'nowhere') return slower ? 2 : 0;
    return CONTINUOUS_EDGE;
  }
  if (threshold.kind === 'everywhere') return slower ? 0 : steps.length - 1;
  if (threshold.kind === 'nowhere') return slower ? steps.length : -1;
  return steps.indexOf(threshold.value);
}

/** The threshold at a rank (`rankOf` inverted). */
function thresholdAt(favours: 'slower' | 'faster', steps: number[] | undefined, rank: number): Threshold {
  const slower = favours === 'slower';
  if (!steps) return { kind: (rank === 0) === slower ? 'everywhere' : 'nowhere' };
  if (slower)
    return rank === 0
      ? { kind: 'everywhere' }
      : rank === steps.length
        ? { kind: 'nowhere' }
        : { kind: 'from', value: steps[rank] };
  return rank === steps.length - 1
    ? { kind: 'everywhere' }
    : rank < 0
      ? { kind: 'nowhere' }
      : { kind: 'upTo', value: steps[rank] };
}

/**
 * Bisects a stepped setting between two ranks the threshold is known to lie between, reading first
 * the end of the whole range that decides "everywhere" (the common answer), as `thresholdOf` does.
 */
function stepSearch(
  favours: 'slower' | 'faster',
  steps: number[],
  low: number,
  high: number,
  holds: (value: number) => boolean,
): number {
  if (favours === 'slower') {
    if (low === 0 && low < high) {
      if (holds(steps[0])) return 0;
      low = 1;
    }
    if (high === steps.length && low < high) {
      if (!holds(steps[high - 1])) return high;
      high -= 1;
    }
    while (low < high) {
      const middle = (low + high) >> 1;
      if (holds(steps[middle])) high = middle;
      else low = middle + 1;
    }
    return low;
  }
  const top = steps.length - 1;
  if (high === top && low < high) {
    if (holds(steps[top])) return top;
    high = top - 1;
  }
  if (low === -1 && low < high) {
    if (!holds(steps[0])) return -1;
    low = 0;
  }
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if (holds(steps[middle])) low = middle;
    else high = middle - 1;
  }
  return low;
}

/** `n` log-spaced values from `min` to `max`. */
function logSpaced(min: number, max: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => min * Math.pow(max / min, i / (n - 1)));
}
