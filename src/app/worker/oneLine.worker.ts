// Draws the one-line diagram's bases off the main thread: a 2,000-device site's held the page for 130 ms
// when the One-line tab was opened, and for as long again after an edit of its network.
import { SCHEMA_SETTINGS } from '../lib/jitlessSchemas.ts';
import { oneLineBasesOf } from './oneLineQuestions.ts';
import { serveQuestions } from './serveQuestions.ts';

if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');

serveQuestions(oneLineBasesOf);
