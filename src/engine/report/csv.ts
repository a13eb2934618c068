import type { Analysis } from '../analysis.ts';
import { CAUTION } from '../caution.ts';
import { findingRows, type FindingRow } from './findingsTable.ts';

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
 * line of headers and a last row carrying the caution, so the caution travels with the data.
 *
 * @example writeFileSync('findings.csv', csvReport(analysis))
 */
export function csvReport(analysis: Analysis): string {
  const rows = findingRows(analysis).map((row) => COLUMNS.map((c) => quote(row[c])).join(','));
  return `${[COLUMNS.join(','), ...rows, `caution,,${quote(CAUTION)},,,,,`].join('\r\n')}\r\n`;
}

/** Quotes a cell when it holds a comma, quote or line break; neutralises a leading formula character. */
function quote(cell: string): string {
  const safe = /^([=+@]|-(?!\d))/.test(cell) ? `'${cell}` : cell;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}
