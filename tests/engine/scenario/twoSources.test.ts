import { describe, expect, it } from 'vitest';
import { analyseScenarios, scenarioPartsOf, scenariosOf } from '../../../src/engine/scenario/index.ts';
import { readStudy } from '../../../src/engine/study/index.ts';

/**
 * A 480 V emergency panel EP behind a transfer switch: normal side fed from the service switchboard
 * (20 kA available, all reactance), emergency side from a 500 kVA standby generator. Cable data are
 * entered per 1000 ft so the numbers below can be worked by hand with the ohmic method (IEEE 141).
 */
const trip = (sensor: number, delay: number) => ({
  kind: 'trip-unit',
  sensor,
  longTime: { pickup: 1, delay: 10 },
  shortTime: { pickup: 4, delay },
});
const twoSources = () => ({
  discern: 1,
  name: 'Two sources',
  source: { kind: 'utility', id: 'UTIL', bus: 'SWBD', max: { available: '20 kA' } },
  generators: [
    {
      id: 'G1',
      bus: 'GEN',
      rating: 500,
      voltage: 480,
      xdSubtransient: 0.12,
      xdTransient: 0.2,
      xd: 2,
      tdSubtransient: 0.015,
      tdTransient: 0.4,
      xr: 20,
      sustained: 3,
    },
  ],
  buses: [
    { id: 'SWBD', voltage: 480 },
    { id: 'ATS-N', voltage: 480 },
    { id: 'GEN', voltage: 480 },
    { id: 'ATS-E', voltage: 480 },
    { id: 'EP', voltage: 480 },
  ],
  cables: [
    { id: 'C-N', from: 'SWBD', to: 'ATS-N', size: '4/0', length: 100, resistance: 0.05, reactance: 0.05 },
    { id: 'C-E', from: 'GEN', to: 'ATS-E', size: '4/0', length: 100, resistance: 0.05, reactance: 0.05 },
  ],
  switches: [{ kind: 'transfer', id: 'ATS', normal: 'ATS-N', emergency: 'ATS-E', to: 'EP' }],
  devices: [
    { id: 'FDR-N', feeds: 'C-N', characteristic: trip(400, 0.3), system: 'emergency' },
    { id: 'GEN-CB', feeds: 'C-E', characteristic: trip(800, 0.3), system: 'emergency' },
    {
      id: 'EP-MAIN',
      feeds: 'EP',
      characteristic: { ...trip(100, 0.1), instantaneous: { pickup: 10 } },
      system: 'emergency',
    },
  ],
});

const studyOf = (input: object) => {
  const { study, problems } = readStudy(input);
  expect(problems).toEqual([]);
  return study!;
};

