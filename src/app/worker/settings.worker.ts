// Works out setting windows and proposals off the main thread: at 500 devices one device's window
// took 160 ms and a proposal for the study 150 ms, long enough to hold the page still.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { serveQuestions } from './serveQuestions.ts';
import { answerOf } from './settingsQuestions.ts';

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

serveQuestions(answerOf);
