import type { Finding, Severity } from '../../engine/checks/finding.ts';
import type { PairCheck } from '../../engine/checks/coordination.ts';
import type { Study } from '../../engine/study/index.ts';
import type { AnalysisChanges } from './changes.ts';
import type { StudyDelta } from './studyDelta.ts';

/** Main thread → worker: analyse this parsed study (plain data; `seq` orders the replies). */
export interface AnalyseRequest {
  seq: number;
  study: Study;
}

/**
 * What crosses to the worker: the first study whole, then each next one as its changes from the one
 * before (the worker keeps the last study it was sent).
 */
export type WorkerRequest = AnalyseRequest | { seq: number; delta: StudyDelta };

/**
 * Worker → main thread: the checks' results as plain data, either whole or as the changes since the
 * previous reply (what the worker sends: an edit changes a handful of a large study's findings).
 * Bands hold closures and cannot cross threads, so the main thread builds the bands of the view it draws.
 */
export type AnalyseReply =
  | { seq: number; ok: true; findings: Finding[]; pairs: PairCheck[]; counts: Record<Severity, number> }
  | { seq: number; ok: true; changes: AnalysisChanges }
  | { seq: number; ok: false; message: string };

/**
 * Main thread → a worker answering questions about the study (setting windows and proposals; study
 * reports): the question, with the study whole the first time and then as its changes from the study
 * sent before (the worker keeps the last one).
 */
export type QuestionRequest<Q> = { seq: number; question: Q } & ({ study: Study } | { delta: StudyDelta });

/** Such a worker → main thread: the answer as plain data, or why there is none. */
export type QuestionReply<A> = { seq: number; ok: true; answer: A } | { seq: number; ok: false; message: string };
