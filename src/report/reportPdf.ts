import { pdfOfPages, type PdfOptions } from '../plot/pdf.ts';
import { reportPagesOf, type PageSetup } from './reportPages.ts';
import type { StudyReport } from './studyReport.ts';

/**
 * Prints the report to PDF on the chosen paper: the pages of `reportPagesOf`, each page's own text and
 * figure, DejaVu Sans embedded (so Ω, ≥, ≤, ×, −, √, °, Δ and φ print), the report's title in the
 * document's properties, the creation date from `options.date`, else the report's own date (the study's),
 * so the same study and date give the same bytes.
 * @example writeFileSync('study.pdf', await pdfOfReport(report, { paper: 'letter', orientation: 'portrait' }))
 */
export async function pdfOfReport(
  report: StudyReport,
  setup: PageSetup,
  options: Pick<PdfOptions, 'date' | 'fonts'> = {},
): Promise<Uint8Array> {
  const pages = reportPagesOf(report, setup).map((page) => [
    { items: page.drawing.layers.flatMap((layer) => layer.items) },
    ...(page.figure ? [page.figure] : []),
  ]);
  // The creation date: the one asked for, else the report's own date where it is a calendar date.
  const date = options.date ?? calendarDateOf(report.details.find(([label]) => label === 'Date')?.[1]);
  return pdfOfPages(pages, { ...setup, ...options, date, margin: 0, title: report.title });
}

// Accepts the date printed on a report; it when it is a date the calendar has, written YYYY-MM-DD.
function calendarDateOf(text: string | undefined): string | undefined {
  if (!text || !/^\d{4}-\d{2}-\d{2}$/.test(text)) return undefined;
  const time = Date.parse(`${text}T00:00:00Z`);
  return !Number.isNaN(time) && new Date(time).toISOString().startsWith(text) ? text : undefined;
}
