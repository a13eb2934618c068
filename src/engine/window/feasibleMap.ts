import type { Device } from '../study/index.ts';
import type { Constraint } from './constraints.ts';
import type { Memo } from './evaluation.ts';
import { axisOf, thresholdsOf, type Binding, type SettingInterval } from './settingInterval.ts';
import type { Threshold } from './threshold.ts';
import { deviceWith, type SettingSpec } from './settings.ts';
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

/**
 * Builds the feasible map of one pair of settings by solving the `y` window in each `x` column
 * (`intervalOf`: bracketing and bisection per constraint, not a grid). `extraColumns` adds exact
 * column positions (the pickup window's own edges). Leaves `base` placed in the trial.
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
  extraColumns: number[] = [],
  memo?: Memo,
): FeasibleMap {
  const xs = new Set<number>(xSpec.values ?? logSpaced(xSpec.min, xSpec.max, 41));
  xs.add(xSpec.current);
  for (const x of extraColumns) if (x >= xSpec.min && x <= xSpec.max) xs.add(x);
  const sorted = [...xs].sort((a, b) => a - b);
  // Monotone in the pickup too: a constraint met by slower settings that holds over a whole column
  // holds over every column to its right (a higher pickup is slower); one met by faster settings
  // holds over every column to the left of one where it holds. One sweep each way skips them.
  const thresholds = sorted.map(() => new Map<string, Threshold>());
  const sweep = (favours: 'slower' | 'faster', order: number[]) => {
    const subset = constraints.filter((c) => c.favours === favours);
    const known = new Map<string, Threshold>();
    for (const i of order) {
      const found = thresholdsOf(trial, deviceWith(base, { [xSpec.key]: sorted[i] }), ySpec, subset, { memo, known });
      for (const [id, threshold] of found) {
        thresholds[i].set(id, threshold);
        if (threshold.kind === 'everywhere') known.set(id, threshold);
      }
    }
  };
  const ascending = sorted.map((_, i) => i);
  sweep('slower', ascending);
  sweep('faster', [...ascending].reverse());
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

/** `n` log-spaced values from `min` to `max`. */
function logSpaced(min: number, max: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => min * Math.pow(max / min, i / (n - 1)));
}
