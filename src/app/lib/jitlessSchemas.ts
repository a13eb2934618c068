// Imported first by each entry (the page and the worker), before any module builds a schema: zod
// reads this setting when a schema is created.
import { config } from 'zod/mini';

/**
 * Zod's settings with `jitless` on: schemas parse without compiling code through `Function`, which
 * the page's Content-Security-Policy forbids (no 'unsafe-eval'), and zod skips its `Function` probe,
 * which a strict policy reports as a violation even though the error is caught. zod/mini's objects
 * compile no parser in any case; the setting keeps any other part of zod from trying.
 *
 * @example import { SCHEMA_SETTINGS } from './lib/jitlessSchemas.ts'; SCHEMA_SETTINGS.jitless // true
 */
export const SCHEMA_SETTINGS = config({ jitless: true });
