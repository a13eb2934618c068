import { InputError } from '../../src/engine/errors.ts';
import { csvReport, markdownReport } from '../../src/engine/report/index.ts';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { formatProblem, readStudy } from '../../src/engine/study/index.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import { svgOf } from '../../src/plot/svg.ts';
import { viewInputOf } from '../../src/plot/viewInput.ts';

/** What became of one study text: refused with a message, or analysed and drawn. */
export type Outcome =
  { kind: 'refused'; message: string } | { kind: 'analysed'; output: string } | { kind: 'crashed'; message: string };

/** Words that must never stand where a number belongs in anything printed or drawn. */
export const NONSENSE = /\bNaN\b|-?Infinity|\bundefined\b|\bnull\b/;

/**
 * A field path of the study, as a regular expression's source: `study.buses[1].voltage`; a quoted field
 * name may hold a colon (`study.motors[0]["name: "]`, from broken JSON).
 */
export const STUDY_PATH = String.raw`study(?:[.[](?:"[^"\n]*"|[^:\n])*)?`;

/** A one-line message naming a field path of the study: `study.buses[1].voltage: expected …`. */
export const FIELD_MESSAGE = new RegExp(String.raw`^${STUDY_PATH}: expected [^\n]*$`);

/**
 * The words of `nonsense` that a study's own strings hold (a bus named "Infinity"): printed back they
 * are the user's text, not a number gone wrong, so its output is not faulted for them.
 *
 * @example echoedWords('{"name": "Infinity"}') // Set { 'Infinity' }
 */
export function echoedWords(text: string, nonsense = NONSENSE): Set<string> {
  const words = new Set<string>();
  const word = new RegExp(nonsense.source, 'g');
  for (const [, value] of text.matchAll(/"((?:[^"\\]|\\.)*)"/g))
    for (const [found] of value.matchAll(word)) words.add(found);
  return words;
}

/** The first word of `nonsense` in `output` that is not one the study itself holds, or undefined. */
export function firstNonsense(output: string, echoed: Set<string>, nonsense = NONSENSE): RegExpExecArray | undefined {
  for (const match of output.matchAll(new RegExp(nonsense.source, 'g')))
    if (!echoed.has(match[0])) return match as RegExpExecArray;
  return undefined;
}

/**
 * Reads a study text the way every verb does, then, when it is accepted, analyses it (in every scenario
 * when it can be switched), writes the Markdown and CSV reports and, for a study that cannot be
 * switched, draws the first view (geometry and SVG). An `InputError` thrown after
 * loading counts as refused (its message is checked like any other); anything else thrown is a crash.
 *
 * @example outcomeOf(readFileSync('demo/harrowmere-selective.json', 'utf8')).kind // 'analysed'
 */
export function outcomeOf(text: string): Outcome {
  const { study, problems } = readStudy(text);
  if (!study) return { kind: 'refused', message: formatProblem(problems[0]) };
  try {
    const analysis = analyseScenarios(study);
    // A study that can be switched is drawn a scenario at a time (`discern plot --scenario`).
    const view = analysis.scenarios ? undefined : study.views[0];
    const svg = view ? svgOf(sheetOf(viewInputOf(analysis, view.id))) : '';
    return { kind: 'analysed', output: `${markdownReport(analysis)}\n${csvReport(analysis)}\n${svg}` };
  } catch (error) {
    if (error instanceof InputError) return { kind: 'refused', message: error.message };
    return { kind: 'crashed', message: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
  }
}

/** What is wrong with an outcome, if anything (undefined when it is a clean refusal or a clean result). */
export function outcomeProblem(outcome: Outcome, echoed = new Set<string>()): string | undefined {
  if (outcome.kind === 'crashed') return `crashed: ${outcome.message.slice(0, 300)}`;
  if (outcome.kind === 'refused') {
    return FIELD_MESSAGE.test(outcome.message)
      ? undefined
      : `message without a field path: ${outcome.message.slice(0, 300)}`;
  }
  const nonsense = firstNonsense(outcome.output, echoed);
  if (!nonsense) return undefined;
  const around = outcome.output.slice(Math.max(0, nonsense.index - 80), nonsense.index + 40);
  return `"${nonsense[0]}" in the output: …${around}…`;
}
