import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { alsoRemoved, removalOf, withoutRemoval } from '../../../src/app/lib/removal.ts';
import { readStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
) as StudyInput;

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
});
