import type { z } from 'zod/mini';
import { InputError, quoteGot } from '../errors.ts';
import { formatIssuePath, issueMessage } from './issueMessage.ts';
import { fieldNamesIn, jsonTextProblem, MAX_NESTING, withoutBom } from './jsonText.ts';
import { NOT_PLAIN, plainReaderOf } from './plainReading.ts';
import { NUMBER_MAGNITUDE } from './fields.ts';
import { createStudySchema, studySchema, type Study } from './schema.ts';
import { structureProblems } from './structure.ts';

/** The 50 Hz schema (times in cycles read at 50 Hz), built once, when the first 50 Hz study is read. */
let studySchema50: typeof studySchema | undefined;

/** One thing wrong with a study file, located by its field path (`study.transformers[1].impedance`). */
export interface StudyProblem {
  path: string;
  message: string;
}

/** What `readStudy` found: the study when it is valid, the document as parsed, and every problem. */
export interface StudyReading {
  /** The parsed study (SI units, defaults filled), only when there is no problem. */
  study?: Study;
  /** The document as written (JSON parsed, before the schema), whenever the text is well-formed JSON. */
  document?: unknown;
  problems: StudyProblem[];
}

/**
 * Reads a study from JSON text or an already-parsed object, the one reader the command line and the
 * workbench share, so both accept exactly the same files. In order: a UTF-8 byte-order mark is
 * dropped; the JSON text is checked in one pass (syntax errors with line:column, a field given twice,
 * absurd nesting); the schema (types, units, physical ranges); then the tree rules (unique ids, every
 * reference resolves, one radial tree from the source: no loops, orphans or bus fed twice). Nothing
 * walks the network before the tree rules pass. Returns every problem found, each as a one-line
 * `path: expected …, got "…"` message.
 *
 * @example const { study, problems } = readStudy(await readFile('demo/selective.json', 'utf8'))
 */
export function readStudy(input: unknown): StudyReading {
  return readStudyParsed(input).reading;
}

/**
 * `readStudy`, also giving the schema's output (`parsed`) whenever the schema accepts the document,
 * whether or not the tree rules then pass: what `readStudyEdit` reuses for the items an edit left alone.
 * With `keepDocument` false, a reading of text whose schema reading succeeds gives no `document` back.
 *
 * @example const { reading, parsed } = readStudyParsed(document)
 */
export function readStudyParsed(input: unknown, keepDocument = true): { reading: StudyReading; parsed?: Study } {
  let raw = input;
  let problem: StudyProblem | undefined;
  if (typeof input === 'string') {
    // The built-in parser reads well-formed text fastest but names no field and keeps the last of a
    // field given twice: the text's own check runs when it fails, when the document walk finds a
    // problem (a text problem comes first), or when the text names more fields than the document holds.
    const text = withoutBom(input);
    let parsed: { value: unknown } | undefined;
    try {
      parsed = { value: JSON.parse(text) };
    } catch {
      parsed = undefined;
    }
    // A sound document (the usual case) is walked once without keeping a path; a problem is then
    // found again by the walk that names it.
    const fields = parsed ? soundFieldCount(parsed.value, 0) : -1;
    if (parsed && fields < 0) problem = problemBelow(parsed.value, 0, []);
    if (!parsed || problem || fields !== fieldNamesIn(text)) {
      const textProblem = jsonTextProblem(text);
      if (textProblem) return { reading: { problems: [textProblem] } };
    }
    // The text check and the built-in parser agree on what is JSON (a property test holds them to it).
    if (!parsed) return { reading: { problems: [{ path: 'study', message: 'expected well-formed JSON text' }] } };
    raw = parsed.value;
    parsed = undefined;
  } else problem = documentProblem(raw);
  if (problem) return { reading: { document: raw, problems: [problem] } };
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    return {
      reading: {
        document: raw,
        problems: [{ path: 'study', message: `expected a JSON object, got ${quoteGot(raw)}` }],
      },
    };
  }
  const schema = studySchemaFor((raw as { frequency?: unknown }).frequency);
  // A sound document is read without zod's bookkeeping; zod reads any other, to name its problems.
  const plain = plainReaderOf(schema)(raw);
  let study: Study;
  if (plain !== NOT_PLAIN) study = plain as Study;
  else {
    const parsed = schema.safeParse(raw, { reportInput: true });
    if (!parsed.success) return { reading: { document: raw, problems: parsed.error.issues.map(describeIssue) } };
    study = parsed.data;
  }
  // Text read for its study alone lets its document go before the tree rules run: a large study's
  // document is larger than its study, and the collector would copy it while they run.
  const document = keepDocument || typeof input !== 'string' ? raw : undefined;
  raw = undefined;
  const problems = structureProblems(study);
  const reading = problems.length > 0 ? { document, problems } : { study, document, problems };
  return { reading, parsed: study };
}

