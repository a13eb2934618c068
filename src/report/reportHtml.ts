import { pagePoints } from '../plot/pdf.ts';
import { escapeXml, svgOf } from '../plot/svg.ts';
import type { PageSetup } from './reportPages.ts';
import type { StudyReport } from './studyReport.ts';

/**
 * The report as one self-contained HTML page: no scripts, no external files, figures inline as SVG,
 * print styles for the chosen paper and orientation (so the browser's print gives the same pages as
 * the PDF's paper), a linked table of contents, and every piece of study text escaped.
 * @example writeFileSync('study.html', htmlOfReport(studyReportOf(analysis), { paper: 'a4', orientation: 'portrait' }))
 */
export function htmlOfReport(report: StudyReport, setup: PageSetup): string {
  const e = escapeXml;
  const [width, height] = pagePoints(setup.paper, setup.orientation);
  const out = [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`,
    `<title>${e(report.title)}</title>`,
    '<style>',
    `@page { size: ${width}pt ${height}pt; margin: 48pt; }`,
    'body { font-family: "DejaVu Sans", Arial, Helvetica, sans-serif; font-size: 10pt; color: #1a1a1a; max-width: 60em; margin: 2em auto; padding: 0 1em; }',
    'h1 { font-size: 20pt; } h2 { font-size: 15pt; break-before: page; } h3 { font-size: 11pt; }',
    'table { border-collapse: collapse; margin: 0.5em 0; } th, td { border-bottom: 1px solid #d9d9d9; padding: 2px 6px; text-align: left; vertical-align: top; }',
    'td.n { text-align: right; white-space: nowrap; } dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.2em 1em; }',
    'dt { font-weight: bold; color: #4d4d4d; } figure { margin: 1em 0; break-inside: avoid; } figure svg { width: 100%; height: auto; }',
    'pre { font-size: 8pt; white-space: pre-wrap; } .caution { border-left: 3px solid #4d4d4d; padding-left: 0.8em; }',
    '</style>',
    '</head>',
    '<body>',
    `<h1>${e(report.title)}</h1>`,
    '<dl>',
    ...report.details.map(([label, value]) => `<dt>${e(label)}</dt><dd>${e(value)}</dd>`),
    '</dl>',
  ];
  if (report.revisions.length > 0)
    out.push('<h3>Revision log</h3>', tableOf(['revision', 'date', 'by', 'what changed'], report.revisions));
  if (report.notes) out.push('<h3>Notes</h3>', `<p>${e(report.notes)}</p>`);
  out.push(
    '<div class="caution"><h3>Cautions</h3><ul>',
    ...report.cautions.map((c) => `<li>${e(c)}</li>`),
    '</ul></div>',
    '<nav><h3>Contents</h3><ol>',
    ...report.sections.map((s) => `<li><a href="#${e(s.id)}">${e(s.title)}</a></li>`),
    '</ol></nav>',
  );
  report.sections.forEach((section, index) => {
    out.push(`<section id="${e(section.id)}">`, `<h2>${index + 1}. ${e(section.title)}</h2>`);
    for (const block of section.blocks) {
      if (block.type === 'paragraph') out.push(`<p>${e(block.text)}</p>`);
      else if (block.type === 'list') out.push(`<ul>${block.items.map((item) => `<li>${e(item)}</li>`).join('')}</ul>`);
      else if (block.type === 'table') out.push(tableOf(block.columns, block.rows, block.numeric));
      else if (block.type === 'work') out.push(`<h3>${e(block.title)}</h3>`, `<pre>${e(block.text)}</pre>`);
      else out.push('<figure>', svgOf(block.drawing), `<figcaption>${e(block.caption)}</figcaption>`, '</figure>');
    }
    out.push('</section>');
  });
  out.push('</body>', '</html>', '');
  return out.join('\n');
}

// Accepts a header, rows and which columns are numbers; an HTML table with every cell escaped.
function tableOf(columns: string[], rows: string[][], numeric: boolean[] = []): string {
  const head = `<tr>${columns.map((c) => `<th>${escapeXml(c)}</th>`).join('')}</tr>`;
  const body = rows.map(
    (row) =>
      `<tr>${row.map((cell, i) => `<td${numeric[i] ? ' class="n"' : ''}>${escapeXml(cell)}</td>`).join('')}</tr>`,
  );
  return `<table><thead>${head}</thead><tbody>${body.join('')}</tbody></table>`;
}
