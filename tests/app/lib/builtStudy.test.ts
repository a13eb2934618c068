import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { builtStudyOf, documentOfText, readingOf } from '../../../src/app/lib/builtStudy.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

const text = readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8');
const demo = JSON.parse(text) as StudyInput;

describe('builtStudy', () => {
  it('has the expected defaults: the demo builds whole, with its network', () => {
    const built = builtStudyOf(demo);
    expect(built.ok).toBe(true);
    if (!built.ok) return;
    expect(built.value.document).toBe(demo);
    expect(built.value.reading.problems).toEqual([]);
    expect(built.value.network?.devices.has('MAIN')).toBe(true);
  });

  it('builtStudyOf(text) reads a file’s text, a byte-order mark allowed', () => {
    const built = builtStudyOf(`\uFEFF${text}`);
    expect(built.ok && built.value.document).toEqual(demo);
  });

  it('a study with problems is not built, and says why by field path', () => {
    const bad = structuredClone(demo);
    bad.name = '';
    const built = builtStudyOf(bad);
    expect(built).toMatchObject({ ok: false, failed: false });
    expect(!built.ok && built.problems[0].path).toBe('study.name');
  });

  it('readingOf() turns an error thrown while reading into one problem of the whole study', () => {
    const hostile = {
      get discern() {
        throw new RangeError('Maximum call stack size exceeded');
      },
    };
    const reading = readingOf(hostile);
    expect(reading.study).toBeUndefined();
    expect(reading.problems).toHaveLength(1);
    expect(`${reading.problems[0].path}: ${reading.problems[0].message}`).toMatch(
      /^study: expected a study the workbench can read, got one that stopped it \(.+\)$/,
    );
    expect(builtStudyOf(hostile)).toMatchObject({ ok: false, failed: true });
  });

  it('documentOfText() gives a JSON object or nothing', () => {
    expect(documentOfText('{"discern":1}')).toEqual({ discern: 1 });
    expect(documentOfText('[1]')).toBeUndefined();
    expect(documentOfText('{')).toBeUndefined();
    expect(documentOfText('null')).toBeUndefined();
  });
});
