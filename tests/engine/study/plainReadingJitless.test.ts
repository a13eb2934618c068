import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SCHEMA_SETTINGS } from '../../../src/app/lib/jitlessSchemas.ts';
import { NOT_PLAIN, plainReaderOf } from '../../../src/engine/study/plainReading.ts';
import { createStudySchema } from '../../../src/engine/study/schema.ts';
import { hostileStudies } from '../../fuzz/hostileStudies.ts';

// The page reads studies with zod's settings for the browser (no compiled parsers): the plain reading
// must agree with zod's interpreted reading as it does with the compiled one (plainReading.test.ts).
describe('plain reading against zod without compiled parsers', () => {
  const schema = createStudySchema(60);

  it('runs with zod set to read without compiled parsers', () => {
    expect(SCHEMA_SETTINGS.jitless).toBe(true);
  });

  it('reads every demo study exactly as zod does', () => {
    for (const name of readdirSync('demo')) {
      const document = JSON.parse(readFileSync(`demo/${name}`, 'utf8'));
      const plain = plainReaderOf(schema)(structuredClone(document));
      expect(plain, name).not.toBe(NOT_PLAIN);
      expect(JSON.stringify(plain)).toBe(JSON.stringify(schema.parse(structuredClone(document))));
    }
  });

  it('gives up wherever zod refuses a hostile study, and agrees on the rest', () => {
    for (const { text } of hostileStudies(20261204, 300)) {
      let document: unknown;
      try {
        document = JSON.parse(text.replace(/^\uFEFF/, ''));
      } catch {
        continue;
      }
      if (document === null || typeof document !== 'object') continue;
      const plain = plainReaderOf(schema)(structuredClone(document));
      const read = schema.safeParse(structuredClone(document));
      if (plain === NOT_PLAIN) continue;
      expect(read.success).toBe(true);
      expect(JSON.stringify(plain)).toBe(JSON.stringify(read.data));
      expect(plain).toStrictEqual(read.data);
    }
  });
});
