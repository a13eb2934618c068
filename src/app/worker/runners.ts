import { AnalysisMemo } from '../../engine/incremental.ts';
import { ChangeTracker } from './changes.ts';
import { checksOf } from './checks.ts';
import type { CheckRunner } from '../state/AnalysisState.svelte.ts';
import type { AnalyseReply, AnalyseRequest, QuestionReply, QuestionRequest, WorkerRequest } from './protocol.ts';
import type { OneLineAnswer, OneLineQuestion } from './oneLineQuestions.ts';
import type { ReportAnswer, ReportQuestion } from './reportQuestions.ts';
import type { SettingsAnswer, SettingsQuestion } from './settingsQuestions.ts';
import { studyDeltaOf, type StudyDelta } from './studyDelta.ts';
import type { Study } from '../../engine/study/index.ts';

/**
 * Runs the checks in a module Web Worker (the browser's way of keeping heavy work off the page). The
 * first study crosses whole, each next one as its changes from the one before (`studyDeltaOf`): a
 * setting edit copies one device across, not the study.
 * @example new AnalysisState(study, workerRunner())
 */
export function workerRunner(): CheckRunner {
  const runner: CheckRunner = {
    post: ({ seq, study }) => send(study, (payload): WorkerRequest => ({ seq, ...payload })),
    onreply: undefined,
  };
  const send = studyWorker<AnalyseReply>(checksWorkerUrl, 'checks', (reply) => runner.onreply?.(reply));
  return runner;
}

/**
 * A module worker that keeps the last study sent to it, started with the first message: `send` gives
 * it a study whole the first time and then as its changes from the one before. A worker whose script
 * failed to load, or whose code threw outside a message, answers nothing more: it is let go with a
 * reply of `seq` -1 saying why, and the next message starts another, the study crossing whole.
 */
function studyWorker<R>(
  url: () => URL,
  name: string,
  onreply: (reply: R | { seq: -1; ok: false; message: string }) => void,
): (study: Study, message: (payload: { study: Study } | { delta: StudyDelta }) => unknown) => void {
  let worker: Worker | undefined;
  let sent: Study | undefined;
  return (study, message) => {
    if (!worker) {
      const started = new Worker(url(), { type: 'module', name });
      // A worker let go says nothing more, even with messages it had already sent on their way.
      started.onmessage = (event: MessageEvent<R>) => {
        if (worker === started) onreply(event.data);
      };
      started.onerror = (event) => {
        started.terminate();
        if (worker !== started) return;
        [worker, sent] = [undefined, undefined];
        // A script that failed to load gives an event without a message.
        onreply({ seq: -1, ok: false, message: event.message || `the ${name} worker could not start` });
      };
      worker = started;
    }
    worker.postMessage(message(sent ? { delta: studyDeltaOf(sent, study) } : { study }));
    sent = study;
  };
}

/**
 * Where a worker's script is. The built page has each worker as an entry of its own build (`checks`,
 * `settings`, `oneLine`, `report`), beside the page's own chunks and sharing the engine's with them (the build writes its
 * hashed name in for the placeholder; see `vite.config.ts`); the dev server serves the source module.
 * The name is put together at run time so the bundler does not make a separate worker bundle of it.
 */
function workerUrl(sourceFile: string, builtPlaceholder: string): URL {
  return new URL(import.meta.env.DEV ? ['.', sourceFile].join('/') : builtPlaceholder, import.meta.url);
}

const checksWorkerUrl = () => workerUrl('analysis.worker.ts', './discern-checks-worker.js');
const settingsWorkerUrl = () => workerUrl('settings.worker.ts', './discern-settings-worker.js');
const oneLineWorkerUrl = () => workerUrl('oneLine.worker.ts', './discern-one-line-worker.js');
const reportWorkerUrl = () => workerUrl('report.worker.ts', './discern-report-worker.js');

/**
 * Runs the checks on the calling thread, replying on a later task (same contract as the worker).
 * Used where no Worker exists, and by tests.
 * @example new AnalysisState(study, inlineRunner())
 */
