import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { analysisOfPart, findingsIn, placeOfView, scenarioViewOf } from '../../../src/app/lib/scenarioParts.ts';
import { analyseScenarios, scenariosOf } from '../../../src/engine/scenario/index.ts';
import type { Finding } from '../../../src/engine/checks/finding.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const read = (name: string) => parseStudy(readFileSync(new URL(`../../../demo/${name}`, import.meta.url), 'utf8'));
const standby = read('harrowmere-standby-overlap.json');
const plain = read('harrowmere-selective.json');
const [normal, onGenerator, tieClosed] = scenariosOf(standby);

describe('scenarioParts', () => {
  it('has the expected defaults: a study that cannot be switched is its own single tree, nothing dark', () => {
    const view = scenarioViewOf(plain, scenariosOf(plain)[0]);
    expect(view.label).toBe('Normal');
    expect(view.parts.map((p) => p.sourceId)).toEqual(['UTIL']);
    expect(view.parts[0].study).toBe(plain);
    expect(view.deEnergised).toEqual([]);
  });

  it('scenarioViewOf() energises the utility tree normally and the generator tree on the generator', () => {
    const utility = scenarioViewOf(standby, normal);
    expect(utility.parts.map((p) => p.sourceId)).toEqual(['UTIL']);
    expect(utility.deEnergised).toEqual(['GEN', 'ATS-E']);
    const generator = scenarioViewOf(standby, onGenerator);
    expect(generator.label).toBe('On generator');
    expect(generator.parts.map((p) => p.sourceId)).toEqual(['G1']);
    expect([...generator.parts[0].network.buses.keys()].sort()).toEqual(['ATS-E', 'EMP', 'GEN']);
    expect(generator.deEnergised).toEqual(['MV', 'SWBD', 'MCC', 'DOCK', 'OFC-P', 'OFC', 'ATS-N']);
    // Each part's fault levels are its own: the generator bus has one only on the generator.
    expect(generator.parts[0].faults.buses.get('GEN')?.max.threePhase).toBeGreaterThan(0);
    expect(utility.parts[0].faults.buses.has('GEN')).toBe(false);
  });

  it("scenarioViewOf() agrees with the engine's scenario results", () => {
    const engine = analyseScenarios(standby).scenarios!;
    for (const [i, scenario] of [normal, onGenerator, tieClosed].entries()) {
      const view = scenarioViewOf(standby, scenario);
      expect(view.deEnergised).toEqual(engine[i].deEnergised);
      expect(view.parts.map((p) => p.sourceId)).toEqual(engine[i].parts.map((p) => p.study.source.id));
      view.parts.forEach((part, j) =>
        expect(part.faults.buses.get(part.study.source.bus)?.max).toEqual(
          engine[i].parts[j].faults.buses.get(part.study.source.bus)?.max,
        ),
      );
    }
  });

  it('placeOfView() takes the tree holding the most of a view, and lists what it leaves out', () => {
    const generator = scenarioViewOf(standby, onGenerator);
    const emergency = standby.views.find((v) => v.id === 'emergency')!;
    expect(emergency.devices).toEqual(['MAIN', 'FDR-EM', 'EM-BR']);
    const place = placeOfView(generator, 'emergency', emergency.devices);
    expect(place.part?.sourceId).toBe('G1');
    expect(place.left).toEqual(['MAIN', 'FDR-EM']);
    const service = standby.views.find((v) => v.id === 'service')!;
    expect(placeOfView(generator, 'service', service.devices)).toEqual({ left: service.devices });
    expect(placeOfView(scenarioViewOf(standby, normal), 'service', service.devices).left).toEqual([]);
  });

  it('analysisOfPart() counts the findings it is given, by severity', () => {
    const part = scenarioViewOf(standby, onGenerator).parts[0];
    const finding = (id: string, severity: Finding['severity']) =>
      ({ id, severity, kind: 'coordination', title: id, explanation: '', subjects: [] }) as unknown as Finding;
    const analysis = analysisOfPart(part, [], [finding('a', 'fail'), finding('b', 'fail'), finding('c', 'ok')]);
    expect(analysis.counts).toEqual({ ok: 1, info: 0, warning: 0, fail: 2 });
    expect(analysis.network).toBe(part.network);
    expect(analysis.study.source.id).toBe('G1');
  });

  it('findingsIn() keeps the findings listing the scenario, and those naming none', () => {
    const findings = [
      { id: 'both', scenarios: ['Normal', 'On generator'] },
      { id: 'generator', scenarios: ['On generator'] },
      { id: 'everywhere' },
    ] as unknown as Finding[];
    expect(findingsIn(findings, 'Normal').map((f) => f.id)).toEqual(['both', 'everywhere']);
    expect(findingsIn(findings, 'On generator').map((f) => f.id)).toEqual(['both', 'generator', 'everywhere']);
    expect(findingsIn(findings, 'Elsewhere').map((f) => f.id)).toEqual(['everywhere']);
  });
});
