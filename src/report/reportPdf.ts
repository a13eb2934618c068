import { pdfOfPages, type PdfOptions } from '../plot/pdf.ts';
import { reportPagesOf, type PageSetup } from './reportPages.ts';
import type { StudyReport } from './studyReport.ts';

/**
 * Prints the report to PDF on the chosen paper: the pages of `reportPagesOf`, each page's own text and
 * figure, DejaVu Sans embedded (so Ω, ≥, ≤, ×, −, √, °, Δ and φ print), the report's title in the
 * document's properties, the creation date from `options.date` so the same study and date give the
 * same bytes.
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
  return pdfOfPages(pages, { ...setup, ...options, margin: 0, title: report.title });
}
