import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { networkOf } from '../../../src/engine/network/index.ts';
import { scenarioPartsOf, scenariosOf } from '../../../src/engine/scenario/index.ts';
import { switchSettingsOf } from '../../../src/engine/scenario/scenarioParts.ts';
import { parseStudy, type Study } from '../../../src/engine/study/index.ts';

/**
 * The standby demo (invented site): the transfer switch ATS feeds the emergency panel EMP from ATS-N
 * (the utility, through C-EM) or ATS-E (the generator G1, through C-GEN); the tie TIE, normally open,
 * joins the office transformer primary OFC-P to the dock panel DOCK. Scenarios: "Normal" (utility
 * alone), "On generator" (G1 alone, ATS on emergency), "Dock on the office feeder" (TIE closed, C-DOCK out).
 */
const standby = (): Study => parseStudy(readFileSync('demo/harrowmere-standby.json', 'utf8'));

function partsIn(study: Study, scenarioId: string) {
  return scenarioPartsOf(
    study,
    scenariosOf(study).find((s) => s.id === scenarioId)!,
  );
}

describe('scenarioPartsOf', () => {
  it("keeps each switch's own kind and scenario position (switchSettingsOf) while the part's network sees closed ties only", () => {
    const study = standby();
    const [normal] = partsIn(study, 'normal');
    // What the network and the fault code read: the ATS on its normal side as a closed tie, no TIE at all.
    expect(normal.study.switches).toEqual([
      { kind: 'tie', id: 'ATS', name: 'Emergency transfer switch', from: 'ATS-N', to: 'EMP', normally: 'closed' },
    ]);
    expect(networkOf(normal.study).elements.has('TIE')).toBe(false);
    // What the diagram reads: the study's own switches, the transfer switch on normal, the tie open.
    expect(switchSettingsOf(normal.study)!.map((s) => [s.switch.id, s.switch.kind, s.position])).toEqual([
      ['ATS', 'transfer', 'normal'],
      ['TIE', 'tie', 'open'],
    ]);
    expect(switchSettingsOf(normal.study)![0].switch).toBe(study.switches[0]);

    const [generator] = partsIn(study, 'on-generator');
    expect(generator.sourceId).toBe('G1');
    expect(generator.study.switches).toEqual([
      { kind: 'tie', id: 'ATS', name: 'Emergency transfer switch', from: 'ATS-E', to: 'EMP', normally: 'closed' },
    ]);
    // The tie's buses are dark on the generator: it is no part of G1's tree.
    expect(switchSettingsOf(generator.study)!.map((s) => [s.switch.id, s.position])).toEqual([['ATS', 'emergency']]);

    const [tied] = partsIn(study, 'tie-closed');
    expect(switchSettingsOf(tied.study)!.map((s) => [s.switch.id, s.position])).toEqual([
      ['ATS', 'normal'],
      ['TIE', 'closed'],
    ]);
  });

  it('hides the settings from keys and JSON, so comparisons and copies of a part read what they did', () => {
    const [normal] = partsIn(standby(), 'normal');
    expect(Object.keys(normal.study)).not.toContain('switchSettings');
    expect(JSON.stringify(normal.study)).not.toMatch(/"position"/);
    // A study that cannot be switched is not split and carries none.
    const plain = parseStudy(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    expect(switchSettingsOf(scenarioPartsOf(plain, scenariosOf(plain)[0])[0].study)).toBeUndefined();
  });

  it('notes on the generator sheet in "Normal" that the generator breaker, the generator and its cable are not energised', () => {
    const [normal] = partsIn(standby(), 'normal');
    const view = normal.study.views.find((v) => v.id === 'emergency-generator')!;
    // The sheet keeps the fan breaker and motor the utility reaches through the ATS ...
    expect([view.devices, view.withstand, view.motors]).toEqual([['EM-BR'], [], ['M-EXH']]);
    // ... and says what it leaves out, by name, where it used to drop them silently.
    expect(view.notes).toBe(
      'Not energised in "Normal", so not drawn: Generator breaker 600 A, Standby generator 300 kVA (illustrative), Generator cable.',
    );
  });

  it('notes which source feeds what a view leaves to another tree: both sources in, ATS on normal', () => {
    const study = standby();
    const both = { id: 'both', name: 'Both sources', sources: ['UTIL', 'G1'], switches: {}, outOfService: [] };
    const [utility, generator] = scenarioPartsOf({ ...study, scenarios: [both] }, both);
    expect([utility.sourceId, generator.sourceId]).toEqual(['UTIL', 'G1']);
    // G1 runs unloaded behind the open emergency side: its breaker, cable and curves are on its own tree.
    expect(utility.study.views.find((v) => v.id === 'emergency-generator')!.notes).toBe(
      'Fed from G1 in "Both sources", so drawn on its sheet for that source: Generator breaker 600 A, Standby generator 300 kVA (illustrative), Generator cable.',
    );
    expect(generator.study.views.find((v) => v.id === 'emergency-generator')!.notes).toBe(
      'Fed from UTIL in "Both sources", so drawn on its sheet for that source: Exhaust fan breaker 50 A, Smoke exhaust fan.',
    );
  });

  it('leaves a view its part holds whole as it was, but for the title naming the scenario', () => {
    const study = standby();
    const [normal] = partsIn(study, 'normal');
    const service = study.views.find((v) => v.id === 'service')!;
    expect(normal.study.views.find((v) => v.id === 'service')).toEqual({
      ...service,
      title: `${service.title} — Normal`,
    });
  });
});
