import type { z } from 'zod';
import { InputError, quoteGot } from '../errors.ts';
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
  return path.reduce<string>((text, key) => {
    if (typeof key === 'number') return `${text}[${key}]`;
    const name = String(key);
    return /^[A-Za-z_$][\w$]*$/.test(name) ? `${text}.${name}` : `${text}[${JSON.stringify(name)}]`;
  }, 'study');
}

function describeIssue(issue: z.core.$ZodIssue): StudyProblem {
  const path = formatPath(issue.path);
  const input = 'input' in issue ? issue.input : undefined;
  switch (issue.code) {
    case 'custom':
      return { path, message: issue.message };
    case 'invalid_type':
      return {
        path,
        message: `expected ${article(issue.expected)}, got ${input === undefined ? 'nothing' : quoteGot(input)}`,
      };
    case 'invalid_value':
      return {
        path,
        message: `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}, got ${quoteGot(input)}`,
      };
    case 'unrecognized_keys':
      return { path, message: `expected no field ${issue.keys.map((k) => `"${k}"`).join(', ')} here, got one` };
    case 'invalid_key': {
      const nested = issue.issues[0]?.message ?? 'expected a known key';
      return { path, message: `${nested.replace(/, got .*$/, '')}, got ${quoteGot(input)}` };
    }
    case 'invalid_union':
      return { path, message: `expected ${unionExpectation(issue)}, got ${quoteGot(input)}` };
    case 'too_small':
      return {
        path,
        message: `expected ${issue.origin === 'array' ? `at least ${issue.minimum} item(s)` : `a value ${issue.inclusive ? 'of at least' : 'greater than'} ${issue.minimum}`}, got ${quoteGot(input)}`,
      };
    case 'too_big':
      return {
        path,
        message: `expected ${issue.origin === 'array' ? `at most ${issue.maximum} item(s)` : `a value of at most ${issue.maximum}`}, got ${quoteGot(input)}`,
      };
    case 'invalid_format':
      return {
        path,
        message: `${issue.message.startsWith('expected') ? issue.message : `expected ${issue.format}`}, got ${quoteGot(input)}`,
      };
    default:
      return { path, message: `${issue.message}, got ${quoteGot(input)}` };
  }
}

function unionExpectation(issue: z.core.$ZodIssueInvalidUnion): string {
  if ('discriminator' in issue && issue.discriminator) return `a known "${String(issue.discriminator)}"`;
  return 'one of the accepted forms';
}

function article(type: string): string {
  return /^[aeiou]/.test(type) ? `an ${type}` : `a ${type}`;
}
