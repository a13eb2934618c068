import { readFileSync, readdirSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  readEditableStudy,
  readStudy,
  readStudyEdit,
  type EditableReading,
  type StudyReading,
} from '../../../src/engine/study/index.ts';

type Json = Record<string, unknown>;
type Path = readonly (string | number)[];

const demos = readdirSync('demo')
  .filter((f) => f.endsWith('.json'))
  .sort()
  .map((f) => ({ name: f, document: JSON.parse(readFileSync(`demo/${f}`, 'utf8')) as Json }));
const demo = (name: string) => demos.find((d) => d.name === name)!.document;

const LISTS = ['buses', 'transformers', 'cables', 'motors', 'devices', 'views', 'generators', 'switches', 'scenarios'];

/** A copy of `node` with `value` at `path`, copying only along the path as the workbench's editor does. */
function copyWith(node: unknown, path: Path, value: unknown): unknown {
  if (path.length === 0) return value;
  const [key, ...rest] = path;
  if (Array.isArray(node)) {
    const copy = node.slice();
    copy[key as number] = copyWith(node[key as number], rest, value);
    return copy;
  }
  const record = node !== null && typeof node === 'object' ? (node as Json) : {};
  const copy: Json = { ...record };
  const child = copyWith(record[key as string], rest, value);
  if (child === undefined) delete copy[key as string];
  else copy[key as string] = child;
  return copy;
}

/** Every path below `node` that ends on a number, string, boolean or null. */
function leafPaths(node: unknown, path: Path = []): Path[] {
  if (node === null || typeof node !== 'object') return [path];
  const keys: (string | number)[] = Array.isArray(node) ? node.map((_, i) => i) : Object.keys(node);
  return keys.flatMap((key) => leafPaths((node as Json)[key as string], [...path, key]));
}

/** Every id in the document's lists, to rename an item to one already in use. */
function idsOf(document: Json): string[] {
  return LISTS.flatMap((list) =>
    ((document[list] as { id?: string }[] | undefined) ?? []).map((item) => item.id ?? ''),
  );
}

const badValue = fc.oneof(
  fc.double({ noNaN: true, min: -1e6, max: 1e6 }),
  fc.constantFrom(0, -1, 1e-12, 1e13, Infinity, 0.5, 3, 480, 2000),
  fc.constantFrom('400 A', '5 kV', '12 cycles', '0.2 s', '13.8 kV', '2 MVA', 'abc', '', '-5 %', '1e400 A'),
  fc.constantFrom(null, true, false, [], {}),
  fc.string({ maxLength: 6 }),
);

/** One edit, picked among the document's lists, items and fields by the numbers it carries. */
const editArbitrary = fc.record({
  kind: fc.constantFrom('set', 'set', 'set', 'set', 'remove', 'rename', 'refer', 'drop', 'add', 'unknown', 'top'),
  list: fc.nat(),
  item: fc.nat(),
  leaf: fc.nat(),
  value: badValue,
});
type Edit = typeof editArbitrary extends fc.Arbitrary<infer T> ? T : never;

function applyEdit(document: Json, edit: Edit): Json {
  const lists = LISTS.filter((list) => Array.isArray(document[list]) && (document[list] as unknown[]).length > 0);
  const list = lists[edit.list % lists.length];
  const items = document[list] as unknown[];
  const index = edit.item % items.length;
  const item = items[index];
  const pick = <T>(choices: readonly T[]) => choices[edit.leaf % choices.length];
  switch (edit.kind) {
    case 'set':
    case 'remove': {
      const leaves = leafPaths(item);
      const leaf = pick(leaves.length > 0 ? leaves : [[]]);
      return copyWith(document, [list, index, ...leaf], edit.kind === 'set' ? edit.value : undefined) as Json;
    }
    case 'rename': {
      if (item === null || typeof item !== 'object' || Array.isArray(item)) return document;
      return copyWith(document, [list, index, 'id'], pick([...idsOf(document), 'NEW-ID', 'X'])) as Json;
    }
    case 'refer': {
      // Point a reference (what a device feeds, a branch's ends, a motor's bus) at another item.
      const fields = ['feeds', 'bus', 'from', 'to'].filter((field) => typeof (item as Json)?.[field] === 'string');
      if (fields.length === 0) return document;
      return copyWith(
        document,
        [list, index, pick(fields)],
        idsOf(document)[edit.item % idsOf(document).length],
      ) as Json;
    }
    case 'drop':
      return copyWith(
        document,
        [list],
        items.filter((_, i) => i !== index),
      ) as Json;
    case 'add':
      return copyWith(document, [list], [...items, structuredClone(item)]) as Json;
    case 'unknown':
      return copyWith(document, [list, index, 'colour'], 'blue') as Json;
    default: {
      const [path, value] = pick<[Path, unknown]>([
        [['name'], edit.value],
        [['frequency'], edit.leaf % 3 === 0 ? 50 : 60],
        [['coordination', 'thinMargin'], edit.value],
        [['source', 'bus'], pick(idsOf(document))],
        [['notes'], 'a note'],
      ]);
      return copyWith(document, path, value) as Json;
    }
  }
}

