import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import {
  freeIdOf,
  newStudyDocument,
  newViewOf,
  withNewBranch,
  withNewMotor,
  withoutDevice,
  withoutMotor,
} from '../../../src/app/lib/newItems.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, readStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
) as StudyInput;
const network = networkOf(parseStudy(demo));

describe('newItems', () => {
  it('has the expected defaults', () => {
    const { study, problems } = readStudy(newStudyDocument());
    expect(problems).toEqual([]);
    expect(study?.buses[0].voltage).toBe(12_470);
  });

  it('newViewOf() shows a device and every device above it, on its own bus voltage as written', () => {
    const view = newViewOf(demo, network, 'MCC-M1')!;
    expect(view.devices).toEqual(['R-T1', 'MAIN', 'FDR-MCC', 'MCC-M1']);
    expect(view.referenceVoltage).toBe(demo.buses.find((b) => b.id === 'MCC')!.voltage);
    expect(view.id).toBe(`V${(demo.views ?? []).length + 1}`);
    expect(readStudy({ ...demo, views: [...(demo.views ?? []), view] }).problems).toEqual([]);
    expect(newViewOf(demo, network, 'NOPE')).toBeUndefined();
  });

  it('newViewOf() draws the path’s transformer and cable withstand curves and the motor’s starting by default', () => {
    const view = newViewOf(demo, network, 'MCC-M1')!;
    const kinds = (ids: string[]) => ids.map((id) => network.elements.get(id)!.type);
    expect(view.withstand!.length).toBeGreaterThanOrEqual(2);
    expect(new Set(kinds(view.withstand!))).toEqual(new Set(['transformer', 'cable']));
    expect(view.motors).toEqual([demo.devices!.find((d) => d.id === 'MCC-M1')!.feeds]);
  });

  it('freeIdOf() gives an id no item of the study has', () => {
    expect(freeIdOf(demo, 'C')).toBe('C-1');
    expect(freeIdOf({ ...demo, buses: [...demo.buses, { id: 'C-1', voltage: 480 }] }, 'C')).toBe('C-2');
  });

  it('withNewBranch() adds a cable or a transformer to a new bus and the study stays valid', () => {
    const cable = withNewBranch(demo, 'SWBD', 'cable', 480);
    expect(cable.cables!.at(-1)).toMatchObject({ from: 'SWBD', to: cable.buses.at(-1)!.id });
    expect(readStudy(cable).problems).toEqual([]);
    const transformer = withNewBranch(demo, 'SWBD', 'transformer', 480);
    expect(transformer.transformers!.at(-1)).toMatchObject({ from: 'SWBD', secondary: '208 V' });
    expect(readStudy(transformer).problems).toEqual([]);
    expect(withNewBranch(demo, 'MV', 'transformer', 12_470).transformers!.at(-1)?.secondary).toBe('480 V');
    expect(() => withNewBranch(demo, 'NOPE', 'cable', 480)).toThrow(/^study\.buses: expected a bus "NOPE", got none$/);
  });

  it('withNewMotor() adds a motor to a bus', () => {
    const next = withNewMotor(demo, 'MCC');
    expect(next.motors!.at(-1)).toMatchObject({ bus: 'MCC', hp: 50 });
    expect(readStudy(next).problems).toEqual([]);
  });

  it('withoutDevice() and withoutMotor() take an item off the study and every view, leaving it valid', () => {
    const fewer = withoutDevice(demo, 'MAIN');
    expect(fewer.devices!.some((d) => d.id === 'MAIN')).toBe(false);
    expect(fewer.views!.every((v) => !v.devices.includes('MAIN'))).toBe(true);
    expect(readStudy(fewer).problems).toEqual([]);
    const motor = demo.motors![0];
    const noMotor = withoutMotor(demo, motor.id);
    expect(noMotor.motors!.some((m) => m.id === motor.id)).toBe(false);
    expect(noMotor.devices!.some((d) => d.feeds === motor.id)).toBe(false);
    expect(readStudy(noMotor).problems).toEqual([]);
  });
});
