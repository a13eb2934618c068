import { analyseStudy, type Analysis } from '../analysis.ts';
import { codeSelectivityFindings } from '../checks/codeSelectivity.ts';
import { serviceSelectivityFindings } from '../checks/serviceSelectivity.ts';
import type { Finding, Severity } from '../checks/finding.ts';
import { expectedGot, InputError } from '../errors.ts';
import type { Scenario, Study } from '../study/index.ts';
import { scenarioPartsOf } from './scenarioParts.ts';
import { hasScenarios, scenarioLabel, scenariosOf, sourcesInService } from './scenarios.ts';

/** One scenario's results: an analysis per source tree it splits into, and what no source reaches. */
export interface ScenarioResult {
  scenario: Scenario;
  label: string;
  /** The sources in service. */
  sources: string[];
  /** One analysis per energised tree, the study's own source first. */
  parts: Analysis[];
  /** Buses no source reaches in this scenario. */
  deEnergised: string[];
}

/** Options for `analyseScenarios`. */
export interface ScenarioOptions {
  /** Only this scenario (by id or name); default every scenario. */
  only?: string;
}

/**
 * Every check in every scenario (NFPA 70 700.32: selective for every source that can feed the
 * fault). Each scenario's trees are analysed as radial studies of their own (`scenarioPartsOf`);
 * the findings are merged: one finding holds in the scenarios listed in its `scenarios` (the same
 * severity, title and explanation); a finding that reads differently in two scenarios appears once
 * for each. A study that cannot be switched gives exactly `analyseStudy(study)`.
 *
 * The returned analysis is the primary tree of the first scenario (its network, fault levels,
 * bands and pairs: what a single sheet draws), with the merged findings and every scenario's
 * results in `scenarios`.
 *
 * @example analyseScenarios(study).scenarios?.map((s) => s.label) // ['Normal', 'On generator']
 */
export function analyseScenarios(study: Study, options: ScenarioOptions = {}): Analysis {
  if (!hasScenarios(study)) {
    if (options.only !== undefined) scenarioNamed(study, options.only);
    const analysis = analyseStudy(study);
    const normal = [{ label: 'Normal', parts: [analysis] }];
    const code = [
      ...codeSelectivityFindings(study, normal, { labelled: false }),
      ...serviceSelectivityFindings(study, normal, { labelled: false }),
    ];
    return code.length === 0 ? analysis : withFindings(analysis, [...analysis.findings, ...code]);
  }
  const chosen = options.only === undefined ? scenariosOf(study) : [scenarioNamed(study, options.only)];
  const results = chosen.map((scenario) => scenarioResultOf(study, scenario));
  const findings = [
    ...mergedFindings(results),
    ...codeSelectivityFindings(study, results),
    ...serviceSelectivityFindings(study, results),
  ];
  const primary = results.find((r) => r.parts.length > 0)?.parts[0];
  if (!primary)
    throw new InputError(
      'scenario',
      expectedGot('a scenario with a source in service that energises a bus', options.only),
    );
  return { ...withFindings(primary, findings), study, scenarios: results };
}

// Accepts an analysis and its findings; the analysis with them and their counts.
function withFindings(analysis: Analysis, findings: Finding[]): Analysis {
  const counts: Record<Severity, number> = { ok: 0, info: 0, warning: 0, fail: 0 };
  for (const finding of findings) counts[finding.severity]++;
  return { ...analysis, findings, counts };
}

/** The scenario with this id or name; an `InputError` naming the choices otherwise. */
export function scenarioNamed(study: Study, name: string): Scenario {
  const all = scenariosOf(study);
  const found = all.find((s) => s.id === name) ?? all.find((s) => scenarioLabel(s) === name);
  if (!found) throw new InputError('scenario', expectedGot(`one of ${all.map((s) => `"${s.id}"`).join(', ')}`, name));
  return found;
}

/** One scenario analysed tree by tree, the study's own source first. */
export function scenarioResultOf(study: Study, scenario: Scenario): ScenarioResult {
  const parts = scenarioPartsOf(study, scenario).map((part) => analyseStudy(part.study));
  parts.sort((a, b) => Number(b.study.source.id === study.source.id) - Number(a.study.source.id === study.source.id));
  const energised = new Set(parts.flatMap((a) => a.study.buses.map((b) => b.id)));
  return {
    scenario,
    label: scenarioLabel(scenario),
    sources: sourcesInService(study, scenario),
    parts,
    deEnergised: study.buses.filter((b) => !energised.has(b.id)).map((b) => b.id),
  };
}

// Accepts every scenario's results; one finding per distinct reading, listing where it holds.
function mergedFindings(results: ScenarioResult[]): Finding[] {
  const byReading = new Map<string, Finding>();
  const idsUsed = new Map<string, number>();
  for (const result of results)
    for (const part of result.parts)
      for (const finding of part.findings) {
        const reading = `${finding.id}\n${finding.severity}\n${finding.title}\n${finding.explanation}`;
        const known = byReading.get(reading);
        if (known) {
          if (!known.scenarios!.includes(result.label)) known.scenarios!.push(result.label);
          continue;
        }
        // A second reading of the same finding keeps its own id, marked with its scenario.
        const seen = idsUsed.get(finding.id) ?? 0;
        idsUsed.set(finding.id, seen + 1);
        const id = seen === 0 ? finding.id : `${finding.id}@${result.scenario.id}`;
        // `Object.assign`, not a spread followed by a new field (which gives each object a hidden class of its own in V8).
        byReading.set(reading, Object.assign({}, finding, { id, scenarios: [result.label] }));
      }
  return [...byReading.values()];
}
