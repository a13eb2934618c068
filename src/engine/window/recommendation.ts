import { locationBusOf } from '../network/index.ts';
import { evaluateAt, type Memo } from './evaluation.ts';
import type { Device } from '../study/index.ts';
import { pickupAmpsOf } from '../checks/loadBelow.ts';
import type { Constraint, ConstraintResult } from './constraints.ts';
import { bindingOf, rangeBinding, type Binding } from './settingInterval.ts';
import {
  adjustableSettingsOf,
  devicesAlong,
  deviceWith,
  settingValue,
  switchesOf,
  type SettingRangeOverride,
  type SettingSpec,
  type SettingValue,
} from './settings.ts';
import { thresholdOf } from './threshold.ts';
import type { Trial } from './trial.ts';

/** How the recommendation chooses among the settings that keep every margin (stated with every result). */
export const TIE_BREAK =
  'Fastest first: every setting starts at its slowest; then, in the order instantaneous, short-time delay, short-time pickup, long-time delay (or time dial), long-time pickup, ground-fault delay, ground-fault pickup, each is lowered to the lowest step that still waits for every device below and rides through inrush, motor starting and load, keeping a full margin (no thin margin) wherever the slowest setting has one. Continuous relay settings are rounded up to three significant figures. Between on/off choices (instantaneous trip, I²t in/out) the one that clears faster on average over the device’s current range wins; on a tie, the present choice.';

/** One setting of the recommendation, before and after, with what stopped it going lower. */
export interface RecommendedSetting {
  key: string;
  label: string;
  unit: string;
  from: SettingValue | undefined;
  to: SettingValue | undefined;
  /** The constraint (or range end) that holds this setting where it is; absent for on/off choices. */
  binding?: Binding;
}

/** A constraint and how the recommended (or present) setting stands against it. */
export interface ConstraintMargin {
  id: string;
  kind: Constraint['kind'];
  label: string;
  source: string;
  favours: Constraint['favours'];
  result: ConstraintResult;
}

/** The fastest-clearing setting that keeps every margin (DEVELOPERS.md, names "proposal" for one device). */
export interface Recommendation {
  /** The device with the recommended settings. */
  device: Device;
  settings: RecommendedSetting[];
  /** True when any setting differs from the study's. */
  changed: boolean;
  /** Every constraint at the recommended setting. */
  margins: ConstraintMargin[];
  tieBreak: string;
  /** Mean of log10(clearing time in s) over the device's current range: lower is faster. */
  clearing: number;
}

/** One on/off combination the search tried and why it failed, for the no-window explanation. */
export interface Attempt {
  switches: Record<string, boolean>;
  /** Slower-favoured constraints that fail even with every setting at its slowest. */
  blockedAtSlowest: Binding[];
  /** Faster-favoured constraints that fail at the fastest setting the devices below allow. */
  failedAtFastest: Binding[];
  /** What held each setting up at that point. */
  holding: Binding[];
  /** The fastest point the devices below allow (when `blockedAtSlowest` is empty). */
  point?: Device;
}

/** Options of `recommendationOf`. */
export interface RecommendationOptions {
  overrides?: Record<string, SettingRangeOverride>;
  /** Results already known for this state of the rest of the study. */
  memo?: Memo;
}

/**
 * Searches a device's settings for the fastest-clearing one that keeps every constraint (`TIE_BREAK`
 * says how), trying each on/off combination. Exact at its ends: with every setting at its slowest,
 * a slower-favoured constraint that still fails cannot be met at all; with every setting as low as
 * the devices below allow, a faster-favoured constraint that fails names a conflict. Leaves the trial
 * as it found it.
 *
 * @example recommendationOf(trial, 'MAIN', constraintsOf(trial, 'MAIN')).recommendation?.settings
 */
