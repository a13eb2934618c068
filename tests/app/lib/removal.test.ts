import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { alsoRemoved, removalOf, withoutRemoval } from '../../../src/app/lib/removal.ts';
import { readStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const demoOf = (file: string) =>
  JSON.parse(readFileSync(new URL(`../../../demo/${file}`, import.meta.url), 'utf8')) as StudyInput;
const demo = demoOf('harrowmere-selective.json');
const standby = demoOf('harrowmere-standby.json');
const problemsOf = (document: StudyInput) => readStudy(document).problems.map((p) => `${p.path}: ${p.message}`);

describe('removal', () => {
  it('has the expected defaults: the source, its bus and views are not removed this way', () => {
    expect(removalOf(demo, { kind: 'source', id: demo.source.id })).toBeUndefined();
    expect(removalOf(demo, { kind: 'bus', id: demo.source.bus })).toBeUndefined();
    expect(removalOf(demo, { kind: 'view', id: 'service' })).toBeUndefined();
    expect(removalOf(demo, { kind: 'cable', id: 'NO-SUCH-CABLE' })).toBeUndefined();
  });

  it('removalOf(cable) takes its feeder device, the bus it feeds, the motors there and their devices', () => {
    const removal = removalOf(demo, { kind: 'cable', id: 'C-MCC' })!;
    expect(removal).toMatchObject({
      cables: ['C-MCC'],
      buses: ['MCC'],
      transformers: [],
      motors: ['M-COMP1', 'M-COMP2'],
      devices: ['FDR-MCC', 'MCC-M1', 'MCC-M2'],
      views: [],
    });
    expect(alsoRemoved(removal)).toBe('devices FDR-MCC, MCC-M1 and MCC-M2; bus MCC; motors M-COMP1 and M-COMP2');
  });

  it('withoutRemoval() leaves a valid study: views, withstand and starting curves lose the removed ids', () => {
    const next = withoutRemoval(demo, removalOf(demo, { kind: 'cable', id: 'C-MCC' })!);
    expect(readStudy(next).problems).toEqual([]);
    const service = next.views!.find((v) => v.id === 'service')!;
    expect(service.devices).toEqual(['R-T1', 'MAIN']);
    expect(service.withstand).toEqual(['T1']);
    expect(service.motors).toEqual([]);
    // Untouched views are the same objects (the undo history shares them).
    expect(next.views!.find((v) => v.id === 'office')).toBe(demo.views!.find((v) => v.id === 'office'));
  });

  it('removalOf(bus) takes the branch feeding it and everything below; a view left empty goes too', () => {
    const removal = removalOf(demo, { kind: 'bus', id: 'OFC-P' })!;
    expect(removal).toMatchObject({
      buses: ['OFC-P', 'OFC'],
      transformers: ['T2'],
      cables: ['C-OFC'],
      devices: ['FDR-OFC', 'OFC-MAIN'],
      views: ['office'],
    });
    const next = withoutRemoval(demo, removal);
    expect(readStudy(next).problems).toEqual([]);
    expect(next.views!.map((v) => v.id)).toEqual(['service', 'primary', 'emergency']);
  });

  it('removalOf(transformer) at the service takes the whole system below it', () => {
    const removal = removalOf(demo, { kind: 'transformer', id: 'T1' })!;
    expect(removal.buses).toEqual(demo.buses.filter((b) => b.id !== demo.source.bus).map((b) => b.id));
    expect(removal.devices).toEqual(demo.devices!.map((d) => d.id));
    const next = withoutRemoval(demo, removal);
    expect(next.views).toEqual([]);
    expect(readStudy(next).problems).toEqual([]);
  });

  it('removalOf(motor) and removalOf(device) take only their own part', () => {
    const motor = removalOf(demo, { kind: 'motor', id: 'M-EXH' })!;
    expect(motor).toMatchObject({ motors: ['M-EXH'], devices: ['EM-BR'], buses: [], views: [] });
    expect(alsoRemoved(motor)).toBe('device EM-BR');
    const device = removalOf(demo, { kind: 'device', id: 'FDR-DOCK' })!;
    expect(device).toMatchObject({ devices: ['FDR-DOCK'], cables: [], views: [] });
    expect(alsoRemoved(device)).toBe('');
  });

  it('per-pair margins naming a removed device are dropped with it', () => {
    const withPair = {
      ...demo,
      coordination: { pairs: [{ upstream: 'MAIN', downstream: 'FDR-MCC', margin: '0.3 s' }] },
    } as StudyInput;
    const next = withoutRemoval(withPair, removalOf(withPair, { kind: 'device', id: 'FDR-MCC' })!);
    expect(next.coordination?.pairs).toEqual([]);
  });

  it('works on a document mid-edit: a loop is walked once, a 5,000-level chain without a stack limit', () => {
    const looped = structuredClone(demo);
    looped.cables!.find((c) => c.id === 'C-DOCK')!.from = 'MCC';
    looped.cables!.find((c) => c.id === 'C-MCC')!.from = 'DOCK';
    expect(removalOf(looped, { kind: 'bus', id: 'MCC' })!.buses).toEqual(['MCC', 'DOCK']);
    const buses = [{ id: 'B0', voltage: '480 V' }];
    const cables = [];
    for (let i = 1; i <= 5000; i++) {
      buses.push({ id: `B${i}`, voltage: '480 V' });
      cables.push({ id: `C${i}`, from: `B${i - 1}`, to: `B${i}`, size: '4/0', length: '1 ft' });
    }
    const deep = { ...demo, buses, cables, transformers: [], motors: [], devices: [], views: [] } as StudyInput;
    deep.source = { ...demo.source, bus: 'B0' };
    expect(removalOf(deep, { kind: 'cable', id: 'C1' })!.buses).toHaveLength(5000);
  });

  describe('on a study with switches, generators and scenarios', () => {
    it('cable C-DOCK takes the tie at its bus and the scenario that was only about it', () => {
      const removal = removalOf(standby, { kind: 'cable', id: 'C-DOCK' })!;
      expect(removal).toMatchObject({
        cables: ['C-DOCK'],
        buses: ['DOCK'],
        devices: ['FDR-DOCK'],
        switches: ['TIE'],
        generators: [],
        scenarios: ['tie-closed'],
        trimmedScenarios: [],
      });
      expect(alsoRemoved(removal)).toBe('device FDR-DOCK; bus DOCK; switch TIE; scenario tie-closed');
      const next = withoutRemoval(standby, removal);
      expect(problemsOf(next)).toEqual([]);
      expect(next.switches!.map((w) => w.id)).toEqual(['ATS']);
      expect(next.scenarios!.map((s) => s.id)).toEqual(['normal', 'on-generator']);
      // The scenario left alone is the same object as before.
      expect(next.scenarios![1]).toBe(standby.scenarios![1]);
    });

    it('bus DOCK takes the cable feeding it and, the same way, the tie and the scenario', () => {
      const removal = removalOf(standby, { kind: 'bus', id: 'DOCK' })!;
      expect(removal).toMatchObject({ cables: ['C-DOCK'], switches: ['TIE'], scenarios: ['tie-closed'] });
      expect(problemsOf(withoutRemoval(standby, removal))).toEqual([]);
    });

    it('bus SWBD takes both switches, the emergency panel only the transfer switch fed, and the switch’s position', () => {
      const removal = removalOf(standby, { kind: 'bus', id: 'SWBD' })!;
      expect(removal.switches).toEqual(['ATS', 'TIE']);
      // EMP was fed only through the transfer switch, whose normal side went.
      expect(removal.buses).toEqual(['SWBD', 'MCC', 'DOCK', 'OFC-P', 'OFC', 'EMP', 'ATS-N']);
      expect(removal.motors).toContain('M-EXH');
      expect(removal).toMatchObject({ generators: [], scenarios: ['tie-closed'], trimmedScenarios: ['on-generator'] });
      expect(alsoRemoved(removal)).toMatch(
        /; switches ATS and TIE; sheets service, primary, office and emergency; scenario tie-closed; entries naming them in scenario on-generator$/,
      );
      const next = withoutRemoval(standby, removal);
      expect(problemsOf(next)).toEqual([]);
      expect(next.scenarios!.find((s) => s.id === 'on-generator')).toMatchObject({ sources: ['G1'], switches: {} });
      // The generator's side stays: its bus, cable and breaker, and its sheet without the motor that went.
      expect(next.generators!.map((g) => g.id)).toEqual(['G1']);
      expect(next.views!.map((v) => v.id)).toEqual(['emergency-generator']);
      expect(next.views![0]).toMatchObject({ devices: ['GEN-CB'], motors: [], withstand: ['G1', 'C-GEN'] });
    });

    it('bus GEN takes the generator on it, and the scenario that ran on that generator alone', () => {
      const removal = removalOf(standby, { kind: 'bus', id: 'GEN' })!;
      expect(removal).toMatchObject({
        generators: ['G1'],
        switches: ['ATS'],
        cables: ['C-GEN'],
        scenarios: ['on-generator'],
        trimmedScenarios: [],
      });
      const next = withoutRemoval(standby, removal);
      expect(problemsOf(next)).toEqual([]);
      expect(next.generators).toEqual([]);
    });

    it('a scenario that still fixes something of its own stays, without the entries naming what went', () => {
      const removal = removalOf(standby, { kind: 'cable', id: 'C-OFC' })!;
      expect(removal).toMatchObject({ switches: ['TIE'], scenarios: [], trimmedScenarios: ['tie-closed'] });
      expect(alsoRemoved(removal)).toBe(
        'devices FDR-OFC and OFC-MAIN; transformer T2; buses OFC-P and OFC; switch TIE; sheet office; entries naming them in scenario tie-closed',
      );
      const next = withoutRemoval(standby, removal);
      expect(problemsOf(next)).toEqual([]);
      expect(next.scenarios!.find((s) => s.id === 'tie-closed')).toMatchObject({
        switches: {},
        outOfService: ['C-DOCK'],
      });
    });

    it('a motor or a device touches no switch or scenario', () => {
      const removal = removalOf(standby, { kind: 'motor', id: 'M-EXH' })!;
      expect(removal).toMatchObject({ switches: [], generators: [], scenarios: [], trimmedScenarios: [] });
      const next = withoutRemoval(standby, removal);
      expect(next.switches).toBe(standby.switches);
      expect(next.scenarios).toBe(standby.scenarios);
      expect(problemsOf(next)).toEqual([]);
    });
  });
});
