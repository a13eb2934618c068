import { svgOf } from '../plot/svg.ts';
import type { StudyReport } from './studyReport.ts';

/** A Markdown report and the SVG figures it links to, each to be written beside it under `name`. */
export interface MarkdownReport {
  text: string;
  figures: { name: string; svg: string }[];
}

/**
 * The report as Markdown: the cover as a details list, a linked table of contents, each section with
 * its tables and lists, figures as SVG files beside the report (named `<stem>-figure-N.svg`), and the
 * worked calculations as code blocks. All study text is escaped so a name cannot add markup or links.
 * @example const { text, figures } = markdownOfReport(studyReportOf(analysis), 'study')
 */
export function markdownOfReport(report: StudyReport, stem: string): MarkdownReport {
  const figures: MarkdownReport['figures'] = [];
  const out = [`# ${escapeMarkdown(report.title)}`, ''];
  for (const [label, value] of report.details) out.push(`**${label}:** ${escapeMarkdown(value)}  `);
  out.push('');
  if (report.revisions.length > 0)
    out.push('## Revision log', '', ...tableOf(['revision', 'date', 'by', 'what changed'], report.revisions), '');
  if (report.notes) out.push('## Notes', '', escapeMarkdown(report.notes), '');
  out.push('## Cautions', '', ...report.cautions.map((caution) => `- ${caution}`), '');
  out.push('## Contents', '', ...report.sections.map((s, i) => `${i + 1}. [${s.title}](#${s.id})`), '');
  report.sections.forEach((section, index) => {
    out.push(`<a id="${section.id}"></a>`, '', `## ${index + 1}. ${section.title}`, '');
    for (const block of section.blocks) {
      if (block.type === 'paragraph') out.push(escapeMarkdown(block.text), '');
      else if (block.type === 'list') out.push(...block.items.map((item) => `- ${escapeMarkdown(item)}`), '');
      else if (block.type === 'table') out.push(...tableOf(block.columns, block.rows), '');
      else if (block.type === 'work')
        out.push(`### ${escapeMarkdown(block.title)}`, '', '```text', block.text.replace(/`/g, "'"), '```', '');
      else {
        const name = `${stem}-figure-${figures.length + 1}.svg`;
        figures.push({ name, svg: svgOf(block.drawing) });
        out.push(
          `![${escapeMarkdown(block.caption)}](${encodeURI(name)})`,
          '',
          `*Figure ${figures.length}: ${escapeMarkdown(block.caption)}*`,
          '',
        );
      }
    }
  });
  return { text: `${out.join('\n').trimEnd()}\n`, figures };
}

/**
 * Escapes text for Markdown: HTML-significant characters as entities, and the punctuation that starts
 * emphasis, links, images, code, tables and headings behind a backslash.
 * @example escapeMarkdown('[x](javascript:1) | *y*') // '\\[x\\](javascript:1) \\| \\*y\\*'
 */
export function escapeMarkdown(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/[\\`*_[\]|!#~]/g, (c) => `\\${c}`)
    .replace(/\r?\n/g, ' ');
}

// Accepts a header and rows; a Markdown table with every cell escaped.
function tableOf(columns: string[], rows: string[][]): string[] {
  return [
    `| ${columns.map(escapeMarkdown).join(' | ')} |`,
    `| ${columns.map(() => '---').join(' | ')} |`,
    ...rows.map((row) => `| ${row.map(escapeMarkdown).join(' | ')} |`),
  ];
}
