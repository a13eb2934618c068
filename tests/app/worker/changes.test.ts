import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { ChangeTracker, resultsWith, sameJson } from '../../../src/app/worker/changes.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import type { Finding } from '../../../src/engine/checks/finding.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const demo = (): StudyInput =>
  JSON.parse(readFileSync(new URL('../../../demo/harrowmere-full.json', import.meta.url), 'utf8')) as StudyInput;
const plain = (value: unknown) => JSON.parse(JSON.stringify(value));

describe('ChangeTracker and resultsWith', () => {
  it('has the expected defaults: the first changes carry every finding and pair, in order', () => {
    const analysis = analyseStudy(parseStudy(demo()));
    const changes = new ChangeTracker().changesOf(analysis);
    expect(changes.findings).toHaveLength(analysis.findings.length);
    expect(changes.removed).toEqual([]);
    expect(changes.order).toHaveLength(analysis.findings.length);
    const results = resultsWith(undefined, changes);
    expect(plain(results.findings)).toEqual(plain(analysis.findings));
    expect(results.pairs).toEqual(analysis.pairs);
    expect(results.counts).toEqual(analysis.counts);
  });

  it('after one setting edit sends only what changed, and the rebuilt results equal a fresh analysis', () => {
    const memo = new AnalysisMemo();
    const tracker = new ChangeTracker();
    const first = resultsWith(undefined, tracker.changesOf(analyseStudy(parseStudy(demo()), memo)));
    const edited = demo();
    // The main's short-time delay cut to 0.1 s: it no longer waits for the feeders below it.
    const device = edited.devices!.find((d) => d.id === 'MAIN')!;
    (device.characteristic as { shortTime: { delay: number } }).shortTime.delay = 0.1;
    const fresh = analyseStudy(parseStudy(edited));
    const changes = tracker.changesOf(analyseStudy(parseStudy(edited), memo));
    expect(changes.findings.length).toBeGreaterThan(0);
    expect(changes.findings.length).toBeLessThan(fresh.findings.length / 4);
    expect(
      changes.findings.every(({ finding }) => finding.subjects.includes('MAIN') || finding.kind !== 'coordination'),
    ).toBe(true);
    const results = resultsWith(first, structuredClone(changes));
    expect(plain(results.findings)).toEqual(plain(fresh.findings));
    expect(plain(results.pairs)).toEqual(plain(fresh.pairs));
    expect(results.counts).toEqual(fresh.counts);
  });

  it('keys a repeated finding id apart and sends a finding that is gone as removed', () => {
    const tracker = new ChangeTracker();
    const finding = (id: string, title: string): Finding => ({
      id,
      kind: 'setting',
      severity: 'info',
      title,
      subjects: [],
      explanation: '',
      referenceVolts: 480,
    });
    const counts = { ok: 0, info: 2, warning: 0, fail: 0 };
    const first = tracker.changesOf({ findings: [finding('a', 'one'), finding('a', 'two')], pairs: [], counts });
    expect(first.order).toEqual(['a', 'a#1']);
    const second = tracker.changesOf({ findings: [finding('a', 'one')], pairs: [], counts });
    expect(second.removed).toEqual(['a#1']);
    expect(second.findings).toEqual([]);
    expect(resultsWith(resultsWith(undefined, first), second).findings.map((f) => f.title)).toEqual(['one']);
  });
});

describe('sameJson', () => {
  /** JSON text with every object's keys sorted: equal exactly when two values read the same as JSON, in any key order. */
  const canonical = (value: unknown) =>
    JSON.stringify(value, (_, v: unknown) =>
      v !== null && typeof v === 'object' && !Array.isArray(v)
        ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
        : v,
    );
  const value = fc.anything({
    maxDepth: 3,
    withNullPrototype: false,
    withBoxedValues: false,
    withMap: false,
    withSet: false,
    withTypedArray: false,
    withDate: false,
    withSparseArray: true,
  });

  it('sameJson() agrees with comparing the values written as JSON (property)', () => {
    fc.assert(
      fc.property(value, value, fc.boolean(), (a, b, twin) => {
        const other = twin ? structuredClone(a) : b;
        expect(sameJson(a, other)).toBe(canonical(a) === canonical(other));
      }),
      { numRuns: 2000, seed: 31 },
    );
  });

  it('sameJson() reads undefined fields as absent, non-finite numbers as null, and ignores key order', () => {
    expect(sameJson({ a: 1, b: undefined }, { a: 1 })).toBe(true);
    expect(sameJson([Infinity, NaN], [null, null])).toBe(true);
    expect(sameJson([undefined, 1], [null, 1])).toBe(true);
    expect(sameJson({ a: 1, b: 2 }, { b: 2, a: 1 })).toBe(true);
    expect(sameJson({ a: 1 }, { a: 1, b: 0 })).toBe(false);
    expect(sameJson([1, 2], [1, 2, 3])).toBe(false);
    expect(sameJson({ a: [1, { b: 'x' }] }, { a: [1, { b: 'y' }] })).toBe(false);
  });
});