export function recommendationOf(
  trial: Trial,
  deviceId: string,
  constraints: Constraint[],
  options: RecommendationOptions = {},
): { recommendation?: Recommendation; attempts: Attempt[] } {
  const original = trial.deviceOf(deviceId);
  const lowers = constraints.filter((c) => c.favours === 'slower');
  const uppers = constraints.filter((c) => c.favours === 'faster');
  const attempts: Attempt[] = [];
  let best: { device: Device; clearing: number; bindings: Map<string, Binding> } | undefined;
  const range = clearingRangeOf(trial, original);

  const present = switchesOf(original).every((s) => s.current === settingValue(original, s.key));
  for (const switches of combinationsOf(original)) {
    const base = deviceWith(original, switches);
    const specs = adjustableSettingsOf(base, options);
    const slowest: Record<string, number> = Object.fromEntries(specs.map((spec) => [spec.key, spec.max]));
    // Descending from the slowest setting finds the fastest one the devices below allow; descending from
    // the present setting (where it already keeps every constraint) can never end worse than it.
    const starts = [slowest];
    if (present && switchesOf(original).every((s) => switches[s.key] === s.current))
      starts.push(Object.fromEntries(specs.map((spec) => [spec.key, spec.current])));
    let failed: Attempt | undefined;
    let found = false;
    for (const start of starts) {
      for (const strict of [true, false]) {
        const attempt = fastestPoint(trial, base, specs, lowers, uppers, strict, start, options.memo);
        if (!attempt.ok) {
          if (start === slowest) failed = { switches, ...attempt };
          // Blocked at the slowest setting: nothing lower can work. A strict attempt that asked for no
          // full margin anywhere was already the plain one.
          if (attempt.blockedAtSlowest.length > 0 || !attempt.askedClean) break;
          continue;
        }
        const clearing = clearingOf(trial, attempt.point!, range);
        if (!best || clearing < best.clearing - 1e-9)
          best = { device: attempt.point!, clearing, bindings: attempt.bindings };
        found = true;
        break;
      }
      // The present setting is a second start only when the descent from the slowest found nothing.
      if (found || failed?.blockedAtSlowest.length) break;
    }
    if (failed && (!best || failed.blockedAtSlowest.length > 0)) attempts.push(failed);
  }

  let recommendation: Recommendation | undefined;
  if (best) {
    const margins = constraints.map((c) => ({
      id: c.id,
      kind: c.kind,
      label: c.label,
      source: c.source,
      favours: c.favours,
      result: evaluateAt(trial, c, best!.device, options.memo),
    }));
    const rows: RecommendedSetting[] = [
      ...switchesOf(original).map((s) => ({
        key: s.key,
        label: s.label,
        unit: '',
        from: settingValue(original, s.key),
        to: settingValue(best!.device, s.key),
      })),
      ...adjustableSettingsOf(original, options).map((spec) => ({
        key: spec.key,
        label: spec.label,
        unit: spec.unit,
        from: spec.current,
        to: settingValue(best!.device, spec.key),
        binding: best!.bindings.get(spec.key),
      })),
    ];
    recommendation = {
      device: best.device,
      settings: rows,
      changed: rows.some((row) => row.from !== row.to),
      margins,
      tieBreak: TIE_BREAK,
      clearing: best.clearing,
    };
  }
  trial.place(original);
  return { recommendation, attempts };
}

/** The on/off combinations of a device, the present one first. */
function combinationsOf(device: Device): Record<string, boolean>[] {
  let combos: Record<string, boolean>[] = [{}];
  for (const s of switchesOf(device)) {
    const options = [s.current, ...s.options.filter((o) => o !== s.current)];
    combos = combos.flatMap((combo) => options.map((o) => ({ ...combo, [s.key]: o })));
  }
  return combos;
}

