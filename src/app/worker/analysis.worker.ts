// Runs every check of a study off the main thread and posts the findings back as plain data.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { analyseStudy } from '../../engine/analysis.ts';
import type { AnalyseReply, AnalyseRequest } from './protocol.ts';

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<AnalyseRequest>) => void) | null;
  postMessage(reply: AnalyseReply): void;
};

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

scope.onmessage = ({ data }) => {
  const { seq, study } = data;
  try {
    const { findings, pairs, counts } = analyseStudy(study);
    scope.postMessage({ seq, ok: true, findings, pairs, counts });
  } catch (error) {
    scope.postMessage({ seq, ok: false, message: (error as Error).message });
  }
};
