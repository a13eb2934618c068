// Runs every check of a study off the main thread and posts back, as plain data, what changed.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { AnalysisMemo } from '../../engine/incremental.ts';
import { ChangeTracker } from './changes.ts';
import { checksOf } from './checks.ts';
import type { AnalyseReply, AnalyseRequest } from './protocol.ts';

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<AnalyseRequest>) => void) | null;
  postMessage(reply: AnalyseReply): void;
};

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

const memo = new AnalysisMemo();
const tracker = new ChangeTracker();

scope.onmessage = ({ data }) => {
  const { seq, study } = data;
  try {
    // Only what changed is sent (and, for a study that cannot be switched, only that is worked out again).
    scope.postMessage({ seq, ok: true, changes: tracker.changesOf(checksOf(study, memo)) });
  } catch (error) {
    scope.postMessage({ seq, ok: false, message: (error as Error).message });
  }
};
