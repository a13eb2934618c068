import type { Analysis } from '../analysis.ts';
import { CAUTION } from '../caution.ts';
import { scenarioCountsOf } from './findingsTable.ts';

/**
 * The analysis as JSON-ready data: findings, pairs with their intervals, and fault levels per bus.
 * JSON has no infinity, so an infinite time (a device that never operates there) is written `null`.
 * For a study with scenarios the top-level pairs and fault levels are those of the first scenario's
 * first tree (what one sheet draws), each finding lists its `scenarios`, and `scenarios` holds every
 * analysed scenario: its sources, de-energised buses, the fault levels at every energised bus (each
 * with the `source` feeding it), every pair and the counts of the findings holding in it.
 *
 * @example JSON.stringify(jsonReport(analysis), null, 2)
 */
export function jsonReport(analysis: Analysis): unknown {
  const { study, faults } = analysis;
  return finite({
    study: study.name,
    caution: CAUTION,
    counts: analysis.counts,
    findings: analysis.findings,
    pairs: analysis.pairs,
    faults: [...faults.buses.values()].map(({ busId, volts, max, min }) => ({ busId, volts, max, min })),
    ...(analysis.scenarios ? { scenarios: scenariosJson(analysis) } : {}),
  });
}

// Accepts an analysis with scenarios; each scenario's own fault levels, pairs and counts.
function scenariosJson(analysis: Analysis) {
  const countsOf = new Map(scenarioCountsOf(analysis).map((s) => [s.label, s.counts]));
  return (analysis.scenarios ?? []).map(({ scenario, label, sources, parts, deEnergised }) => ({
    id: scenario.id,
    name: label,
    sources,
    deEnergised,
    faults: parts.flatMap((part) =>
      [...part.faults.buses.values()].map(({ busId, volts, max, min }) => ({
        busId,
        source: part.study.source.id,
        volts,
        max,
        min,
      })),
    ),
    pairs: parts.flatMap((part) => part.pairs),
    counts: countsOf.get(label),
  }));
}

/** Deep copy with ±Infinity and NaN replaced by null. */
function finite(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (Array.isArray(value)) return value.map(finite);
  if (value instanceof Map) return Object.fromEntries([...value].map(([k, v]) => [k, finite(v)]));
  if (value && typeof value === 'object')
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, finite(v)]));
  return value;
}
