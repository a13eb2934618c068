export {
  findingRows,
  rowOf,
  rangeText,
  worstText,
  summaryText,
  countsText,
  scenarioLabelsOf,
  scenarioCountsOf,
  findingClassesOf,
  classesText,
  SEVERITY_ORDER,
} from './findingsTable.ts';
export type { FindingRow, FindingClasses, ReportedAnalysis } from './findingsTable.ts';
export { markdownReport } from './markdown.ts';
export { csvReport } from './csv.ts';
export { jsonReport } from './json.ts';
