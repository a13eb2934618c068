import { analyseScenarios } from '../scenario/scenarioAnalysis.ts';
import { splitScenario } from '../scenario/scenarioParts.ts';
import { hasScenarios, scenariosOf } from '../scenario/scenarios.ts';
import { nameOf } from '../checks/context.ts';
import type { Finding } from '../checks/finding.ts';
import { pathTo } from '../network/index.ts';
import type { Device, Study } from '../study/index.ts';
import { constraintsOf } from './constraints.ts';
import { noWindowOf, type NoWindow } from './noWindow.ts';
import { recommendationOf, TIE_BREAK, type ConstraintMargin } from './recommendation.ts';
import type { Binding } from './settingInterval.ts';
import { adjustableSettingsOf, type SettingValue } from './settings.ts';
import { overridesOf } from './settingWindow.ts';
import { trialOf } from './trial.ts';

/** How a proposal orders the devices it sets (stated with every proposal). */
export const PROPOSAL_ORDER =
  'From the loads toward the source: the device furthest from the source first (by the number of buses and branches between them), ties in the order the study lists the devices. Each adjustable device is set to its fastest recommendation given the devices below it as already proposed; the device above is set afterwards to wait for it. Fuses, thermal-magnetic breakers and devices outside the proposal stay as they are and constrain the others.';

/** One setting a proposal changes. */
export interface SettingChange {
  deviceId: string;
  deviceName: string;
  key: string;
  label: string;
  unit: string;
  from: SettingValue | undefined;
  to: SettingValue | undefined;
  /** What holds the new value where it is. */
  binding?: Binding;
}

/** What the proposal did for one device. */
export interface DeviceProposal {
  deviceId: string;
  deviceName: string;
  /** A setting keeping every constraint was found (otherwise the device keeps its settings). */
  exists: boolean;
  changes: SettingChange[];
  /** Every constraint at the proposed (or kept) setting. */
  margins: ConstraintMargin[];
  noWindow?: NoWindow;
}

/** Settings for a path or a whole study, each inside its window, with the findings they clear or leave (DEVELOPERS.md, names). */
export interface Proposal {
  /** Device ids in the order they were set. */
  order: string[];
  orderRule: string;
  tieBreak: string;
  devices: DeviceProposal[];
  /** Every changed setting, in order. */
  changes: SettingChange[];
  /** The study with the proposed settings (parsed form). */
  study: Study;
  /** Failing and warning findings before that the proposal clears. */
  cleared: Finding[];
  /** Failing and warning findings that remain. */
  remaining: Finding[];
  /** Failing and warning findings the proposal brings that were not there before. */
  introduced: Finding[];
  /** Failures before and after. */
  failsBefore: number;
  failsAfter: number;
}

/** Options of `proposeSettings`. */
export interface ProposalOptions {
  /** The devices to set (e.g. one view's); @default every device of the study */
  deviceIds?: string[];
  /** Compare the findings before and after (two full analyses). @default true */
  compare?: boolean;
}

/**
 * Proposes settings for a path or a whole study (DEVELOPERS.md, names "proposal"): from the loads toward the
 * source (`PROPOSAL_ORDER`), each adjustable device set to its fastest-clearing recommendation
 * (`TIE_BREAK`) given what is below it. Returns the changes with before/after values and the findings
 * they clear, leave or bring. Pure: the study is not touched.
 *
 * @example proposeSettings(study).changes.map((c) => `${c.deviceId} ${c.key} ${c.from} → ${c.to}`)
 */
export function proposeSettings(study: Study, options: ProposalOptions = {}): Proposal {
  return hasScenarios(study) ? proposeAcrossScenarios(study, options) : proposeInTree(study, options);
}

/**
 * Proposals for a switched study: scenario by scenario in the study's order, tree by tree, each
 * device set in the first scenario that energises it and held as set in the later ones (which set
 * only the devices they newly energise, e.g. a generator breaker after the loads it feeds). The
 * findings before and after are every scenario's.
 */
