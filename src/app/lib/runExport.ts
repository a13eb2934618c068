import type { StudyContext } from '../state/context.ts';
import { csvReport, markdownReport, type ReportedAnalysis } from '../../engine/report/index.ts';
import { scenarioLabel } from '../../engine/scenario/index.ts';
import { downloadBlob, downloadText, fileStemOf } from './download.ts';
import { downloadPdf, downloadPdfBytes, downloadPng, downloadSvg, exportPageOf, type ExportKind } from './exports.ts';
import { probesCsv } from './probeCsv.ts';
import { exportRefusalOf } from './problemNotes.ts';

/**
 * Carries out one choice of the Export menu: the current sheet as SVG, PNG or PDF (all from the plot
 * layer's sheet at the figure size, so they match the command line's figure; the PDF on the chosen paper), the findings as
 * Markdown or CSV (the engine's reports, as the command line writes them), the pinned probes as CSV,
 * the study as JSON (as written), or the whole study report as one print-ready HTML page or as a PDF,
 * both on the chosen paper (the same report the command line writes). Throws with a plain message when
 * there is nothing to export yet, or when the study has problems and the export would show the last
 * valid study instead of the one being edited.
 *
 * @example await runExport({ kind: 'pdf', paper: 'a3' }, context)
 */
export async function runExport(request: ExportKind, context: StudyContext): Promise<void> {
  const { study, sheet } = context;
  const kind = typeof request === 'string' ? request : request.kind;
  const refusal = exportRefusalFor(request, context);
  if (refusal) throw new Error(refusal);
  const stem = fileStemOf(study.document.name);
  const view = study.view?.id ?? 'sheet';
  switch (kind) {
    case 'svg':
      return downloadSvg(`${stem}-${view}.svg`, sheet.figureSvg());
    case 'png':
      return downloadPng(`${stem}-${view}.png`, sheet.figureSvg());
    case 'pdf':
      return downloadPdf(`${stem}-${view}.pdf`, sheet.figureSheet(), exportPageOf(request));
    case 'findings-md':
      return downloadText(`${stem}-findings.md`, markdownReport(findingsAnalysisOf(context)), 'text/markdown');
    case 'findings-csv':
      return downloadText(`${stem}-findings.csv`, csvReport(findingsAnalysisOf(context)), 'text/csv');
    case 'probes-csv':
      if (sheet.pinned.length === 0) throw new Error('no probes are pinned: click the sheet to pin one');
      return downloadText(`${stem}-${view}-probes.csv`, probesCsv(sheet.pinned), 'text/csv');
    case 'study-json':
      return downloadText(`${stem}.json`, `${JSON.stringify(study.document, null, 2)}\n`, 'application/json');
    case 'report-html':
    case 'report-pdf': {
      // Written in the report's worker from the study as it is now, as the command line writes it.
      const format = kind === 'report-pdf' ? 'pdf' : 'html';
      const { bytes } = await context.reports.answer(study.study!, {
        kind: 'report',
        format,
        page: exportPageOf(request),
      });
      if (format === 'pdf') return downloadPdfBytes(`${stem}-report.pdf`, bytes);
      return downloadBlob(
        `${stem}-report.html`,
        new Blob([bytes as Uint8Array<ArrayBuffer>], { type: 'text/html;charset=utf-8' }),
      );
    }
  }
}

/** The exports written from the checks' findings, which wait for them rather than leave them out (a report works its own out). */
const FROM_FINDINGS = new Set<string>(['findings-md', 'findings-csv']);

/**
 * Why an export cannot be made now, in the words `runExport` throws with, or undefined: the study has
 * problems and the export would show the last valid study, or it needs the checks' findings and they
 * are still running. Asked before a long export says it is under way.
 * @example exportRefusalFor('findings-md', context) // 'the checks are still running: …' while they run
 */
export function exportRefusalFor(request: ExportKind, { study, analysis }: StudyContext): string | undefined {
  const kind = typeof request === 'string' ? request : request.kind;
  const refusal = exportRefusalOf(kind, study.problems);
  if (refusal) return refusal;
  if (FROM_FINDINGS.has(kind) && (!analysis.analysis || analysis.pending)) return STILL_RUNNING;
  return undefined;
}

const STILL_RUNNING = 'the checks are still running: export the findings in a moment';

// The analysis with the checks' findings.
/**
 * The analysis the findings files are written from, once the checks are done: for a switched study its
 * findings of every scenario with the scenarios named (throws while the checks run).
 * @example markdownReport(findingsAnalysisOf(context))
 */
export function findingsAnalysisOf({ analysis, study }: Pick<StudyContext, 'analysis' | 'study'>): ReportedAnalysis {
  if (!analysis.analysis || analysis.pending) throw new Error(STILL_RUNNING);
  // The findings of a switched study are of every scenario: the files name the scenarios and say where
  // each finding holds, as the command line's do, whichever scenario the screen shows.
  if (study.scenarios.length === 0) return analysis.analysis;
  const scenarios = study.scenarios.map((scenario) => ({ scenario, label: scenarioLabel(scenario) }));
  return { ...analysis.analysis, scenarios };
}
