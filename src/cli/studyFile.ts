import { expectedGot, InputError } from '../engine/errors.ts';
import { jsonTextProblem, withoutBom } from '../engine/study/jsonText.ts';
import { parseStudy, type Study } from '../engine/study/index.ts';
import type { CommandIO } from './command.ts';

/**
 * Reads and validates a study file for a verb; throws `InputError` with the file's first problem
 * (`study.transformers[1].impedance: expected …`), which the dispatcher prints as one line, exit 2.
 *
 * @example const study = loadStudyFile('demo/harrowmere-selective.json', io)
 */
export function loadStudyFile(path: string | undefined, io: CommandIO, verb: string): Study {
  if (path === undefined) throw new InputError(verb, expectedGot('a study file', undefined));
  let text: string;
  try {
    text = io.readText(path);
  } catch (error) {
    // Text that is not UTF-8, or a file too large, says so; any other failure is the file's.
    if (error instanceof InputError) throw error;
    throw new InputError(path, expectedGot('a readable study file', path));
  }
  return parseStudy(text);
}

/**
 * Reads a JSON file by the same rules as a study (a byte-order mark dropped, syntax errors and
 * repeated fields on one line naming the field path under `base`, with line:column) and returns the
 * document. For verbs that read a file before knowing whether it is a study or a device.
 *
 * @example const document = readJsonFile('device.json', io.readText, 'device')
 */
export function readJsonFile(
  path: string,
  readText: CommandIO['readText'],
  base: string,
  expected = 'a readable file',
): unknown {
  let text: string;
  try {
    text = withoutBom(readText(path));
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw new InputError(path, expectedGot(expected, path));
  }
  const problem = jsonTextProblem(text, /^\s*\{\s*"discern"/.test(text) ? 'study' : base);
  if (problem) throw new InputError(problem.path, problem.message);
  return JSON.parse(text);
}
