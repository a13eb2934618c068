import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { checksOf } from '../../../src/app/worker/checks.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const read = (name: string) => parseStudy(readFileSync(new URL(`../../../demo/${name}`, import.meta.url), 'utf8'));

describe('checksOf', () => {
  it('has the expected defaults: a study that cannot be switched is checked as analyseStudy checks it', () => {
    const study = read('harrowmere-overlap.json');
    const got = checksOf(study, new AnalysisMemo());
    const expected = analyseStudy(study);
    expect(JSON.parse(JSON.stringify(got.findings))).toEqual(JSON.parse(JSON.stringify(expected.findings)));
    expect(got.counts).toEqual(expected.counts);
    expect(got.findings.every((f) => f.scenarios === undefined)).toBe(true);
  });

  it("a study without scenarios marking an emergency device gets the code's selective-coordination finding", () => {
    const study = read('harrowmere-selective.json');
    const marked = {
      ...study,
      devices: study.devices.map((d) => (d.id === 'MAIN' ? { ...d, system: 'emergency' as const } : d)),
    };
    const got = checksOf(marked, new AnalysisMemo());
    const expected = analyseScenarios(marked);
    expect(got.findings).toEqual(expected.findings);
    expect(got.findings.map((f) => f.id)).toContain('code-selectivity:MAIN');
    expect(checksOf(study, new AnalysisMemo()).findings.map((f) => f.id)).not.toContain('code-selectivity:MAIN');
  });

  it('a study with scenarios is checked in every scenario, each finding listing where it holds', () => {
    const study = read('harrowmere-standby-overlap.json');
    const got = checksOf(study, new AnalysisMemo());
    const expected = analyseScenarios(study);
    expect(got.findings).toEqual(expected.findings);
    expect(got.counts).toEqual(expected.counts);
    const decrement = got.findings.find((f) => f.id === 'decrement:GEN-CB/EM-BR');
    expect(decrement?.scenarios).toEqual(['On generator']);
  });

  it("carries every scenario's pairs once each, the generator's among them", () => {
    const study = read('harrowmere-standby-overlap.json');
    const keys = checksOf(study, new AnalysisMemo()).pairs.map((p) => `${p.upstream}/${p.downstream}`);
    expect(new Set(keys).size).toBe(keys.length);
    expect(keys).toContain('GEN-CB/EM-BR');
    expect(keys).toContain('FDR-EM/EM-BR');
  });
});
