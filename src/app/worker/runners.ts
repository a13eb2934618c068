import { AnalysisMemo } from '../../engine/incremental.ts';
import { ChangeTracker } from './changes.ts';
import { checksOf } from './checks.ts';
import type { CheckRunner } from '../state/AnalysisState.svelte.ts';
import type { AnalyseReply, AnalyseRequest } from './protocol.ts';

/**
 * Runs the checks in a module Web Worker (the browser's way of keeping heavy work off the page).
 * @example new AnalysisState(study, workerRunner())
 */
export function workerRunner(): CheckRunner {
  const worker = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module', name: 'checks' });
  const runner: CheckRunner = {
    post: (request) => worker.postMessage(request),
    onreply: undefined,
  };
  worker.onmessage = (event: MessageEvent<AnalyseReply>) => runner.onreply?.(event.data);
  worker.onerror = (event) => runner.onreply?.({ seq: -1, ok: false, message: event.message });
  return runner;
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
