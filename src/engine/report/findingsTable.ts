import type { Analysis } from '../analysis.ts';
import type { ScenarioResult } from '../scenario/scenarioAnalysis.ts';
import type { Finding, Severity } from '../checks/finding.ts';
import { formatAmps, formatVolts, significant } from '../quantity/format.ts';

/**
 * What the findings tables read of an analysis: its findings and counts, and, for a switched study, the
 * scenarios analysed by name (the workbench names them without each one's trees).
 */
export type ReportedAnalysis = Omit<Analysis, 'scenarios'> & {
  scenarios?: Pick<ScenarioResult, 'scenario' | 'label'>[];
};

/** One row of the findings table, as plain text cells (shared by the CLI, Markdown and CSV). */
export interface FindingRow {
  severity: string;
  kind: string;
  title: string;
  /** "9.8 kA–14.9 kA @ 480 V" or "" */
  range: string;
  /** "−0.03 s at 12 kA" or "" */
  worst: string;
  explanation: string;
  suggestion: string;
  basis: string;
  /** Every scenario the finding holds in, "Normal; On generator", or "" for a study without scenarios. */
  scenarios: string;
  /**
   * The scenarios the finding holds in when that is not every scenario analysed ("On generator"),
   * else "": what a table marks beside the title.
   */
  onlyIn: string;
}

/** Severity order for sorting and summaries: failures first. */
export const SEVERITY_ORDER = { fail: 0, warning: 1, info: 2, ok: 3 } as const;

/**
 * The findings of an analysis as rows, failures first (stable within a severity), so every report
 * format reads the same.
 *
 * @example findingRows(analysis).filter((row) => row.severity === 'fail')
 */
export function findingRows(analysis: ReportedAnalysis): FindingRow[] {
  const analysed = scenarioLabelsOf(analysis);
  return [...analysis.findings]
    .map((finding, index) => ({ finding, index }))
    .sort((a, b) => SEVERITY_ORDER[a.finding.severity] - SEVERITY_ORDER[b.finding.severity] || a.index - b.index)
    .map(({ finding }) => rowOf(finding, analysed));
}

/**
 * A finding as table cells. `analysed` lists the labels of the scenarios analysed (none for a
 * study without scenarios), so `onlyIn` can say when the finding holds in only some of them.
 */
export function rowOf(finding: Finding, analysed: readonly string[] = []): FindingRow {
  const where = finding.scenarios ?? [];
  return {
    severity: finding.severity,
    kind: finding.kind,
    title: finding.title,
    range: rangeText(finding),
    worst: worstText(finding),
    explanation: finding.explanation,
    suggestion: finding.suggestion ?? '',
    basis: finding.basis ?? '',
    scenarios: where.join('; '),
    onlyIn: where.length > 0 && analysed.some((label) => !where.includes(label)) ? where.join('; ') : '',
  };
}

/** The labels of the scenarios an analysis covers, in order; [] for a study without scenarios. */
export function scenarioLabelsOf(analysis: ReportedAnalysis): string[] {
  return analysis.scenarios?.map((s) => s.label) ?? [];
}

/**
 * How many findings of each severity hold in each analysed scenario (a finding holding in two
 * scenarios counts in both); [] for a study without scenarios.
 *
 * @example scenarioCountsOf(analysis)[1] // { label: 'On generator', counts: { ok: 20, info: 1, warning: 1, fail: 2 } }
 */
export function scenarioCountsOf(analysis: ReportedAnalysis): { label: string; counts: Record<Severity, number> }[] {
  return scenarioLabelsOf(analysis).map((label) => {
    const counts: Record<Severity, number> = { ok: 0, info: 0, warning: 0, fail: 0 };
    for (const finding of analysis.findings) if (finding.scenarios?.includes(label)) counts[finding.severity]++;
    return { label, counts };
  });
}

/** "A–B @ V" on the finding's reference voltage, a single current when the range is a point. */
export function rangeText(finding: Finding): string {
  const range = finding.range;
  if (!range) return '';
  const at = `@ ${formatVolts(finding.referenceVolts)}`;
  if (range.toAmps <= range.fromAmps * (1 + 1e-9)) return `${formatAmps(range.fromAmps, 3)} ${at}`;
  return `${formatAmps(range.fromAmps, 3)}–${formatAmps(range.toAmps, 3)} ${at}`;
}

/** "margin −0.03 s at 12 kA" (negative inside an overlap). */
export function worstText(finding: Finding): string {
  const worst = finding.worst;
  if (!worst) return '';
  const margin =
    worst.marginSeconds === Infinity
      ? 'no operation'
      : worst.marginSeconds === -Infinity
        ? 'never clears'
        : // A margin of a microsecond or less is an interval edge's rounding, not a margin: it reads 0.
          `${significant(Math.abs(worst.marginSeconds) < 1e-6 ? 0 : worst.marginSeconds, 3)} s`;
  return `${margin} at ${formatAmps(worst.amps, 3)}`;
}

/** "3 fail, 2 warning, 1 info, 14 ok" */
export function summaryText(analysis: ReportedAnalysis): string {
  return countsText(analysis.counts);
}

/** "3 fail, 2 warning, 1 info, 14 ok" from counts by severity. */
export function countsText(counts: Record<Severity, number>): string {
  return `${counts.fail} fail, ${counts.warning} warning, ${counts.info} info, ${counts.ok} ok`;
}

/** Findings counted by class, for a review script: failures, the two kinds of doubtful interval, other warnings, advice, passes. */
export interface FindingClasses {
  fail: number;
  /** Coordination intervals selective by less than the thin-margin allowance. */
  thinMargin: number;
  /** Coordination intervals where both devices act within the half-cycle: curves cannot prove the order. */
  notProvable: number;
  /** Every other warning. */
  warning: number;
  info: number;
  ok: number;
}

/**
 * Counts an analysis's findings by class: `fail`, thin margin, not provable from curves, other
 * warnings, info and ok (each finding in exactly one class).
 *
 * @example findingClassesOf(analysis).thinMargin // 3
 */
export function findingClassesOf(analysis: ReportedAnalysis): FindingClasses {
  const classes: FindingClasses = { fail: 0, thinMargin: 0, notProvable: 0, warning: 0, info: 0, ok: 0 };
  for (const finding of analysis.findings) {
    if (finding.severity === 'warning' && finding.status === 'thin margin') classes.thinMargin++;
    else if (finding.severity === 'warning' && finding.status === 'not provable from curves') classes.notProvable++;
    else classes[finding.severity]++;
  }
  return classes;
}

/** "counts: 2 fail, 3 thin margin, 1 not provable, 4 warning, 1 info, 30 ok" — one line a review script can read. */
export function classesText(classes: FindingClasses): string {
  const { fail, thinMargin, notProvable, warning, info, ok } = classes;
  return `counts: ${fail} fail, ${thinMargin} thin margin, ${notProvable} not provable, ${warning} warning, ${info} info, ${ok} ok`;
}
