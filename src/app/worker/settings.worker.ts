// Works out setting windows and proposals off the main thread: at 500 devices one device's window
// took 160 ms and a proposal for the study 150 ms, long enough to hold the page still.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import type { Study } from '../../engine/study/index.ts';
import type { SettingsReply, SettingsRequest } from './protocol.ts';
import { answerOf } from './settingsQuestions.ts';
import { studyWithDelta } from './studyDelta.ts';

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<SettingsRequest>) => void) | null;
  postMessage(reply: SettingsReply): void;
};

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

// The last study sent: the next request's changes apply to it.
let current: Study | undefined;

scope.onmessage = ({ data }) => {
  const { seq } = data;
  try {
    if ('delta' in data && !current) throw new Error('expected a whole study before its changes, got changes');
    const study = 'delta' in data ? studyWithDelta(current!, data.delta) : data.study;
    current = study;
    scope.postMessage({ seq, ok: true, answer: answerOf(study, data.question) });
  } catch (error) {
    scope.postMessage({ seq, ok: false, message: (error as Error).message });
  }
};
