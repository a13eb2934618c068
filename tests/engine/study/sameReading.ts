import { expect } from 'vitest';
import type { z } from 'zod/mini';
import { NOT_PLAIN, plainReaderOf } from '../../../src/engine/study/plainReading.ts';
import { hostileStudies } from '../../fuzz/hostileStudies.ts';

/**
 * The plain reading must give what zod gives, to the key order, whenever it gives anything, and must
 * give up whenever zod finds a problem: the study reader trusts it in place of zod. Says which read it.
 *
 * @example expect(expectSameReading(studySchema, document)).toBe('plain')
 */
export function expectSameReading(schema: z.ZodMiniType, document: unknown): 'plain' | 'zod' {
  const plain = plainReaderOf(schema)(structuredClone(document));
  const read = schema.safeParse(structuredClone(document));
  if (plain === NOT_PLAIN) return 'zod';
  expect(read.success, read.error?.message).toBe(true);
  expect(plain).toStrictEqual(read.data);
  expect(JSON.stringify(plain)).toBe(JSON.stringify(read.data));
  return 'plain';
}

/** The hostile studies of a seed that are still JSON objects (a document the schema is asked to read). */
export function hostileDocuments(seed: number, count: number): object[] {
  const documents: object[] = [];
  for (const { text } of hostileStudies(seed, count)) {
    try {
      const document: unknown = JSON.parse(text.replace(/^\uFEFF/, ''));
      if (document !== null && typeof document === 'object') documents.push(document);
    } catch {
      // not JSON: nothing for the schema to read
    }
  }
  return documents;
}