/** The reading without what `readStudyEdit` keeps for the next edit, as `readStudy` gives it. */
function readingOnly({ accepted: _accepted, ...reading }: EditableReading): StudyReading {
  return reading;
}

describe('readStudyEdit', () => {
  it('has the expected defaults: an edit of one setting reads like the whole document', () => {
    const document = demo('harrowmere-selective.json');
    const edited = copyWith(document, ['devices', 0, 'rating'], '1600 A');
    const reading = readStudyEdit(readEditableStudy(document), edited);
    expect(readingOnly(reading)).toEqual(readStudy(edited));
    expect(reading.study?.devices[0].rating).toBe(1600);
  });

  it('readStudyEdit gives what readStudy gives the edited document, edit after edit (property, every demo)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...demos.map((d) => d.name)),
        fc.array(editArbitrary, { minLength: 1, maxLength: 5 }),
        (name, edits) => {
          let document = demo(name);
          let reading = readEditableStudy(document);
          for (const edit of edits) {
            document = applyEdit(document, edit);
            reading = readStudyEdit(reading, document);
            expect(readingOnly(reading)).toEqual(readStudy(document));
          }
        },
      ),
      { numRuns: 300, seed: 20261203 },
    );
  });

  it('readStudyEdit keeps the parsed items an edit left alone, and the lists it did not touch', () => {
    const document = demo('harrowmere-full.json');
    const before = readEditableStudy(document);
    const after = readStudyEdit(before, copyWith(document, ['devices', 3, 'name'], 'Renamed feeder'));
    expect(after.study?.devices[3].name).toBe('Renamed feeder');
    expect(after.study?.devices[3]).not.toBe(before.study?.devices[3]);
    expect(after.study?.devices[4]).toBe(before.study?.devices[4]);
    expect(after.study?.buses).toBe(before.study?.buses);
    expect(after.study?.source).toBe(before.study?.source);
  });

  it('readStudyEdit reports a bad value by its path and keeps reading from the last accepted document', () => {
    const document = demo('harrowmere-selective.json');
    const good = readEditableStudy(document);
    const bad = readStudyEdit(good, copyWith(document, ['devices', 2, 'rating'], '-5 A'));
    expect(bad.study).toBeUndefined();
    expect(`${bad.problems[0].path}: ${bad.problems[0].message}`).toMatch(
      /^study\.devices\[2\]\.rating: expected .*-5 A/,
    );
    expect(bad.accepted).toBe(good.accepted);
    // Typing on from the invalid value reads against the document accepted before it.
    const fixed = readStudyEdit(bad, copyWith(bad.document, ['devices', 2, 'rating'], '500 A'));
    expect(fixed.problems).toEqual([]);
    expect(fixed.study?.devices[2].rating).toBe(500);
    expect(fixed.study?.devices[1]).toBe(good.study?.devices[1]);
  });

  it('readStudyEdit finds the tree rules an edit of one item breaks in another (a duplicated id)', () => {
    const document = demo('harrowmere-selective.json');
    const devices = document.devices as { id: string }[];
    const edited = copyWith(document, ['devices', 1, 'id'], devices[0].id);
    const reading = readStudyEdit(readEditableStudy(document), edited);
    expect(reading.problems.map((p) => `${p.path}: ${p.message}`)).toContainEqual(
      expect.stringMatching(/^study\.devices\[1\]\.id: expected an id not already used/),
    );
    expect(readingOnly(reading)).toEqual(readStudy(edited));
  });

  it('readStudyEdit reads text, and a document with fields added, whole', () => {
    const document = demo('harrowmere-selective.json');
    const reading = readEditableStudy(document);
    const text = JSON.stringify(document);
    expect(readingOnly(readStudyEdit(reading, text))).toEqual(readStudy(text));
    const added = { ...document, site: 'North yard' };
    expect(readingOnly(readStudyEdit(reading, added))).toEqual(readStudy(added));
  });
});
