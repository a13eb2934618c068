import { readFileSync, readdirSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { documentJsonOf } from '../../../src/app/lib/documentJson.ts';
import { withValueAt, type DocumentPath } from '../../../src/app/lib/documentPath.ts';

const demos = readdirSync('demo')
  .filter((f) => f.endsWith('.json'))
  .sort()
  .map((f) => JSON.parse(readFileSync(`demo/${f}`, 'utf8')) as Record<string, unknown>);

/** Every path below `node` to a value, objects and lists included. */
function pathsOf(node: unknown, path: DocumentPath = []): DocumentPath[] {
  if (node === null || typeof node !== 'object') return [path];
  const keys: (string | number)[] = Array.isArray(node) ? node.map((_, i) => i) : Object.keys(node);
  return [path, ...keys.flatMap((key) => pathsOf((node as Record<string, unknown>)[key], [...path, key]))];
}

describe('documentJsonOf', () => {
  it('has the expected defaults: the text JSON.stringify writes, for any value', () => {
    for (const value of [undefined, null, 3, 'x', [1, undefined], { a: undefined, b: [{ c: 1 }, undefined] }])
      expect(documentJsonOf(value)).toBe(JSON.stringify(value));
    expect(documentJsonOf(demos[0])).toBe(JSON.stringify(demos[0]));
  });

  it('documentJsonOf() writes what JSON.stringify writes, edit after edit, reusing the items left alone (property, every demo)', () => {
    const value = fc.oneof(
      fc.constantFrom(undefined, null, 0, '400 A', 'renamed', true),
      fc.double({ noNaN: true }),
      fc.jsonValue({ maxDepth: 2 }),
    );
    fc.assert(
      fc.property(
        fc.nat({ max: demos.length - 1 }),
        fc.array(fc.tuple(fc.nat(), value), { minLength: 1, maxLength: 6 }),
        (which, edits) => {
          let document: unknown = demos[which];
          expect(documentJsonOf(document)).toBe(JSON.stringify(document));
          for (const [pick, replacement] of edits) {
            const paths = pathsOf(document).filter((path) => path.length > 0);
            document = withValueAt(document, paths[pick % paths.length], replacement);
            expect(documentJsonOf(document)).toBe(JSON.stringify(document));
          }
        },
      ),
      { numRuns: 200, seed: 11 },
    );
  });
});
