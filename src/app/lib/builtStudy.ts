import {
  readEditableStudy,
  readStudyEdit,
  type EditableReading,
  type Study,
  type StudyInput,
  type StudyProblem,
  type StudyReading,
} from '../../engine/study/index.ts';
import { networkOf, type Network } from '../../engine/network/index.ts';
import { faultLevelsOf, type FaultLevels } from '../../engine/fault/index.ts';
import { bandsOf } from './lookups.ts';
import { systemRowsOf } from './systemTree.ts';

/** A document as the engine reads it: the study when it is valid, the document as parsed, and every problem. */
export type { StudyReading, EditableReading };

/** A document read and built all the way before it is shown: its reading, its radial tree and its fault levels. */
export interface BuiltStudy {
  document: StudyInput;
  reading: EditableReading;
  network?: Network;
  /** The fault levels of `network`, worked out to build it whole: the workbench shows these. */
  faults?: FaultLevels;
}

/** The outcome of {@link builtStudyOf}: the built study, or why there is none. */
export type BuildOutcome =
  | { ok: true; value: BuiltStudy }
  | {
      ok: false;
      problems: StudyProblem[];
      /** True when building stopped with an error (as opposed to the study having problems). */
      failed: boolean;
    };

/**
 * Reads a document with the engine's `readStudy`, turning any error the reader throws into a
 * problem of the whole study, so an edit or a file can never stop the workbench.
 *
 * @example readingOf({ discern: 1 }).problems[0].path // 'study.name'
 */
export function readingOf(document: unknown): EditableReading {
  try {
    return readEditableStudy(document);
  } catch (error) {
    return { problems: [stopped('read', error)] };
  }
}

/**
 * Reads an edited document with the engine's `readStudyEdit`, reusing what `previous` (the reading
 * of the document before the edit) parsed for everything the edit left alone; the whole reading when
 * there is no previous one. Like `readingOf`, it never throws.
 *
 * @example reading = editedReadingOf(reading, withValueAt(document, ['devices', 0, 'rating'], '800 A'))
 */
export function editedReadingOf(previous: EditableReading | undefined, document: unknown): EditableReading {
  if (!previous) return readingOf(document);
  try {
    return readStudyEdit(previous, document);
  } catch (error) {
    return { problems: [stopped('read', error)] };
  }
}

/** The radial tree of a valid study, or `undefined` if building it throws. */
export function networkOrUndefined(study: Study): Network | undefined {
  try {
    return networkOf(study);
  } catch {
    return undefined;
  }
}

/**
 * The document in a study file's text (a leading byte-order mark allowed), or `undefined` when
 * the text is not a JSON object (`readStudy` then says why).
 *
 * @example documentOfText('{"discern":1}') // { discern: 1 }
 */
export function documentOfText(text: string): StudyInput | undefined {
  try {
    const value: unknown = JSON.parse(text.replace(/^\uFEFF/, ''));
    return value !== null && typeof value === 'object' && !Array.isArray(value) ? (value as StudyInput) : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Builds everything the workbench shows of a study before any of it is shown: the reading, the
 * radial tree, the System tree's rows, the fault levels and every band. Loading swaps the new study
 * in only when all of these succeed, so the screen never mixes two studies.
 *
 * @example const built = builtStudyOf(document); if (built.ok) show(built.value); else refuse(built.problems)
 */
export function builtStudyOf(input: unknown): BuildOutcome {
  const reading = readingOf(input);
  const study = reading.study;
  if (!study)
    return { ok: false, problems: reading.problems, failed: reading.problems[0]?.message.startsWith(STOP) === true };
  // From text, the document as the reader parsed it (byte-order mark and all handled once, there).
  const document = (typeof input === 'string' ? reading.document : input) as StudyInput;
  try {
    const network = networkOf(study);
    systemRowsOf(network);
    const faults = faultLevelsOf(network);
    bandsOf(study);
    return { ok: true, value: { document, reading, network, faults } };
  } catch (error) {
    return { ok: false, problems: [stopped('build', error)], failed: true };
  }
}

const STOP = 'expected a study the workbench can';

/** One line naming the whole study, for an error thrown while reading or building it. */
function stopped(stage: 'read' | 'build', error: unknown): StudyProblem {
  const reason = String((error as Error)?.message ?? error)
    .replace(/\s+/g, ' ')
    .slice(0, 200);
  return { path: 'study', message: `${STOP} ${stage}, got one that stopped it (${reason})` };
}
