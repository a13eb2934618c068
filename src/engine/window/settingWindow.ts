import { nameOf } from '../checks/context.ts';
import { treeHolding } from '../scenario/scenarioParts.ts';
import { expectedGot, InputError } from '../errors.ts';
import type { Device, Study } from '../study/index.ts';
import { constraintsOf, type Constraint } from './constraints.ts';
import { evaluateAt, type Memo } from './evaluation.ts';
import { feasibleMapOf, type FeasibleMap } from './feasibleMap.ts';
import { noWindowOf, type NoWindow } from './noWindow.ts';
import { recommendationOf, type ConstraintMargin, type Recommendation } from './recommendation.ts';
import { axisOf, thresholdsOf, type Binding, type SettingInterval } from './settingInterval.ts';
import {
  adjustableSettingsOf,
  deviceWith,
  mainPairsOf,
  switchesOf,
  type SettingRangeOverride,
  type SettingSpec,
  type SwitchSpec,
} from './settings.ts';
import type { Threshold } from './threshold.ts';
import { trialOf, type Trial } from './trial.ts';

/** One adjustable setting's window: its range and the feasible interval(s) with the rest held. */
export interface SettingRow extends SettingSpec {
  intervals: SettingInterval[];
  /** When no interval: the constraints that close the setting's whole range. */
  blocked: Binding[];
  /** The present value lies inside an interval. */
  inside: boolean;
}

/** An on/off choice and whether each state keeps every constraint with the rest held. */
export interface SwitchRow extends SwitchSpec {
  /** Per option (same order as `options`): every constraint holds with that state and the rest held. */
  feasible: boolean[];
}

/** The setting window of one device (DEVELOPERS.md, names): what it may be set to, and why not otherwise. */
export interface SettingWindow {
  deviceId: string;
  deviceName: string;
  kind: Device['characteristic']['kind'];
  /** False for fuses and thermal-magnetic breakers: they have nothing to set, only constraints. */
  adjustable: boolean;
  settings: SettingRow[];
  switches: SwitchRow[];
  /** Every constraint, with how the present setting stands against it. */
  constraints: ConstraintMargin[];
  /** The present setting keeps every constraint. */
  currentHolds: boolean;
  /** The 2-D map of each main pair of settings (pickup × time). */
  maps: FeasibleMap[];
  /**
   * The fastest-clearing setting that keeps every constraint, when one exists. "Keeps" is "does not
   * fail": a bound the checks only warn about (a generator's damage curve, the minimum fault's clearing
   * time) may still be missed there, with a negative margin in `recommendation.margins`.
   */
  recommendation?: Recommendation;
  /** Why no setting works, and what elsewhere would open a window. */
  noWindow?: NoWindow;
  /** A setting exists (over every setting and on/off choice) that keeps every constraint. */
  exists: boolean;
}

/** Options of `settingWindowOf`. */
export interface SettingWindowOptions {
  /** Draw the 2-D maps of the main pairs. @default true */
  maps?: boolean;
  /** Include coordination with the device above (a proposal sets the device above afterwards). @default true */
  includeAbove?: boolean;
  /** Search changes elsewhere that would open a window when none exists. @default true */
  remedies?: boolean;
  /**
   * For a switched study, the scenario (id) whose tree holding the device is searched.
   * @default the first scenario that energises the device
   */
  scenario?: string;
}

/**
 * The setting window of one device, the rest of the study fixed (DEVELOPERS.md, names): for each adjustable
 * setting the feasible interval with the others held, each edge named by its binding constraint
 * (solved by bracketing and bisection on the checks themselves: `checkPair`, the withstand and
 * NEC 450.3 checks); for the main pair of settings a 2-D map; the fastest-clearing recommendation
 * with its margins to every constraint; and, when no window exists, the conflict and the smallest
 * changes elsewhere that would open one. In a switched study the window is that of the device's tree
 * in one scenario (`options.scenario`, else the first that energises it). Throws `InputError` for an
 * unknown device id.
 *
 * @example settingWindowOf(study, 'MAIN').recommendation?.settings
 */
export function settingWindowOf(study: Study, deviceId: string, options: SettingWindowOptions = {}): SettingWindow {
  if (!study.devices.some((d) => d.id === deviceId)) {
    throw new InputError('device', expectedGot(`one of ${study.devices.map((d) => d.id).join(', ')}`, deviceId));
  }
  // A switched study: the device's own radial tree in the chosen scenario.
  const tree = treeHolding(study, deviceId, options.scenario);
  if (!tree)
    throw new InputError(
      'device',
      expectedGot(`a device energised in scenario "${options.scenario ?? 'any'}"`, deviceId),
    );
  return windowIn(trialOf(tree), deviceId, options);
}

