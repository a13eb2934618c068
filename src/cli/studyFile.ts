import { expectedGot, InputError } from '../engine/errors.ts';
import { readStudy, type Study } from '../engine/study/index.ts';
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
  } catch {
    throw new InputError(path, expectedGot('a readable study file', path));
  }
  const { study, problems } = readStudy(text);
  if (!study) throw new InputError(problems[0].path, problems[0].message);
  return study;
}
