import { AnalysisMemo } from '../../engine/incremental.ts';
import { ChangeTracker } from './changes.ts';
import { checksOf } from './checks.ts';
import type { CheckRunner } from '../state/AnalysisState.svelte.ts';
import type { AnalyseReply, AnalyseRequest, SettingsReply, SettingsRequest, WorkerRequest } from './protocol.ts';
import { answerOf, type SettingsQuestion } from './settingsQuestions.ts';
import { studyDeltaOf } from './studyDelta.ts';
import type { Study } from '../../engine/study/index.ts';

/**
 * Runs the checks in a module Web Worker (the browser's way of keeping heavy work off the page). The
 * first study crosses whole, each next one as its changes from the one before (`studyDeltaOf`): a
 * setting edit copies one device across, not the study.
 * @example new AnalysisState(study, workerRunner())
 */
export function workerRunner(): CheckRunner {
  const worker = new Worker(checksWorkerUrl(), { type: 'module', name: 'checks' });
  let sent: Study | undefined;
  const runner: CheckRunner = {
    post: (request) => {
      const message: WorkerRequest = sent ? { seq: request.seq, delta: studyDeltaOf(sent, request.study) } : request;
      sent = request.study;
      worker.postMessage(message);
    },
    onreply: undefined,
  };
  worker.onmessage = (event: MessageEvent<AnalyseReply>) => runner.onreply?.(event.data);
  worker.onerror = (event) => {
    // What the worker holds is unknown after an error: the next study crosses whole.
    sent = undefined;
    runner.onreply?.({ seq: -1, ok: false, message: event.message });
  };
  return runner;
}

/**
 * Where a worker's script is. The built page has each worker as an entry of its own build (`checks`,
 * `settings`), beside the page's own chunks and sharing the engine's with them (the build writes its
 * hashed name in for the placeholder; see `vite.config.ts`); the dev server serves the source module.
 * The name is put together at run time so the bundler does not make a separate worker bundle of it.
 */
function checksWorkerUrl(): URL {
  const source = ['.', 'analysis.worker.ts'].join('/');
  return new URL(import.meta.env.DEV ? source : './discern-checks-worker.js', import.meta.url);
}

function settingsWorkerUrl(): URL {
  const source = ['.', 'settings.worker.ts'].join('/');
  return new URL(import.meta.env.DEV ? source : './discern-settings-worker.js', import.meta.url);
}

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

/** Where setting windows and proposals are worked out: a Web Worker in the browser, or in-line where there is none. */
export interface SettingsRunner {
  post(request: { seq: number; study: Study; question: SettingsQuestion }): void;
  onreply: ((reply: SettingsReply) => void) | undefined;
}

/**
 * Works out setting windows and proposals in a module Web Worker of their own, started with the first
 * question (most sessions never open the Window tab), so that a window does not wait for the checks
 * of an edit. The study crosses as the checks' does: whole once, then as its changes.
 * @example new SettingsAsker(settingsWorkerRunner())
 */
export function settingsWorkerRunner(): SettingsRunner {
  let worker: Worker | undefined;
  let sent: Study | undefined;
  const runner: SettingsRunner = {
    post: ({ seq, study, question }) => {
      if (!worker) {
        worker = new Worker(settingsWorkerUrl(), { type: 'module', name: 'settings' });
        worker.onmessage = (event: MessageEvent<SettingsReply>) => runner.onreply?.(event.data);
        worker.onerror = (event) => {
          // What the worker holds is unknown after an error: the next study crosses whole.
          sent = undefined;
          runner.onreply?.({ seq: -1, ok: false, message: event.message });
        };
      }
      const message: SettingsRequest = sent
        ? { seq, question, delta: studyDeltaOf(sent, study) }
        : { seq, question, study };
      sent = study;
      worker.postMessage(message);
    },
    onreply: undefined,
  };
  return runner;
}

/**
 * Answers on the calling thread, on a later task (same contract as the worker). Used where no Worker
 * exists, and by tests.
 * @example new SettingsAsker(inlineSettingsRunner())
 */
export function inlineSettingsRunner(): SettingsRunner {
  const runner: SettingsRunner = {
    post: ({ seq, study, question }) =>
      setTimeout(() => {
        try {
          runner.onreply?.({ seq, ok: true, answer: answerOf(study, question) });
        } catch (error) {
          runner.onreply?.({ seq, ok: false, message: (error as Error).message });
        }
      }, 0),
    onreply: undefined,
  };
  return runner;
}
