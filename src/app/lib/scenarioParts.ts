import type { Analysis } from '../../engine/analysis.ts';
import type { Band } from '../../engine/band.ts';
import { lazyBandsOf } from '../../engine/bandCache.ts';
import type { Finding } from '../../engine/checks/finding.ts';
import { faultLevelsOf, type FaultLevels } from '../../engine/fault/index.ts';
import { networkOf, type Network } from '../../engine/network/index.ts';
import { scenarioLabel, scenarioPartsOf } from '../../engine/scenario/index.ts';
import type { Scenario, Study } from '../../engine/study/index.ts';

/**
 * One energised tree of a scenario as the workbench draws it: the radial study the engine split
 * off (`scenarioPartsOf`), its network, its fault levels and its bands (built when first drawn).
 */
export interface PartView {
  /** The source at its root: the utility source or a generator. */
  sourceId: string;
  study: Study;
  network: Network;
  faults: FaultLevels;
  bands: Map<string, Band>;
}

/** A scenario as the workbench draws it: its label, its energised trees and the buses no source reaches. */
export interface ScenarioView {
  scenario: Scenario;
  label: string;
  parts: PartView[];
  /** Bus ids of the whole study that no source reaches in this scenario, in study order. */
  deEnergised: string[];
}

/**
 * The trees `scenario` energises, each with its network and fault levels, and the buses left dark.
 * Throws what the engine throws for a study it cannot split.
 *
 * @example scenarioViewOf(study, scenariosOf(study)[1]).parts.map((p) => p.sourceId) // ['G1']
 */
export function scenarioViewOf(study: Study, scenario: Scenario): ScenarioView {
  const parts = scenarioPartsOf(study, scenario).map(({ sourceId, study: part }): PartView => {
    const network = networkOf(part);
    return { sourceId, study: part, network, faults: faultLevelsOf(network), bands: lazyBandsOf(part.devices) };
  });
  // The study's own source first, as the engine's scenario results list them.
  parts.sort((a, b) => Number(b.sourceId === study.source.id) - Number(a.sourceId === study.source.id));
  const energised = new Set(parts.flatMap((part) => [...part.network.buses.keys()]));
  return {
    scenario,
    label: scenarioLabel(scenario),
    parts,
    deEnergised: study.buses.filter((bus) => !energised.has(bus.id)).map((bus) => bus.id),
  };
}

/** Where a view's devices are in a scenario: the tree holding most of them, and those it leaves out. */
export interface ViewPlace {
  /** The tree holding most of the view's devices; absent when every one is de-energised. */
  part?: PartView;
  /** The view's devices not in that tree (de-energised, or fed from another source), in view order. */
  left: string[];
}

/**
 * The tree of a scenario that holds most of a view's devices (the first such tree on a tie), and the
 * devices it does not hold. The part's study carries the view cut down to its own devices.
 *
 * @example placeOfView(view, ['MAIN', 'FDR-EM', 'EM-BR']).left // ['MAIN', 'FDR-EM'] on the generator
 */
export function placeOfView(scenario: ScenarioView, viewId: string, devices: readonly string[]): ViewPlace {
  let best: PartView | undefined;
  let held = 0;
  for (const part of scenario.parts) {
    const view = part.study.views.find((v) => v.id === viewId);
    const count = view?.devices.length ?? 0;
    if (count > held) [best, held] = [part, count];
  }
  if (!best) return { left: [...devices] };
  const shown = new Set(best.study.views.find((v) => v.id === viewId)!.devices);
  return { part: best, left: devices.filter((id) => !shown.has(id)) };
}

/**
 * A part as an `Analysis` for the plot layer (the sheet, the one-line diagram, the probe): its own
 * study, network, fault levels and bands, with the checks' pairs and findings given.
 *
 * @example viewInputOf(analysisOfPart(part, pairs, findings), 'emergency')
 */
export function analysisOfPart(part: PartView, pairs: Analysis['pairs'], findings: Finding[]): Analysis {
  const counts: Analysis['counts'] = { ok: 0, info: 0, warning: 0, fail: 0 };
  for (const finding of findings) counts[finding.severity]++;
  return { study: part.study, network: part.network, faults: part.faults, bands: part.bands, pairs, findings, counts };
}

/**
 * The findings that hold in the scenario labelled `label` (a finding naming no scenario holds in every one).
 * @example findingsIn(findings, 'On generator').map((f) => f.id) // ['decrement:GEN-CB/EM-BR', …]
 */
export function findingsIn(findings: readonly Finding[], label: string): Finding[] {
  return findings.filter((finding) => !finding.scenarios || finding.scenarios.includes(label));
}
