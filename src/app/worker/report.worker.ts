// Writes study reports off the main thread: a 2,000-device study's report takes seconds to write.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { reportOf } from './reportQuestions.ts';
import { serveQuestions } from './serveQuestions.ts';

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

serveQuestions(reportOf, (answer) => [answer.bytes.buffer]);