/**
 * The schema a document's `frequency` calls for: the 50 Hz one for `50`, else the 60 Hz one.
 * @example studySchemaFor(50).safeParse(document)
 */
export function studySchemaFor(frequency: unknown): typeof studySchema {
  return frequency === 50 ? (studySchema50 ??= createStudySchema(50)) : studySchema;
}

/**
 * A number outside `NUMBER_MAGNITUDE`, or an object nested deeper than `MAX_NESTING`, in document
 * order of discovery. The walk recurses at most `MAX_NESTING` levels (a cycle ends there) and keeps
 * one path, extended and shortened as it goes, so a good document costs no allocation.
 */
function documentProblem(input: unknown): StudyProblem | undefined {
  return problemBelow(input, 0, []);
}

/**
 * `documentProblem` of a part of a document: the value at `path` (object keys and array indexes from
 * the top), walked as the whole document's walk would reach it, problems named by their full path.
 *
 * @example documentProblemAt(device, ['devices', 3]) // the first number out of range in devices[3]
 */
export function documentProblemAt(value: unknown, path: readonly PropertyKey[]): StudyProblem | undefined {
  return problemBelow(value, path.length, [...path]);
}

/**
 * How many object fields a document parsed from JSON text holds, or -1 if `problemBelow` finds a
 * problem in it: the same walk without a path (JSON text has no holes in its arrays and no inherited
 * fields), for the sound document that is the usual case.
 */
function soundFieldCount(value: unknown, depth: number): number {
  if (typeof value === 'number') {
    const size = Math.abs(value);
    return value === 0 || (size >= NUMBER_MAGNITUDE.smallest && size <= NUMBER_MAGNITUDE.largest) ? 0 : -1;
  }
  if (value === null || typeof value !== 'object') return 0;
  if (depth >= MAX_NESTING) return -1;
  let fields = 0;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const below = soundFieldCount(value[i], depth + 1);
      if (below < 0) return -1;
      fields += below;
    }
    return fields;
  }
  for (const key in value) {
    const below = soundFieldCount((value as Record<string, unknown>)[key], depth + 1);
    if (below < 0) return -1;
    fields += 1 + below;
  }
  return fields;
}

/** The walk of `documentProblem` below `value`, `depth` levels down, `path` naming where it is. */
function problemBelow(value: unknown, depth: number, path: PropertyKey[]): StudyProblem | undefined {
  if (typeof value === 'number') {
    const size = Math.abs(value);
    if (value === 0 || (size >= NUMBER_MAGNITUDE.smallest && size <= NUMBER_MAGNITUDE.largest)) return undefined;
    return {
      path: formatPath(path),
      message: `expected 0 or a number between ${NUMBER_MAGNITUDE.smallest} and ${NUMBER_MAGNITUDE.largest} in size, got ${quoteGot(value)}`,
    };
  }
  if (value === null || typeof value !== 'object') return undefined;
  if (depth >= MAX_NESTING) {
    return { path: formatPath(path), message: `expected at most ${MAX_NESTING} levels of nesting, got more` };
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      if (!(i in value)) continue;
      path.push(i);
      const problem = problemBelow(value[i], depth + 1, path);
      path.pop();
      if (problem) return problem;
    }
    return undefined;
  }
  for (const key in value) {
    if (!Object.hasOwn(value, key)) continue;
    path.push(key);
    const problem = problemBelow((value as Record<string, unknown>)[key], depth + 1, path);
    path.pop();
    if (problem) return problem;
  }
  return undefined;
}

/**
 * Reads a study or throws an `InputError` carrying the first problem (the CLI's exit code 2).
 * @example const study = parseStudy(text)
 */
export function parseStudy(input: unknown): Study {
  const { study, problems } = readStudyParsed(input, false).reading;
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

/** A zod issue as a problem of the study: its path as the user reads it and its one-line message. */
export function describeIssue(issue: z.core.$ZodIssue): StudyProblem {
  return { path: formatPath(issue.path), message: issueMessage(issue) };
}
