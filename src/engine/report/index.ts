export { findingRows, rowOf, rangeText, worstText, summaryText, SEVERITY_ORDER } from './findingsTable.ts';
export type { FindingRow } from './findingsTable.ts';
export { markdownReport } from './markdown.ts';
export { csvReport } from './csv.ts';
export { jsonReport } from './json.ts';