function proposeAcrossScenarios(study: Study, options: ProposalOptions): Proposal {
  const scope = new Set(options.deviceIds ?? study.devices.map((d) => d.id));
  const settled = new Set<string>();
  const parts: Proposal[] = [];
  let proposed = study;
  for (const scenario of scenariosOf(study))
    for (const part of splitScenario(proposed, scenario)) {
      const ids = part.study.devices.map((d) => d.id).filter((id) => scope.has(id) && !settled.has(id));
      if (ids.length === 0) continue;
      const proposal = proposeInTree(part.study, { deviceIds: ids, compare: false });
      parts.push(proposal);
      for (const id of ids) settled.add(id);
      const set = new Map(proposal.study.devices.map((d) => [d.id, d]));
      proposed = {
        ...proposed,
        devices: proposed.devices.map((d) => (settled.has(d.id) && set.has(d.id) ? set.get(d.id)! : d)),
      };
    }
  const devices = parts.flatMap((p) => p.devices);
  return {
    order: parts.flatMap((p) => p.order),
    orderRule: `${PROPOSAL_ORDER}; scenario by scenario, each device set in the first scenario that energises it`,
    tieBreak: TIE_BREAK,
    devices,
    changes: devices.flatMap((d) => d.changes),
    study: proposed,
    ...(options.compare === false
      ? { cleared: [], remaining: [], introduced: [], failsBefore: 0, failsAfter: 0 }
      : compared(analyseScenarios(study).findings, analyseScenarios(proposed).findings)),
  };
}

// Accepts the findings before and after; those cleared, remaining and introduced, and the failures.
function compared(
  beforeAll: Finding[],
  afterAll: Finding[],
): Pick<Proposal, 'cleared' | 'remaining' | 'introduced' | 'failsBefore' | 'failsAfter'> {
  const attention = (f: Finding) => f.severity === 'fail' || f.severity === 'warning';
  const before = beforeAll.filter(attention);
  const after = afterAll.filter(attention);
  const afterIds = new Set(after.map((f) => f.id));
  const beforeIds = new Set(before.map((f) => f.id));
  return {
    cleared: before.filter((f) => !afterIds.has(f.id)),
    remaining: after.filter((f) => beforeIds.has(f.id)),
    introduced: after.filter((f) => !beforeIds.has(f.id)),
    failsBefore: before.filter((f) => f.severity === 'fail').length,
    failsAfter: after.filter((f) => f.severity === 'fail').length,
  };
}

// Accepts one radial tree; the proposal for it (the method of `proposeSettings`).
function proposeInTree(study: Study, options: ProposalOptions): Proposal {
  const { deviceIds, compare = true } = options;
  const trial = trialOf(study);
  const scope = new Set(deviceIds ?? study.devices.map((d) => d.id));
  const depth = new Map(study.devices.map((d) => [d.id, pathTo(trial.network, d.feeds).length]));
  const indexOf = new Map(study.devices.map((d, i) => [d.id, i]));
  const adjustable = (device: Device) => adjustableSettingsOf(device, { overrides: overridesOf(device) }).length > 0;
  const order = study.devices
    .filter((d) => scope.has(d.id) && adjustable(d))
    .sort((a, b) => depth.get(b.id)! - depth.get(a.id)! || indexOf.get(a.id)! - indexOf.get(b.id)!)
    .map((d) => d.id);
  const willBeSet = new Set(order);

  const devices: DeviceProposal[] = [];
  for (const id of order) {
    const device = trial.deviceOf(id);
    const above = trial.aboveOf.get(id);
    const includeAbove = above === undefined || !willBeSet.has(above);
    const constraints = constraintsOf(trial, id, { includeAbove });
    const { recommendation, attempts } = recommendationOf(trial, id, constraints, {
      overrides: overridesOf(device),
      memo: new Map(),
    });
    if (recommendation) {
      trial.place(recommendation.device);
      devices.push({
        deviceId: id,
        deviceName: nameOf(device),
        exists: true,
        changes: recommendation.settings
          .filter((s) => s.from !== s.to)
          .map((s) => ({ deviceId: id, deviceName: nameOf(device), ...s })),
        margins: recommendation.margins,
      });
    } else {
      devices.push({
        deviceId: id,
        deviceName: nameOf(device),
        exists: false,
        changes: [],
        margins: constraints.map((c) => ({
          id: c.id,
          kind: c.kind,
          label: c.label,
          source: c.source,
          favours: c.favours,
          result: c.evaluate(trial),
        })),
        noWindow: noWindowOf(trial, id, constraints, attempts, { remedies: false, includeAbove }),
      });
    }
  }

  const proposed: Study = { ...study, devices: study.devices.map((d) => trial.deviceOf(d.id)) };
  // Every finding `check` gives, the NFPA 70 selective-coordination ones of marked devices included.
  const comparison = compare
    ? compared(analyseScenarios(study).findings, analyseScenarios(proposed).findings)
    : { cleared: [], remaining: [], introduced: [], failsBefore: 0, failsAfter: 0 };
  return {
    order,
    orderRule: PROPOSAL_ORDER,
    tieBreak: TIE_BREAK,
    devices,
    changes: devices.flatMap((d) => d.changes),
    study: proposed,
    ...comparison,
  };
}
