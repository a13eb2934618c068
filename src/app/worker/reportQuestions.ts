import { analyseScenarios } from '../../engine/scenario/index.ts';
import type { Study } from '../../engine/study/index.ts';
import { htmlOfReport } from '../../report/reportHtml.ts';
import { pdfOfReport } from '../../report/reportPdf.ts';
import { studyReportOf } from '../../report/studyReport.ts';
import type { ExportPage } from '../lib/exports.ts';
import { loadPdfFonts } from '../lib/pdfFonts.ts';

/** The study report as one print-ready HTML page or as a PDF, on a paper and orientation. */
export interface ReportQuestion {
  kind: 'report';
  format: 'html' | 'pdf';
  page: ExportPage;
}

/**
 * The report written, as the file's bytes: the HTML page as UTF-8 (bytes move to the page without a
 * copy, where a 2,000-device study's 17 MB of text, copied across, held it for a third of a second).
 */
export interface ReportAnswer {
  kind: 'report';
  format: ReportQuestion['format'];
  bytes: Uint8Array;
}

/**
 * Writes the study report the command line writes of the same study (`discern report`): every
 * check, and every scenario's own results for a study that can be switched. The PDF embeds the
 * DejaVu Sans face shipped with the workbench.
 *
 * @example await reportOf(study, { kind: 'report', format: 'pdf', page: { paper: 'letter', orientation: 'portrait' } })
 */
export async function reportOf(study: Study, question: ReportQuestion): Promise<ReportAnswer> {
  const { format, page } = question;
  const report = studyReportOf(analyseScenarios(study));
  const bytes =
    format === 'html'
      ? new TextEncoder().encode(htmlOfReport(report, page))
      : await pdfOfReport(report, page, { fonts: await loadPdfFonts() });
  return { kind: 'report', format, bytes };
}
