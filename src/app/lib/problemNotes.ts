import type { StudyProblem } from '../../engine/study/index.ts';
import type { ExportFormat } from './exports.ts';

/**
 * Names a study's problems in a few words: how many, and the field of the first, as the problems bar
 * shows it. Empty when there are none.
 *
 * @example problemsNamed([{ path: 'study.devices[0].rating', message: '…' }]) // '1 problem (study.devices[0].rating)'
 */
export function problemsNamed(problems: readonly StudyProblem[]): string {
  if (problems.length === 0) return '';
  if (problems.length === 1) return `1 problem (${problems[0].path})`;
  return `${problems.length} problems (the first at ${problems[0].path})`;
}

/**
 * The question asked before a study with problems is written to a file, or undefined when it has none.
 * Saving still writes what was typed, so no work is lost, but the workbench refuses such a file when it
 * is opened, so the user is told so and the study stays marked unsaved.
 *
 * @example saveQuestionOf(study.problems) // 'The study has 1 problem (…). Save it anyway? …'
 */
export function saveQuestionOf(problems: readonly StudyProblem[]): string | undefined {
  if (problems.length === 0) return undefined;
  return (
    `The study has ${problemsNamed(problems)}. Save it anyway? ` +
    'The file will not open until it is fixed, and the study stays marked unsaved.'
  );
}

// Exports drawn from the parsed study, which while the document has problems is the last valid one.
const FROM_PARSED_STUDY: ReadonlySet<ExportFormat> = new Set([
  'svg',
  'png',
  'pdf',
  'findings-md',
  'findings-csv',
  'probes-csv',
  'report-html',
  'report-pdf',
]);

/**
 * Why an export is refused while the study has problems, or undefined when it may go ahead. Every export
 * but the study file itself reads the parsed study, which then is the last valid one and not what is
 * on screen in the editor; the study file is written as typed (its own question, `saveQuestionOf`).
 *
 * @example exportRefusalOf('report-pdf', study.problems) // 'fix the 1 problem (…) before exporting: …'
 */
export function exportRefusalOf(kind: ExportFormat, problems: readonly StudyProblem[]): string | undefined {
  if (problems.length === 0 || !FROM_PARSED_STUDY.has(kind)) return undefined;
  return `fix the ${problemsNamed(problems)} before exporting: the export would show the last valid study`;
}
