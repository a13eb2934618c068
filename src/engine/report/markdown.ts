import { CAUTION } from '../caution.ts';
import {
  classesText,
  countsText,
  findingClassesOf,
  findingRows,
  scenarioCountsOf,
  summaryText,
  type ReportedAnalysis,
} from './findingsTable.ts';

/**
 * The findings report as Markdown: title block, caution, summary, a table of every finding (failures
 * first), then each non-passing finding written out with its explanation and suggestion.
 *
 * @example writeFileSync('report.md', markdownReport(analysis))
 */
export function markdownReport(analysis: ReportedAnalysis): string {
  const { study } = analysis;
  const rows = findingRows(analysis);
  // A study with scenarios gets a line naming them and a column saying where each finding holds.
  const switched = analysis.scenarios !== undefined;
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
    ...(switched ? [scenariosLine(analysis), ''] : []),
    `| severity | check | finding | current range | worst margin |${switched ? ' scenarios |' : ''}`,
    `| --- | --- | --- | --- | --- |${switched ? ' --- |' : ''}`,
    ...rows.map(
      (r) =>
        `| ${r.severity} | ${r.kind} | ${escapeCell(r.title)} | ${r.range} | ${r.worst} |${switched ? ` ${escapeCell(r.scenarios)} |` : ''}`,
    ),
    '',
    '## Details',
    '',
  ];
  for (const row of rows.filter((r) => r.severity !== 'ok')) {
    lines.push(`### ${row.severity}: ${escapeCell(row.title)}`, '', escapeCell(row.explanation), '');
    if (row.onlyIn) lines.push(`*Holds in:* ${escapeCell(row.onlyIn)}`, '');
    if (row.suggestion) lines.push(`*Suggested direction:* ${escapeCell(row.suggestion)}`, '');
    if (row.basis) lines.push(`*Basis:* ${escapeCell(row.basis)}`, '');
  }
  return `${lines.join('\n').trimEnd()}\n`;
}

// Accepts an analysis with scenarios; the line naming each one analysed and its counts.
function scenariosLine(analysis: ReportedAnalysis): string {
  const ids = new Map(analysis.scenarios!.map((s) => [s.label, s.scenario.id]));
  const each = scenarioCountsOf(analysis).map(
    ({ label, counts }) => `${escapeCell(label)} (\`${ids.get(label)}\`): ${countsText(counts)}`,
  );
  return `**Scenarios analysed:** ${each.join('; ')}.`;
}

/**
 * Keeps user text from breaking the table or adding markup: HTML as entities (so no raw HTML and no
 * `<http://…>` autolink), the brackets that open a link or image (`[x](javascript:…)`, `![](http://…)`)
 * and the characters of emphasis, code spans, strikethrough and tables escaped with a backslash, a
 * leading heading, quote or list marker escaped, line breaks and control characters as spaces.
 *
 * @example escapeCell('![x](http://a)') // '!\\[x\\](http://a)'
 */
export function escapeCell(text: string): string {
  return (
    text
      .replace(/&/g, '&amp;')
      .replace(/</g, '&lt;')
      .replace(/>/g, '&gt;')
      // eslint-disable-next-line no-control-regex
      .replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ')
      .replace(/[\\`*_[\]|~]/g, (c) => `\\${c}`)
      // What opens a heading, quote or list only at the start of a line.
      .replace(/^(\s*)([#>+-]|\d+\.)/, '$1\\$2')
  );
}
