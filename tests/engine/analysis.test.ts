import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { parseStudy, type StudyInput } from '../../src/engine/study/index.ts';

const demo = (name: string): StudyInput => JSON.parse(readFileSync(`demo/harrowmere-${name}.json`, 'utf8'));
const failing = (name: string) => analyseStudy(parseStudy(demo(name))).findings.filter((f) => f.severity === 'fail');

describe('analyseStudy', () => {
  it('warns of a ground-fault setting beyond NFPA 70 230.95(A): above 1200 A, or later than 1 s at 3000 A', () => {
    const within = analyseStudy(parseStudy(demo('selective'))).findings;
    expect(within.filter((f) => f.basis === 'NFPA 70 230.95(A)')).toEqual([]);
    // The 2000 A main's ground-fault element set at 0.9 × 2000 A = 1800 A with a 1.5 s delay.
    const input = demo('selective');
    const main = input.devices!.find((d) => d.id === 'MAIN')! as { characteristic: { ground?: unknown } };
    main.characteristic.ground = { pickup: 0.9, delay: 1.5 };
    const beyond = analyseStudy(parseStudy(input)).findings.filter((f) => f.basis === 'NFPA 70 230.95(A)');
    expect(beyond.map((f) => [f.severity, f.subjects])).toEqual([
      ['warning', ['MAIN']],
      ['warning', ['MAIN']],
    ]);
    expect(beyond[0].explanation).toMatch(/^Ground-fault pickup 1800 A is above the 1200 A/);
    expect(beyond[1].explanation).toMatch(/^Ground-fault clearing at 3000 A is later than the 1 s/);
    // The same setting on a 400 A panel main at 208Y/120 V (120 V to ground) is outside 230.95(A).
    const office = input.devices!.find((d) => d.id === 'OFC-MAIN')! as { characteristic: { ground?: unknown } };
    office.characteristic.ground = { pickup: 1, delay: 1.2 };
    const panel = analyseStudy(parseStudy(input)).findings.filter((f) => f.basis === 'NFPA 70 230.95(A)');
    expect(panel.map((f) => f.subjects[0])).toEqual(['MAIN', 'MAIN']);
  });

  it('gives no NFPA 70 230.95 warning for a standby generator breaker, which is no service', () => {
    const input = demo('standby');
    const breaker = input.devices!.find((d) => d.id === 'GEN-CB')! as {
      characteristic: { kind: string; sensor?: number; ground?: unknown };
    };
    expect(breaker.characteristic.kind).toBe('trip-unit');
    breaker.characteristic.sensor = 1200;
    breaker.characteristic.ground = { pickup: 0.9, delay: 1.5 };
    const found = analyseScenarios(parseStudy(input)).findings.filter((f) => f.basis === 'NFPA 70 230.95(A)');
    expect(found.map((f) => f.subjects[0])).not.toContain('GEN-CB');
  });

  it('has the expected defaults: every series pair checked, findings for pairs, transformers, code, cables and motors', () => {
    const analysis = analyseStudy(parseStudy(demo('selective')));
    expect(analysis.pairs.map((p) => `${p.upstream}/${p.downstream}`)).toEqual([
      'R-T1/MAIN',
      'MAIN/FDR-MCC',
      'FDR-MCC/MCC-M1',
      'FDR-MCC/MCC-M2',
      'MAIN/FDR-DOCK',
      'MAIN/FDR-OFC',
      'FDR-OFC/OFC-MAIN',
      'MAIN/FDR-EM',
      'FDR-EM/EM-BR',
    ]);
    const kinds = new Set(analysis.findings.map((f) => f.kind));
    for (const kind of [
      'coordination',
      'transformer-withstand',
      'transformer-inrush',
      'nec-450.3',
      'cable-withstand',
      'motor-starting',
      'carry-load',
    ]) {
      expect(kinds).toContain(kind);
    }
    expect(analysis.counts.fail + analysis.counts.warning + analysis.counts.info + analysis.counts.ok).toBe(
      analysis.findings.length,
    );
  });

  it('refuses a study with a bus no source feeds, naming the way such a study is analysed', () => {
    // The standby demo's generator bus is fed only in the scenarios that run the generator.
    const standby = parseStudy(readFileSync('demo/harrowmere-standby.json', 'utf8'));
    expect(() => analyseStudy(standby)).toThrow(
      /^study\.buses: expected every bus fed by the source \(a study that can be switched goes through analyseScenarios\), got "GEN"$/,
    );
  });

  it('finds nothing failing in the selective demo, as its description claims', () => {
    expect(failing('selective')).toEqual([]);
  });

  it('checks pairs across the Δ–Y transformer for the secondary line-to-line case too (IEEE C37.91 / IEEE C57.109 delta–wye shift factors item 1)', () => {
    const analysis = analyseStudy(parseStudy(demo('selective')));
    const primary = analysis.pairs.find((p) => p.upstream === 'R-T1')!;
    expect(primary.cases.map((c) => c.fault)).toEqual(['three-phase', 'line-to-line']);
    expect(primary.cases[1].upstreamShift).toBeCloseTo(1.1547, 4);
    const office = analysis.pairs.find((p) => p.upstream === 'FDR-OFC')!;
    expect(office.cases[0].referenceVolts).toBe(208);
  });

  it('explains each overlap of the overlap demo and names the devices', () => {
    const titles = failing('overlap').map((f) => f.title);
    expect(titles).toContain('Main 2000 A over MCC feeder 600 A: overlap');
    expect(titles).toContain('Emergency feeder over Exhaust fan breaker 50 A: overlap');
    const mains = failing('overlap').filter((f) => f.title === 'Main 2000 A over MCC feeder 600 A: overlap');
    const main = mains[0];
    expect(main.explanation).toMatch(
      /^Between 7200 A and \d+(\.\d+)? kA at 480 V Main 2000 A may open before MCC feeder 600 A has cleared\./,
    );
    expect(main.worst!.marginSeconds).toBeLessThan(0);
    // Higher up the main's instantaneous trip overlaps the feeder: the finding there says to raise it.
    expect(mains.some((f) => /instantaneous pickup/.test(f.suggestion ?? ''))).toBe(true);
  });

  it('checks clean once the overlap demo is edited back to the selective settings', () => {
    const fixed = demo('overlap');
    type Settings = Record<string, Record<string, unknown>>;
    const device = (id: string) => fixed.devices!.find((d) => d.id === id)!.characteristic as unknown as Settings;
    delete device('MAIN').instantaneous;
    device('FDR-MCC').shortTime.delay = 0.2;
    device('FDR-EM').longTime.pickup = 0.8;
    expect(analyseStudy(parseStudy(fixed)).counts.fail).toBe(0);
  });

  it('reports the fused demo’s transformer protection problems: through-fault, NEC 450.3(A) and inrush', () => {
    const kinds = failing('fused').map((f) => `${f.kind} ${f.subjects.join('/')}`);
    expect(kinds).toContain('transformer-withstand F-T1/T1');
    expect(kinds).toContain('nec-450.3 F-T1/T1');
    expect(kinds).toContain('transformer-inrush FDR-OFC/T2');
    const nec = failing('fused').find((f) => f.kind === 'nec-450.3')!;
    // 300 % × 69.449 A = 208.3 A; above 1000 V the next E rating, 250E (NEC Table 450.3(A) note 1, from memory).
    expect(nec.explanation).toMatch(/300 A, 432 % of Service transformer's primary rated current 69\.45 A/);
    expect(nec.explanation).toMatch(/next E rating commercially available, 250E/);
  });

  it('gives the same findings whatever the order of the study’s lists', () => {
    const input = demo('overlap');
    const shuffled = {
      ...input,
      devices: [...input.devices!].reverse(),
      cables: [...input.cables!].reverse(),
      buses: [...input.buses].reverse(),
    };
    const ids = (study: StudyInput) =>
      analyseStudy(parseStudy(study))
        .findings.map((f) => `${f.id} ${f.severity} ${f.range?.fromAmps.toPrecision(6)}`)
        .sort();
    expect(ids(shuffled)).toEqual(ids(input));
  });
});