/**
 * The setting window of a device in an existing trial (shared by proposals, which keep one trial for
 * a whole study). Leaves the trial as it found it.
 *
 * @example windowIn(trialOf(study), 'MAIN', { maps: false })
 */
export function windowIn(trial: Trial, deviceId: string, options: SettingWindowOptions = {}): SettingWindow {
  const { maps: withMaps = true, includeAbove = true, remedies = true } = options;
  const device = trial.deviceOf(deviceId);
  const overrides = overridesOf(device);
  const constraints = constraintsOf(trial, deviceId, { includeAbove });
  const specs = adjustableSettingsOf(device, { overrides });
  // Only this device moves until the remedies: one memo of results serves rows, maps and the search.
  const memo: Memo = new Map();
  const present = marginsAt(trial, device, constraints, memo);
  const currentHolds = present.every((m) => m.favours === 'fixed' || m.result.ok);

  // Each row's thresholds by setting key: the maps start from the rows through the present setting.
  const rows = new Map<string, Map<string, Threshold>>();
  const settings: SettingRow[] = specs.map((spec) => {
    const thresholds = thresholdsOf(trial, device, spec, constraints, { memo });
    rows.set(spec.key, thresholds);
    const axis = axisOf(spec, constraints, thresholds);
    const inside = axis.intervals.some((i) => spec.current >= i.from * (1 - 1e-9) && spec.current <= i.to * (1 + 1e-9));
    return { ...spec, ...axis, inside };
  });
  const switches: SwitchRow[] = switchesOf(device).map((s) => ({
    ...s,
    feasible: s.options.map((option) => {
      const trialDevice = deviceWith(device, { [s.key]: option });
      return constraints.every((c) => c.favours === 'fixed' || evaluateAt(trial, c, trialDevice, memo).ok);
    }),
  }));
  trial.place(device);

  const maps: FeasibleMap[] = [];
  if (withMaps) {
    for (const pair of mainPairsOf(device)) {
      const x = specs.find((s) => s.key === pair.x);
      const y = specs.find((s) => s.key === pair.y);
      if (!x || !y) continue;
      const row = settings.find((s) => s.key === pair.x)!;
      const edges = row.intervals.flatMap((i) => [i.from, i.to]);
      maps.push(
        feasibleMapOf(trial, device, x, y, constraints, pair.label, {
          extraColumns: edges,
          memo,
          rows: { x: rows.get(x.key)!, y: rows.get(y.key)! },
        }),
      );
    }
  }

  const { recommendation, attempts } =
    specs.length > 0
      ? recommendationOf(trial, deviceId, constraints, {
          overrides,
          memo,
          rows: new Map(settings.map((row) => [row.key, row])),
          maps: withMaps ? maps : undefined,
        })
      : { recommendation: undefined, attempts: [] };
  const adjustable = specs.length > 0;
  // The search tries every setting the rows, switches and maps show keeping every constraint.
  const exists = adjustable ? recommendation !== undefined : currentHolds;
  const noWindow =
    !exists && adjustable ? noWindowOf(trial, deviceId, constraints, attempts, { remedies, includeAbove }) : undefined;
  trial.place(device);
  return {
    deviceId,
    deviceName: nameOf(device),
    kind: device.characteristic.kind,
    adjustable,
    settings,
    switches,
    constraints: present,
    currentHolds,
    maps,
    recommendation,
    noWindow,
    exists,
  };
}

/** The device's own setting ranges, when its study entry gives them. */
export function overridesOf(device: Device): Record<string, SettingRangeOverride> | undefined {
  return (device as Device & { adjustable?: Record<string, SettingRangeOverride> }).adjustable;
}

/** Every constraint evaluated with `device` in place (remembered: the rows start from the present setting). */
function marginsAt(trial: Trial, device: Device, constraints: Constraint[], memo: Memo): ConstraintMargin[] {
  return constraints.map((c) => ({
    id: c.id,
    kind: c.kind,
    label: c.label,
    source: c.source,
    favours: c.favours,
    result: evaluateAt(trial, c, device, memo),
  }));
}
