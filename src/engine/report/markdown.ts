import type { Analysis } from '../analysis.ts';
import { CAUTION } from '../caution.ts';
import { classesText, findingClassesOf, findingRows, summaryText } from './findingsTable.ts';

/**
 * The findings report as Markdown: title block, caution, summary, a table of every finding (failures
 * first), then each non-passing finding written out with its explanation and suggestion.
 *
 * @example writeFileSync('report.md', markdownReport(analysis))
 */
export function markdownReport(analysis: Analysis): string {
  const { study } = analysis;
  const rows = findingRows(analysis);
  const lines = [
    `# Coordination findings — ${escapeCell(study.name)}`,
    '',
    ...(study.preparedBy ? [`Prepared by: ${escapeCell(study.preparedBy)}  `] : []),
    ...(study.date ? [`Date: ${escapeCell(study.date)}  `] : []),
    `NFPA 70 edition checked: ${study.coordination.edition}`,
    '',
    `> ${CAUTION}`,
    '',
    `**Summary:** ${summaryText(analysis)}.`,
    '',
    `\`${classesText(findingClassesOf(analysis))}\``,
    '',
    '| severity | check | finding | current range | worst margin |',
    '| --- | --- | --- | --- | --- |',
    ...rows.map((r) => `| ${r.severity} | ${r.kind} | ${escapeCell(r.title)} | ${r.range} | ${r.worst} |`),
    '',
    '## Details',
    '',
  ];
  for (const row of rows.filter((r) => r.severity !== 'ok')) {
    lines.push(`### ${row.severity}: ${escapeCell(row.title)}`, '', escapeCell(row.explanation), '');
    if (row.suggestion) lines.push(`*Suggested direction:* ${escapeCell(row.suggestion)}`, '');
    if (row.basis) lines.push(`*Basis:* ${escapeCell(row.basis)}`, '');
  }
  return `${lines.join('\n').trimEnd()}\n`;
}

/** Keeps user text from breaking the table or adding markup: pipes escaped, angle brackets as entities. */
function escapeCell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/\r?\n/g, ' ');
}
