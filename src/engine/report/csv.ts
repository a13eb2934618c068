import { CAUTION } from '../caution.ts';
import { findingRows, type FindingRow, type ReportedAnalysis } from './findingsTable.ts';

const COLUMNS: (keyof FindingRow)[] = [
  'severity',
  'kind',
  'title',
  'range',
  'worst',
  'explanation',
  'suggestion',
  'basis',
];

/**
 * The findings as CSV (RFC 4180 quoting), one row per finding, failures first; a first comment-free
 * line of headers and a last row carrying the caution, so the caution travels with the data. A study
 * with scenarios gets a last column, `scenarios`, listing where each finding holds ("Normal; On generator").
 *
 * @example writeFileSync('findings.csv', csvReport(analysis))
 */
export function csvReport(analysis: ReportedAnalysis): string {
  const columns: (keyof FindingRow)[] = analysis.scenarios ? [...COLUMNS, 'scenarios'] : COLUMNS;
  const rows = findingRows(analysis).map((row) => columns.map((c) => quote(row[c])).join(','));
  const caution = ['caution', '', quote(CAUTION), ...columns.slice(3).map(() => '')].join(',');
  return `${[columns.join(','), ...rows, caution].join('\r\n')}\r\n`;
}

/**
 * One CSV cell, safe to open in a spreadsheet: a cell starting with `=`, `+`, `-`, `@`, a tab or a
 * carriage return gets a leading apostrophe so it is read as text, never as a formula (OWASP "CSV
 * Injection"), including "-1+2"; only a cell that is wholly a plain number ("-0.25") is left as it
 * is. Then quoted when it holds a comma, quote or line break (RFC 4180).
 *
 * @example csvCell('=HYPERLINK("x")') // '"\'=HYPERLINK(""x"")"'
 * @example csvCell('-0.25') // '-0.25'
 */
export function csvCell(cell: string): string {
  const safe = FORMULA_START.test(cell) && !PLAIN_NUMBER.test(cell) ? `'${cell}` : cell;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

const quote = csvCell;
