import type { Device } from '../study/index.ts';
import type { Constraint, ConstraintKind } from './constraints.ts';
import { devicesAlong, settingValue, type SettingSpec } from './settings.ts';
import { evaluateAt, type Memo } from './evaluation.ts';
import { thresholdOf, type Threshold } from './threshold.ts';
import type { Trial } from './trial.ts';

/** What sets one edge of a window: a constraint, or the end of the setting's range. */
export interface Binding {
  /** The constraint's id, or 'range:lowest' / 'range:highest'. */
  id: string;
  kind: ConstraintKind | 'setting-range';
  label: string;
  source: string;
}

/** One feasible interval of a setting, each edge with its binding constraint. */
export interface SettingInterval {
  from: number;
  to: number;
  lower: Binding;
  upper: Binding;
}

/** A setting's feasible intervals (the rest fixed), or the constraints that close it. */
export interface SettingAxis {
  intervals: SettingInterval[];
  /** When `intervals` is empty: the constraints that cannot hold together over the setting's range. */
  blocked: Binding[];
}

/** The binding of a constraint. @example bindingOf(constraint).label */
export function bindingOf(constraint: Constraint): Binding {
  return { id: constraint.id, kind: constraint.kind, label: constraint.label, source: constraint.source };
}

/** The binding of a range end. @example rangeBinding(spec, 'lowest') */
export function rangeBinding(spec: SettingSpec, end: 'lowest' | 'highest'): Binding {
  return { id: `range:${end}`, kind: 'setting-range', label: `${end} ${spec.label} offered`, source: spec.rangeSource };
}

/** Options of `intervalOf`. */
export interface IntervalOptions {
  /** Results already known for this state of the rest of the study. */
  memo?: Memo;
  /** Thresholds already known (by constraint id): those constraints are not evaluated again. */
  known?: Map<string, Threshold>;
}

/**
 * Each constraint's threshold over one setting of `base`, the rest held (bracketing and bisection,
 * `thresholdOf`); constraints that do not depend on settings are left out. Leaves `base` placed.
 *
 * @example thresholdsOf(trial, main, shortTimeDelay, constraints).get('below:FDR-MCC') // { kind: 'from', value: 0.3 }
 */
export function thresholdsOf(
  trial: Trial,
  base: Device,
  spec: SettingSpec,
  constraints: Constraint[],
  options: IntervalOptions = {},
): Map<string, Threshold> {
  const { memo, known } = options;
  const thresholds = new Map<string, Threshold>();
  const current = settingValue(base, spec.key);
  const at = devicesAlong(base, spec.key);
  for (const constraint of constraints) {
    if (constraint.favours === 'fixed') continue;
    const given = known?.get(constraint.id);
    thresholds.set(
      constraint.id,
      given ??
        thresholdOf(spec, (value) => evaluateAt(trial, constraint, at(value), memo).ok, {
          favours: constraint.favours,
          pivot:
            typeof current === 'number'
              ? { value: current, holds: evaluateAt(trial, constraint, base, memo).ok }
              : undefined,
        }),
    );
  }
  trial.place(base);
  return thresholds;
}

/**
 * The window of one setting from its constraints' thresholds: the intersection, each edge named by
 * the constraint that set it (or the end of the range).
 *
 * @example axisOf(spec, constraints, thresholdsOf(trial, main, spec, constraints))
 */
export function axisOf(spec: SettingSpec, constraints: Constraint[], thresholds: Map<string, Threshold>): SettingAxis {
  let lower = { value: spec.min, binding: rangeBinding(spec, 'lowest') };
  let upper = { value: spec.max, binding: rangeBinding(spec, 'highest') };
  const blocked: Binding[] = [];
  for (const constraint of constraints) {
    const threshold = thresholds.get(constraint.id);
    if (!threshold) continue;
    if (threshold.kind === 'nowhere') blocked.push(bindingOf(constraint));
    else if (threshold.kind === 'from' && threshold.value > lower.value)
      lower = { value: threshold.value, binding: bindingOf(constraint) };
    else if (threshold.kind === 'upTo' && threshold.value < upper.value)
      upper = { value: threshold.value, binding: bindingOf(constraint) };
  }
  if (blocked.length > 0) return { intervals: [], blocked };
  if (lower.value > upper.value) return { intervals: [], blocked: [lower.binding, upper.binding] };
  return {
    intervals: [{ from: lower.value, to: upper.value, lower: lower.binding, upper: upper.binding }],
    blocked: [],
  };
}

/**
 * The feasible interval of one setting of `base` with every other setting held: each constraint's edge
 * is solved on its own (bracketing and bisection, `thresholdOf`), the window is the intersection, and
 * each of its edges names the constraint that set it. Constraints that do not depend on settings
 * (`favours: 'fixed'`) never bound a window. Leaves `base` placed in the trial.
 *
 * @example intervalOf(trial, main, shortTimeDelay, constraints) // { intervals: [{ from: 0.25, to: 0.5, … }], blocked: [] }
 */
export function intervalOf(
  trial: Trial,
  base: Device,
  spec: SettingSpec,
  constraints: Constraint[],
  options: IntervalOptions = {},
): SettingAxis {
  return axisOf(spec, constraints, thresholdsOf(trial, base, spec, constraints, options));
}
