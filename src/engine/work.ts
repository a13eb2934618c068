/**
 * One step of a worked calculation (DEVELOPERS.md, names "work"): what is computed, the formula, the formula
 * with the numbers put in, and the result with its unit — enough for a person to follow and check it.
 *
 * @example { label: 'secondary full-load current', formula: 'I = S / (√3 · V)',
 *   substituted: 'I = 1 500 000 / (1.7320508 × 480)', value: 1804.22, unit: 'A' }
 */
export interface WorkStep {
  /** What the step finds, in plain words. */
  label: string;
  /** The formula in the trade's notation. */
  formula: string;
  /** The formula with every number substituted. */
  substituted: string;
  /** The result in `unit`. */
  value: number;
  /** Unit of `value`: 'A', 'V', 'VA', 'Ω', 'pu', 's', '' for a ratio. */
  unit: string;
  /** Where the formula or constant comes from (standard clause, "common practice", "textbook identity"). */
  source?: string;
}

/** A calculation's steps, in the order a person would work them. */
export type Work = WorkStep[];

/**
 * Renders work as plain text, one step per line pair, for the CLI and reports.
 * @example formatWork(result.work)
 */
export function formatWork(work: Work, digits = 6): string {
  return work
    .map((step, i) => {
      const value = Number(step.value.toPrecision(digits));
      const source = step.source ? `   [${step.source}]` : '';
      return `${i + 1}. ${step.label}: ${step.formula}\n   ${step.substituted} = ${value}${step.unit ? ` ${step.unit}` : ''}${source}`;
    })
    .join('\n');
}