/** The greedy descent from the slowest setting; see `recommendationOf`. */
function fastestPoint(
  trial: Trial,
  base: Device,
  specs: SettingSpec[],
  lowers: Constraint[],
  uppers: Constraint[],
  strict: boolean,
  start: Record<string, number>,
  memo?: Memo,
): {
  ok: boolean;
  point?: Device;
  bindings: Map<string, Binding>;
  blockedAtSlowest: Binding[];
  failedAtFastest: Binding[];
  holding: Binding[];
  askedClean: boolean;
} {
  const point: Record<string, number> = { ...start };
  const bindings = new Map<string, Binding>();
  const slowest = deviceWith(base, point);
  const atSlowest = lowers.map((c) => evaluateAt(trial, c, slowest, memo));
  const blockedAtSlowest = lowers.filter((_, i) => !atSlowest[i].ok).map(bindingOf);
  if (blockedAtSlowest.length > 0)
    return { ok: false, bindings, blockedAtSlowest, failedAtFastest: [], holding: [], askedClean: false };
  // Require a full margin only where the slowest setting has one; the order adapts to fail fast.
  // Only a coordination constraint can hold without a full margin (a thin one).
  const needsClean = new Map(lowers.map((c, i) => [c, strict && atSlowest[i].clean && c.kind === 'coordinate-below']));
  const askedClean = [...needsClean.values()].some(Boolean);
  const order = [...lowers];
  const failing = (device: Device): Constraint | undefined => {
    for (let i = 0; i < order.length; i++) {
      const c = order[i];
      const r = evaluateAt(trial, c, device, memo);
      if (!(needsClean.get(c) ? r.clean : r.ok)) {
        order.splice(i, 1);
        order.unshift(c);
        return c;
      }
    }
    return undefined;
  };
  for (const spec of specs) {
    // Each probe changes one element of the point: the others stay shared (and their text with them).
    const at = devicesAlong(deviceWith(base, point), spec.key);
    const threshold = thresholdOf(spec, (value) => failing(at(value)) === undefined, {
      hi: point[spec.key],
      favours: 'slower',
    });
    const edge = threshold.kind === 'from' ? threshold.value : spec.values ? spec.values[0] : spec.min;
    const value = spec.values ? edge : Math.min(roundUp(edge), point[spec.key]);
    point[spec.key] = value;
    const below = spec.values ? spec.values[spec.values.indexOf(value) - 1] : edge * (1 - 1e-4);
    const stopper = below !== undefined && below >= spec.min ? failing(at(below)) : undefined;
    bindings.set(spec.key, stopper ? bindingOf(stopper) : rangeBinding(spec, 'lowest'));
  }
  const device = deviceWith(base, point);
  const failedAtFastest = uppers.filter((c) => !evaluateAt(trial, c, device, memo).ok).map(bindingOf);
  const holding = [
    ...new Map([...bindings.values()].filter((b) => b.kind !== 'setting-range').map((b) => [b.id, b])).values(),
  ];
  return {
    ok: failedAtFastest.length === 0,
    point: device,
    bindings,
    blockedAtSlowest: [],
    failedAtFastest,
    holding,
    askedClean,
  };
}

/** Rounds a continuous setting up to three significant figures (what a relay's keypad takes). */
function roundUp(value: number): number {
  const digits = Math.pow(10, Math.floor(Math.log10(value)) - 2);
  return Number((Math.ceil(value / digits - 1e-9) * digits).toPrecision(3));
}

/** From the present pickup to the largest fault where the device sits (A): the range the clearing score averages over. */
function clearingRangeOf(trial: Trial, device: Device): [number, number] {
  const to = trial.faults.buses.get(locationBusOf(trial.network, device).id)!.max.largest;
  const from = Math.max(pickupAmpsOf(device) ?? 0, 1e-3);
  return [from, Math.max(to, from * 10)];
}

/** Mean log10 clearing time over 32 log-spaced currents, times past the horizon held at it. */
function clearingOf(trial: Trial, device: Device, [from, to]: [number, number]): number {
  trial.place(device);
  const band = trial.bands.get(device.id)!;
  const horizon = trial.settings.horizon;
  let sum = 0;
  const n = 32;
  for (let i = 0; i < n; i++) {
    const amps = from * Math.pow(to / from, i / (n - 1));
    sum += Math.log10(Math.min(band.maxTime(amps), horizon));
  }
  return sum / n;
}
