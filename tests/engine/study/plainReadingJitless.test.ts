import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SCHEMA_SETTINGS } from '../../../src/app/lib/jitlessSchemas.ts';
import { createStudySchema } from '../../../src/engine/study/schema.ts';
import { expectSameReading, hostileDocuments } from './sameReading.ts';

// The page reads studies with zod's settings for the browser (no compiled parsers): the plain reading
// must agree with zod's reading under them as it does under the defaults (plainReading.test.ts).
describe('plain reading against zod without compiled parsers', () => {
  const schema = createStudySchema(60);

  it('runs with zod set to read without compiled parsers', () => {
    expect(SCHEMA_SETTINGS.jitless).toBe(true);
  });

  it('reads every demo study exactly as zod does', () => {
    for (const name of readdirSync('demo')) {
      const document = JSON.parse(readFileSync(`demo/${name}`, 'utf8'));
      expect(expectSameReading(schema, document), name).toBe('plain');
    }
  });

  it('gives up wherever zod refuses a hostile study, and agrees on the rest', () => {
    const outcomes = { plain: 0, zod: 0 };
    for (const document of hostileDocuments(20261204, 300)) outcomes[expectSameReading(schema, document)]++;
    expect(outcomes.plain).toBeGreaterThan(20);
    expect(outcomes.zod).toBeGreaterThan(20);
  });
});
