import { locationBusOf } from '../network/index.ts';
import { evaluateAt, type Memo } from './evaluation.ts';
import type { Device } from '../study/index.ts';
import { pickupAmpsOf } from '../checks/loadBelow.ts';
import type { Constraint, ConstraintResult } from './constraints.ts';
import { mapColumnsOf, type FeasibleMap } from './feasibleMap.ts';
import { bindingOf, rangeBinding, type Binding, type SettingAxis } from './settingInterval.ts';
import {
  adjustableSettingsOf,
  devicesAlong,
  deviceWith,
  mainPairsOf,
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
  'Fastest first: every setting starts at its slowest (and, with the present on/off choices, also at the present setting); then, in the order instantaneous, short-time delay, short-time pickup, long-time delay (or time dial), long-time pickup, ground-fault delay, ground-fault pickup, each is lowered to the lowest step that still waits for every device below and rides through inrush, motor starting and load, keeping a full margin (no thin margin) wherever its start has one; a start that ends with full margins is taken before one that needs a thin margin. When no start ends keeping every constraint, the descent starts again from each setting the window shows keeping every constraint: each on/off state, each setting at the top of its own interval, then each open cell of the pickup × time maps at its lowest time. Continuous relay settings are rounded up to three significant figures. Between on/off choices (instantaneous trip, I²t in/out) the one with the fewest thin margins wins, then the one that clears faster on average over the device’s current range; on a tie, the present choice.';

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

/**
 * The constraints a setting does not keep, from its margins: those that fail, and those that hold with
 * a negative margin. The recommendation search only refuses failures, and a few checks warn rather
 * than fail (a generator's damage curve, clearing the minimum fault within the time allowed), so a
 * recommendation can miss them; constraints no setting changes (interrupting duty) are kept or not
 * whatever the setting.
 *
 * @example notKeptOf(settingWindowOf(study, 'GEN-CB').recommendation!.margins).map((m) => m.label)
 */
export function notKeptOf(margins: readonly ConstraintMargin[]): ConstraintMargin[] {
  return margins.filter((m) => !m.result.ok || m.result.margin < 0);
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
  /** Results already known for this state of the rest of the study. @default a memo of its own */
  memo?: Memo;
  /** Each setting's window with the others held at the present setting, by key, when already solved. */
  rows?: Map<string, SettingAxis>;
  /** The maps of the main pairs through the present setting, when already drawn. */
  maps?: FeasibleMap[];
}

/** A setting the search ended at, with what held each setting there. */
interface Candidate {
  device: Device;
  bindings: Map<string, Binding>;
  clearing: number;
}

/** A starting point of the descent: a state of every switch and a value of every numeric setting. */
interface Start {
  switches: Record<string, boolean>;
  values: Record<string, number>;
}

/**
 * Searches a device's settings for the fastest-clearing one that keeps every constraint (`TIE_BREAK`
 * says how), trying each on/off combination. Exact at its ends: with every setting at its slowest,
 * a slower-favoured constraint that still fails cannot be met at all; with every setting as low as
 * the devices below allow, a faster-favoured constraint that fails names a conflict. One descent finds
 * one trade-off between the constraints below and above, so when none from the slowest or present
 * setting works, it descends again from every setting the window shows keeping every constraint: each
 * on/off state with the rest as they are, each setting's interval with the others held, and each open
 * cell of the maps of the main pairs. No recommendation means none of those exists. Leaves the trial as
 * it found it.
 *
 * @example recommendationOf(trial, 'MAIN', constraintsOf(trial, 'MAIN')).recommendation?.settings
 */
export function recommendationOf(
  trial: Trial,
  deviceId: string,
  constraints: Constraint[],
  options: RecommendationOptions = {},
): { recommendation?: Recommendation; attempts: Attempt[] } {
  // Only this device moves during the search, so a memo of its own is valid throughout.
  const { memo = new Map() } = options;
  const original = trial.deviceOf(deviceId);
  const lowers = constraints.filter((c) => c.favours === 'slower');
  const uppers = constraints.filter((c) => c.favours === 'faster');
  const attempts: Attempt[] = [];
  const candidates: Candidate[] = [];
  const range = clearingRangeOf(trial, original);
  const candidateOf = (device: Device, bindings: Map<string, Binding>): Candidate => ({
    device,
    bindings,
    clearing: clearingOf(trial, device, range),
  });
  const isPresent = (switches: Record<string, boolean>) =>
    switchesOf(original).every((s) => switches[s.key] === s.current);
  // The combinations where no constraint fails with every setting at its slowest; in the others no
  // setting can work, as every constraint is monotone in every setting.
  const open: Record<string, boolean>[] = [];

  // First, in each on/off combination, the descent from the slowest setting (and in the present
  // combination from the present setting too), a full margin asked of every start before a thin one.
  for (const switches of combinationsOf(original)) {
    const base = deviceWith(original, switches);
    const specs = adjustableSettingsOf(base, options);
    const slowest = Object.fromEntries(specs.map((spec) => [spec.key, spec.max]));
    const starts = [slowest];
    if (isPresent(switches)) starts.push(Object.fromEntries(specs.map((spec) => [spec.key, spec.current])));
    const { found, failed } = descentOf(trial, base, specs, lowers, uppers, starts, memo);
    if (found) candidates.push(candidateOf(found.point!, found.bindings));
    if (!failed?.blockedAtSlowest.length) open.push(switches);
    if (failed && (candidates.length === 0 || failed.blockedAtSlowest.length > 0))
      attempts.push({ switches, ...failed });
  }

  // Then, when none was found, from every setting the window itself shows keeping every constraint.
  if (candidates.length === 0 && open.length > 0) {
    const tried = new Set<string>();
    const fromStart = (start: Start): Candidate | undefined => {
      const key = JSON.stringify(start);
      if (tried.has(key)) return undefined;
      tried.add(key);
      const base = deviceWith(original, start.switches);
      const device = deviceWith(base, start.values);
      if (!constraints.every((c) => c.favours === 'fixed' || evaluateAt(trial, c, device, memo).ok)) return undefined;
      const { found } = descentOf(
        trial,
        base,
        adjustableSettingsOf(base, options),
        lowers,
        uppers,
        [start.values],
        memo,
      );
      // A start that keeps every constraint is itself a setting, should a descent from it fail.
      return found ? candidateOf(found.point!, found.bindings) : candidateOf(device, new Map());
    };
    const presentOpen = isPresent(open[0]);
    for (const start of windowStartsOf(trial, original, lowers, uppers, open, presentOpen, options, memo)) {
      const found = fromStart(start);
      if (found) candidates.push(found);
    }
    // The cells of the maps last, and only until one works (there may be a hundred).
    if (candidates.length === 0 && presentOpen)
      for (const start of mapStartsOf(trial, original, lowers, open[0], options, memo)) {
        const found = fromStart(start);
        if (found) {
          candidates.push(found);
          break;
        }
      }
  }

  // A full margin first (the fewest thin ones), then the fastest clearing; on a tie the earlier found.
  const thin = (device: Device) =>
    candidates.length < 2
      ? 0
      : constraints.filter((c) => {
          if (c.favours === 'fixed') return false;
          const r = evaluateAt(trial, c, device, memo);
          return r.ok && !r.clean;
        }).length;
  const ranked = candidates.map((c) => ({ ...c, thin: thin(c.device) }));
  const best = ranked.reduce<(typeof ranked)[number] | undefined>(
    (a, b) => (!a || b.thin < a.thin || (b.thin === a.thin && b.clearing < a.clearing - 1e-9) ? b : a),
    undefined,
  );

  let recommendation: Recommendation | undefined;
  if (best) {
    const margins = constraints.map((c) => ({
      id: c.id,
      kind: c.kind,
      label: c.label,
      source: c.source,
      favours: c.favours,
      result: evaluateAt(trial, c, best.device, memo),
    }));
    const rows: RecommendedSetting[] = [
      ...switchesOf(original).map((s) => ({
        key: s.key,
        label: s.label,
        unit: '',
        from: settingValue(original, s.key),
        to: settingValue(best.device, s.key),
      })),
      ...adjustableSettingsOf(original, options).map((spec) => ({
        key: spec.key,
        label: spec.label,
        unit: spec.unit,
        from: spec.current,
        to: settingValue(best.device, spec.key),
        binding: best.bindings.get(spec.key),
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

/**
 * The descents from several starts of one on/off combination: with a full margin asked first (from
 * every start in turn), then without. The first that ends keeping every constraint is `found`;
 * `failed` is the last failure from the first start (the slowest, for the no-window explanation).
 */
function descentOf(
  trial: Trial,
  base: Device,
  specs: SettingSpec[],
  lowers: Constraint[],
  uppers: Constraint[],
  starts: Record<string, number>[],
  memo: Memo,
): { found?: Descent; failed?: Omit<Attempt, 'switches'> } {
  let failed: Omit<Attempt, 'switches'> | undefined;
  // Starts whose strict descent already was the plain one (it asked for no full margin) or was blocked.
  const done = new Set<number>();
  for (const strict of [true, false]) {
    for (let i = 0; i < starts.length; i++) {
      if (done.has(i)) continue;
      const attempt = fastestPoint(trial, base, specs, lowers, uppers, strict, starts[i], memo);
      if (attempt.ok) return { found: attempt, failed };
      if (i === 0) failed = attempt;
      // Blocked at the slowest setting: nothing lower can work, from any start.
      if (i === 0 && attempt.blockedAtSlowest.length > 0) return { failed };
      if (attempt.blockedAtSlowest.length > 0 || !attempt.askedClean) done.add(i);
    }
  }
  return { failed };
}

/**
 * Starts the window shows keeping every constraint, with the rest held as it is: the present numeric
 * settings under each other on/off combination (the switch rows), and each setting at the top of its
 * own interval (the setting rows), where the constraints below it keep the most margin and the
 * descent the most room. A start is only offered; the caller checks it holds.
 */
function windowStartsOf(
  trial: Trial,
  device: Device,
  lowers: Constraint[],
  uppers: Constraint[],
  combinations: Record<string, boolean>[],
  presentOpen: boolean,
  options: RecommendationOptions,
  memo: Memo,
): Start[] {
  const specs = adjustableSettingsOf(device, options);
  const present = Object.fromEntries(specs.map((spec) => [spec.key, spec.current]));
  const switches = combinations[0];
  // The present numeric settings under the present switches were a start already.
  const starts: Start[] = combinations
    .slice(presentOpen ? 1 : 0)
    .map((combination) => ({ switches: combination, values: present }));
  if (!presentOpen) return starts;
  for (const spec of specs) {
    const intervals = options.rows?.get(spec.key)?.intervals ?? intervalsOf(trial, device, spec, lowers, uppers, memo);
    for (const { from, to } of intervals) {
      const top = spec.values ? to : roundDown(to);
      starts.push({ switches, values: { ...present, [spec.key]: top >= from ? top : to } });
    }
  }
  trial.place(device);
  return starts;
}

/**
 * One setting's interval with the others held (as `intervalOf` finds it, but with one bisection on all
 * the slower-favoured constraints at once and one on all the faster-favoured ones): none when the
 * faster-favoured ones fail where the slower-favoured ones begin to hold.
 */
function intervalsOf(
  trial: Trial,
  device: Device,
  spec: SettingSpec,
  lowers: Constraint[],
  uppers: Constraint[],
  memo: Memo,
): { from: number; to: number }[] {
  const at = devicesAlong(device, spec.key);
  const all = (constraints: Constraint[]) => (value: number) =>
    constraints.every((c) => evaluateAt(trial, c, at(value), memo).ok);
  const lower = thresholdOf(spec, all(lowers), { favours: 'slower' });
  if (lower.kind === 'nowhere') return [];
  const from = lower.kind === 'from' ? lower.value : spec.min;
  const upper = thresholdOf(spec, all(uppers), { favours: 'faster', lo: from });
  if (upper.kind === 'nowhere') return [];
  return [{ from, to: upper.kind === 'upTo' ? upper.value : spec.max }];
}

/**
 * Each open cell of the maps of the main pairs (each pickup column, the rest held as it is), at the
 * lowest time setting that holds there: read from the maps when drawn, else solved column by column.
 */
function* mapStartsOf(
  trial: Trial,
  device: Device,
  lowers: Constraint[],
  switches: Record<string, boolean>,
  options: RecommendationOptions,
  memo: Memo,
): Generator<Start> {
  const specs = adjustableSettingsOf(device, options);
  const present = Object.fromEntries(specs.map((spec) => [spec.key, spec.current]));
  if (options.maps) {
    for (const map of options.maps)
      for (const column of map.columns)
        for (const interval of column.intervals)
          yield {
            switches,
            values: { ...present, [map.x.key]: column.x, [map.y.key]: lowestOf(map.y, interval.from, interval.to) },
          };
    return;
  }
  // Solved one column at a time, as the search asks: it stops at the first that works.
  for (const pair of mainPairsOf(device)) {
    const x = specs.find((spec) => spec.key === pair.x);
    const y = specs.find((spec) => spec.key === pair.y);
    if (!x || !y) continue;
    const edges = options.rows?.get(x.key)?.intervals.flatMap((i) => [i.from, i.to]);
    for (const column of mapColumnsOf(x, edges)) {
      const values = { ...present, [x.key]: column };
      const low = lowestHolding(trial, device, y, values, lowers, memo);
      if (low !== undefined) yield { switches, values: { ...values, [y.key]: low } };
    }
  }
}

/**
 * The lowest value of one setting, the others at `values`, at which every slower-favoured constraint
 * holds (none when there is none): where a column of a map opens, if the faster-favoured constraints
 * hold there too.
 */
function lowestHolding(
  trial: Trial,
  device: Device,
  spec: SettingSpec,
  values: Record<string, number>,
  lowers: Constraint[],
  memo: Memo,
): number | undefined {
  const at = devicesAlong(deviceWith(device, values), spec.key);
  const holds = (value: number) => lowers.every((c) => evaluateAt(trial, c, at(value), memo).ok);
  const threshold = thresholdOf(spec, holds, { favours: 'slower' });
  if (threshold.kind === 'nowhere') return undefined;
  return lowestOf(spec, threshold.kind === 'from' ? threshold.value : spec.min, spec.max);
}

/** The bottom of an interval, a continuous setting rounded up to three significant figures where that stays inside. */
function lowestOf(spec: Pick<SettingSpec, 'values'>, from: number, to: number): number {
  if (spec.values) return from;
  const rounded = roundUp(from);
  return rounded <= to ? rounded : from;
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

/** What one descent ended at: the point and what held it, or why it fails. */
interface Descent {
  ok: boolean;
  point?: Device;
  bindings: Map<string, Binding>;
  blockedAtSlowest: Binding[];
  failedAtFastest: Binding[];
  holding: Binding[];
  /** A full margin was asked of some constraint (a strict descent that was not the plain one). */
  askedClean: boolean;
}

/** The greedy descent from one start (the slowest setting, say); see `recommendationOf`. */
function fastestPoint(
  trial: Trial,
  base: Device,
  specs: SettingSpec[],
  lowers: Constraint[],
  uppers: Constraint[],
  strict: boolean,
  start: Record<string, number>,
  memo?: Memo,
): Descent {
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

/** Rounds a continuous setting down to three significant figures. */
function roundDown(value: number): number {
  const digits = Math.pow(10, Math.floor(Math.log10(value)) - 2);
  return Number((Math.floor(value / digits + 1e-9) * digits).toPrecision(3));
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
