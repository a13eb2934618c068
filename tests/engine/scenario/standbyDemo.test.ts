import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const demo = (name: string) => analyseScenarios(parseStudy(readFileSync(`demo/${name}.json`, 'utf8')));

describe('the standby demos (invented site)', () => {
  it('are analysed in the three scenarios they declare', () => {
    expect(demo('harrowmere-standby').scenarios!.map((s) => s.label)).toEqual([
      'Normal',
      'On generator',
      'Dock on the office feeder',
    ]);
  });

  it('harrowmere-standby is selective in every scenario, the emergency chain by NFPA 70 700.32 included', () => {
    const analysis = demo('harrowmere-standby');
    expect(analysis.counts.fail).toBe(0);
    // The 600 A breaker (long-time pickup 480 A) on the 300 kVA, 361 A machine does not clear before the
    // armature's (I² − 1)·t = 37.5 (IEEE C50.13, from memory), e.g. 191 s against 12.5 s at 2 × rated:
    // a warning, since NFPA 70 445.12(A) also accepts the machine's inherent protection.
    const generator = analysis.findings.filter((f) => f.kind === 'generator-withstand');
    expect(generator.map((f) => `${f.severity} ${f.subjects.join('/')} ${f.scenarios}`)).toContain(
      'warning GEN-CB/G1 On generator',
    );
    // The generator breaker over the illustrative fan breaker on the decaying current: told, not claimed.
    const decaying = analysis.findings.find((f) => f.id === 'decrement:GEN-CB/EM-BR')!;
    expect([decaying.severity, decaying.title]).toEqual([
      'info',
      "Generator breaker 600 A over Exhaust fan breaker 50 A on the generator's decaying current: selective on illustrative curves",
    ]);
    const code = analysis.findings.filter((f) => f.kind === 'code-selectivity');
    // The generator breaker has no supply-side device: nothing to be selective with. The branch
    // breaker's curve is illustrative: selective on its curves, which shows nothing of a product.
    expect(code.map((f) => `${f.subjects[0]} ${f.severity}`)).toEqual(['FDR-EM ok', 'EM-BR warning']);
    expect(code[1].explanation).toMatch(
      /on its curves it is selective .* is illustrative \(invented data, not a product\)/,
    );
    expect(code.find((f) => f.subjects[0] === 'EM-BR')!.scenarios).toEqual([
      'Normal',
      'On generator',
      'Dock on the office feeder',
    ]);
  });

  it('harrowmere-standby-overlap is selective on the utility but not on the generator, and says why', () => {
    const analysis = demo('harrowmere-standby-overlap');
    const failing = analysis.findings.filter((f) => f.severity === 'fail');
    expect(failing.map((f) => f.kind).sort()).toEqual(['code-selectivity', 'generator-decrement']);
    for (const finding of failing) expect(finding.scenarios).toEqual(['On generator']);
    const code = failing.find((f) => f.kind === 'code-selectivity')!;
    expect(code.title).toMatch(/Exhaust fan breaker 50 A: NFPA 70 700\.32/);
    expect(code.explanation).toMatch(/On generator: Generator breaker 600 A and Exhaust fan breaker 50 A/);
    const onUtility = analysis.findings.filter((f) => f.scenarios?.includes('Normal'));
    expect(onUtility.filter((f) => f.severity === 'fail')).toEqual([]);
  });
});
