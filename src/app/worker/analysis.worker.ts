// Runs every check of a study off the main thread and posts back, as plain data, what changed.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { AnalysisMemo } from '../../engine/incremental.ts';
import type { Study } from '../../engine/study/index.ts';
import { ChangeTracker } from './changes.ts';
import { checksOf } from './checks.ts';
import type { AnalyseReply, WorkerRequest } from './protocol.ts';
import { studyWithDelta } from './studyDelta.ts';

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<WorkerRequest>) => void) | null;
  postMessage(reply: AnalyseReply): void;
};

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

const memo = new AnalysisMemo();
const tracker = new ChangeTracker();
// The last study sent: the next request's changes apply to it.
let current: Study | undefined;

scope.onmessage = ({ data }) => {
  const { seq } = data;
  try {
    if ('delta' in data && !current) throw new Error('expected a whole study before its changes, got changes');
    const study = 'delta' in data ? studyWithDelta(current!, data.delta) : data.study;
    current = study;
    // Only what changed is sent (and, for a study that cannot be switched, only that is worked out again).
    scope.postMessage({ seq, ok: true, changes: tracker.changesOf(checksOf(study, memo)) });
  } catch (error) {
    scope.postMessage({ seq, ok: false, message: (error as Error).message });
  }
};