export function inlineRunner(): CheckRunner {
  const memo = new AnalysisMemo();
  const tracker = new ChangeTracker();
  const runner: CheckRunner = {
    post: (request: AnalyseRequest) =>
      setTimeout(() => {
        try {
          const changes = tracker.changesOf(checksOf(request.study, memo));
          runner.onreply?.({ seq: request.seq, ok: true, changes });
        } catch (error) {
          runner.onreply?.({ seq: request.seq, ok: false, message: (error as Error).message });
        }
      }, 0),
    onreply: undefined,
  };
  return runner;
}

/** Where questions about the study are answered: a Web Worker in the browser, or in-line where there is none. */
export interface QuestionRunner<Q, A> {
  post(request: { seq: number; study: Study; question: Q }): void;
  onreply: ((reply: QuestionReply<A>) => void) | undefined;
}

/**
 * Answers questions about the study in a module Web Worker, started with the first question (most
 * sessions never ask one), so that the answer waits neither on the page nor on the checks of an edit.
 * The study crosses as the checks' does: whole once, then as its changes.
 */
function questionWorkerRunner<Q, A>(url: () => URL, name: string): QuestionRunner<Q, A> {
  const runner: QuestionRunner<Q, A> = {
    post: ({ seq, study, question }) => send(study, (payload): QuestionRequest<Q> => ({ seq, question, ...payload })),
    onreply: undefined,
  };
  const send = studyWorker<QuestionReply<A>>(url, name, (reply) => runner.onreply?.(reply));
  return runner;
}

/**
 * Answers on the calling thread, on a later task (same contract as the worker), loading the answering
 * module only when first asked. Used where no Worker exists, and by tests.
 */
function inlineQuestionRunner<Q, A>(
  answerOf: () => Promise<(study: Study, question: Q) => A | Promise<A>>,
): QuestionRunner<Q, A> {
  // Answered one after another, in the order asked, as a worker answers its messages.
  let answered: Promise<void> = Promise.resolve();
  const runner: QuestionRunner<Q, A> = {
    post: ({ seq, study, question }) => {
      const later = new Promise((resolve) => setTimeout(resolve, 0));
      answered = answered.then(async () => {
        await later;
        try {
          const answer = await (await answerOf())(study, question);
          runner.onreply?.({ seq, ok: true, answer });
        } catch (error) {
          runner.onreply?.({ seq, ok: false, message: (error as Error).message });
        }
      });
    },
    onreply: undefined,
  };
  return runner;
}

/** Setting windows and proposals in their worker. @example new StudyAsker(settingsWorkerRunner(), { newestOnly: true }) */
export function settingsWorkerRunner(): QuestionRunner<SettingsQuestion, SettingsAnswer> {
  return questionWorkerRunner(settingsWorkerUrl, 'settings');
}

/** Setting windows and proposals on the calling thread. @example new StudyAsker(inlineSettingsRunner(), { newestOnly: true }) */
export function inlineSettingsRunner(): QuestionRunner<SettingsQuestion, SettingsAnswer> {
  return inlineQuestionRunner(async () => (await import('./settingsQuestions.ts')).answerOf);
}

/** Study reports written in their worker. @example new StudyAsker(reportWorkerRunner()) */
export function reportWorkerRunner(): QuestionRunner<ReportQuestion, ReportAnswer> {
  return questionWorkerRunner(reportWorkerUrl, 'report');
}

/** Study reports written on the calling thread. @example new StudyAsker(inlineReportRunner()) */
export function inlineReportRunner(): QuestionRunner<ReportQuestion, ReportAnswer> {
  return inlineQuestionRunner(async () => (await import('./reportQuestions.ts')).reportOf);
}

/** One-line diagrams drawn in their worker. @example new StudyAsker(oneLineWorkerRunner(), { newestOnly: true }) */
export function oneLineWorkerRunner(): QuestionRunner<OneLineQuestion, OneLineAnswer> {
  return questionWorkerRunner(oneLineWorkerUrl, 'one-line');
}

/** One-line diagrams drawn on the calling thread. @example new StudyAsker(inlineOneLineRunner(), { newestOnly: true }) */
export function inlineOneLineRunner(): QuestionRunner<OneLineQuestion, OneLineAnswer> {
  return inlineQuestionRunner(async () => (await import('./oneLineQuestions.ts')).oneLineBasesOf);
}