describe('a transfer switch fed from the utility and a standby generator', () => {
  it('has the default scenarios "normal" and "on generator" (NFPA 70 700.32 asks for both)', () => {
    expect(scenariosOf(studyOf(twoSources())).map((s) => s.id)).toEqual(['normal', 'on-generator']);
  });

  it('feeds EP from the utility in "normal": 277.13 V / |j0.013856 + 0.005 + j0.005| Ω = 14.21 kA (IEEE 141 ohmic method, worked by hand)', () => {
    const study = studyOf(twoSources());
    const [part] = scenarioPartsOf(study, scenariosOf(study)[0]);
    expect(part.sourceId).toBe('UTIL');
    const analysis = analyseScenarios(study, { only: 'normal' }).scenarios![0].parts[0];
    const zu = 480 / (Math.sqrt(3) * 20000); // all reactance
    const expected = 480 / Math.sqrt(3) / Math.hypot(0.005, zu + 0.005);
    expect(analysis.faults.buses.get('EP')!.max.threePhase).toBeCloseTo(expected, 0);
    expect(expected).toBeCloseTo(14206, 0);
    expect(analysis.pairs.map((p) => `${p.upstream}/${p.downstream}`)).toEqual(['FDR-N/EP-MAIN']);
  });

  it('feeds EP from G1 "on generator": X″d 0.12 pu on 500 kVA, X/R 20, plus the cable (IEEE Std 551 subtransient, worked by hand)', () => {
    const study = studyOf(twoSources());
    const result = analyseScenarios(study, { only: 'on-generator' }).scenarios![0];
    expect(result.parts.map((p) => p.study.source.id)).toEqual(['G1']);
    expect(result.deEnergised).toEqual(['SWBD', 'ATS-N']);
    const zBase = 480 ** 2 / 500e3; // 0.4608 Ω
    const zg = 0.12 * zBase; // |Z″| = 0.055296 Ω
    const rg = zg / Math.hypot(1, 20);
    const expected = 480 / Math.sqrt(3) / Math.hypot(rg + 0.005, 20 * rg + 0.005);
    const analysis = result.parts[0];
    expect(analysis.faults.buses.get('EP')!.max.threePhase).toBeCloseTo(expected, 0);
    expect(analysis.faults.buses.get('GEN')!.max.threePhase).toBeCloseTo(601.407 / 0.12, 0);
    expect(analysis.pairs.map((p) => `${p.upstream}/${p.downstream}`)).toEqual(['GEN-CB/EP-MAIN']);
    // The minimum is the excitation support's sustained 3 × rated current at the terminals.
    expect(analysis.faults.buses.get('GEN')!.min.threePhase).toBeCloseTo(3 * 601.407, 0);
  });

  it('says in which scenarios each finding holds', () => {
    const analysis = analyseScenarios(studyOf(twoSources()));
    const pair = (up: string) => analysis.findings.find((f) => f.kind === 'coordination' && f.subjects[0] === up)!;
    expect(pair('FDR-N').scenarios).toEqual(['Normal']);
    expect(pair('GEN-CB').scenarios).toEqual(['On generator']);
    const code = analysis.findings.find((f) => f.id === 'code-selectivity:EP-MAIN')!;
    expect(code.basis).toBe('NFPA 70 (2023) 700.32');
    expect(code.scenarios).toEqual(['Normal', 'On generator']);
    expect(code.explanation).toMatch(/authority having jurisdiction/);
  });

  it('fails the 700.32 finding when the generator breaker has an instantaneous element EP-MAIN cannot be told apart from', () => {
    const input = twoSources();
    (input.devices[1].characteristic as Record<string, unknown>).instantaneous = { pickup: 4 };
    const analysis = analyseScenarios(studyOf(input));
    const code = analysis.findings.find((f) => f.id === 'code-selectivity:EP-MAIN')!;
    expect(code.severity).toBe('fail');
    expect(code.explanation).toMatch(/On generator: .*GEN-CB and EP-MAIN/);
    expect(code.explanation).not.toMatch(/Normal:/);
  });

  it('accepts overlaps faster than 0.1 s with the study option "above-0.1-s" (some authorities having jurisdiction)', () => {
    const input = { ...twoSources(), coordination: { codeSelectivity: 'above-0.1-s' } };
    (input.devices[1].characteristic as Record<string, unknown>).instantaneous = { pickup: 4 };
    const code = analyseScenarios(studyOf(input)).findings.find((f) => f.id === 'code-selectivity:EP-MAIN')!;
    expect(code.severity).toBe('ok');
  });

  it('names the scenario when a closed tie feeds a bus twice', () => {
    const input = {
      ...twoSources(),
      switches: [...twoSources().switches, { kind: 'tie', id: 'TIE', from: 'ATS-N', to: 'ATS-E', normally: 'open' }],
      scenarios: [
        { id: 'normal' },
        { id: 'tied', name: 'Tie closed', sources: ['UTIL', 'G1'], switches: { TIE: 'closed' } },
      ],
    };
    expect(readStudy(input).problems).toEqual([
      {
        path: 'study.switches[1].to',
        message: 'expected a bus fed only once in scenario "Tie closed" (C-E already feeds it), got "ATS-E"',
      },
    ]);
  });

  it('refuses an unknown scenario by name, listing the ids', () => {
    expect(() => analyseScenarios(studyOf(twoSources()), { only: 'island' })).toThrow(
      'scenario: expected one of "normal", "on-generator", got "island"',
    );
  });
});

describe("a generator's own damage curve", () => {
  it('is read from the study, current rising and time falling', () => {
    const input = twoSources();
    (input.generators[0] as Record<string, unknown>).damage = [
      { current: '1.2 kA', time: 60 },
      { current: '2 kA', time: 10 },
    ];
    expect(readStudy(input).problems).toEqual([]);
    (input.generators[0] as Record<string, unknown>).damage = [
      { current: '2 kA', time: 60 },
      { current: '1.2 kA', time: 10 },
    ];
    expect(readStudy(input).problems).toEqual([
      {
        path: 'study.generators[0].damage[1]',
        message: 'expected a point at a higher current and a shorter time than the one before, got "1200 A, 10 s"',
      },
    ]);
  });
});
