import type { z } from 'zod';
import { InputError, quoteGot } from '../errors.ts';
import { formatIssuePath, issueMessage } from './issueMessage.ts';
import { createStudySchema, studySchema, type Study } from './schema.ts';

/** The 50 Hz schema (times in cycles read at 50 Hz), built once like the 60 Hz `studySchema`. */
const STUDY_SCHEMA_50 = createStudySchema(50);
import { structureProblems } from './structure.ts';

/** One thing wrong with a study file, located by its field path (`study.transformers[1].impedance`). */
export interface StudyProblem {
  path: string;
  message: string;
}

/**
 * Reads a study from JSON text or an already-parsed object: schema first, then the tree rules
 * (one source, every bus reached once, winding voltages matching their buses, unique ids).
 * Returns every problem found, each as a one-line `path: expected …, got "…"` message.
 *
 * @example const { study, problems } = readStudy(await readFile('demo/selective.json', 'utf8'))
 */
export function readStudy(input: unknown): { study?: Study; problems: StudyProblem[] } {
  let raw = input;
  if (typeof input === 'string') {
    try {
      raw = JSON.parse(input);
    } catch (error) {
      return {
        problems: [{ path: 'study', message: `expected JSON text, got a syntax error (${(error as Error).message})` }],
      };
    }
  }
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    return { problems: [{ path: 'study', message: `expected a JSON object, got ${quoteGot(raw)}` }] };
  }
  const frequency = (raw as { frequency?: unknown }).frequency;
  const schema = frequency === 50 ? STUDY_SCHEMA_50 : studySchema;
  const parsed = schema.safeParse(raw, { reportInput: true });
  if (!parsed.success) return { problems: parsed.error.issues.map(describeIssue) };
  const problems = structureProblems(parsed.data);
  return problems.length > 0 ? { problems } : { study: parsed.data, problems };
}

/**
 * Reads a study or throws an `InputError` carrying the first problem (the CLI's exit code 2).
 * @example const study = parseStudy(text)
 */
export function parseStudy(input: unknown): Study {
  const { study, problems } = readStudy(input);
  if (!study) throw new InputError(problems[0].path, problems[0].message);
  return study;
}

/** `path: message`, the one-line form every error takes. */
export function formatProblem(problem: StudyProblem): string {
  return `${problem.path}: ${problem.message}`;
}

/** Renders a zod path as the user reads it: `study.devices[2].characteristic.kind`. */
export function formatPath(path: readonly PropertyKey[]): string {
  return formatIssuePath('study', path);
}

function describeIssue(issue: z.core.$ZodIssue): StudyProblem {
  return { path: formatPath(issue.path), message: issueMessage(issue) };
}
