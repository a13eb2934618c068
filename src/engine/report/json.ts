import type { Analysis } from '../analysis.ts';
import { CAUTION } from '../caution.ts';

/**
 * The analysis as JSON-ready data: findings, pairs with their intervals, and fault levels per bus.
 * JSON has no infinity, so an infinite time (a device that never operates there) is written `null`.
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
  });
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
