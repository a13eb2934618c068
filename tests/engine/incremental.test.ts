import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { AnalysisMemo } from '../../src/engine/incremental.ts';
import { networkOf, seriesPairs } from '../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../src/engine/study/index.ts';

const demo = (): StudyInput =>
  JSON.parse(readFileSync(new URL('../../demo/harrowmere-full.json', import.meta.url), 'utf8')) as StudyInput;
/** Findings as plain data (the lazily written sentences included). */
const plain = (study: StudyInput, memo?: AnalysisMemo) => {
  const analysis = analyseStudy(parseStudy(study), memo);
  return JSON.parse(JSON.stringify({ findings: analysis.findings, pairs: analysis.pairs, counts: analysis.counts }));
};
const deviceOf = (study: StudyInput, id: string) => study.devices!.find((d) => d.id === id)!;

describe('AnalysisMemo', () => {
  it('has the expected defaults: a first analysis with a memo is a fresh analysis', () => {
    const memo = new AnalysisMemo();
    expect(plain(demo(), memo)).toEqual(plain(demo()));
    expect(memo.lastRun.faultsReused).toBe(false);
    expect(memo.lastRun.pairsReused).toBe(0);
  });

  it('after a setting edit re-checks only the pairs of that device, and agrees with a fresh analysis', () => {
    const memo = new AnalysisMemo();
    plain(demo(), memo);
    const edited = demo();
    (deviceOf(edited, 'FDR-DOCK').characteristic as { longTime: { delay: number } }).longTime.delay = 6;
    expect(plain(edited, memo)).toEqual(plain(edited));
    const network = networkOf(parseStudy(edited));
    const all = [...seriesPairs(network)];
    const involving = all.filter((p) => p.upstream.id === 'FDR-DOCK' || p.downstream.id === 'FDR-DOCK').length;
    expect(memo.lastRun.faultsReused).toBe(true);
    expect(memo.lastRun.pairsChecked).toBe(involving);
    expect(memo.lastRun.pairsReused).toBe(all.length - involving);
  });

  it('works the fault levels out again when the network changes, and agrees with a fresh analysis', () => {
    const memo = new AnalysisMemo();
    plain(demo(), memo);
    const edited = demo();
    edited.cables![0].length = '300 ft';
    expect(plain(edited, memo)).toEqual(plain(edited));
    expect(memo.lastRun.faultsReused).toBe(false);
  });
});
