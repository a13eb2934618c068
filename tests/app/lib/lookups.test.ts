import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import {
  bandsByDevice,
  bandsOf,
  findingCountsOf,
  findingCountsWith,
  idSetOf,
  lookupOf,
} from '../../../src/app/lib/lookups.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { bandOf } from '../../../src/engine/band.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

describe('lookups', () => {
  it('has the expected defaults', () => {
    expect(findingCountsOf([]).size).toBe(0);
    expect(idSetOf([]).size).toBe(0);
  });

  it('bandsOf() gives every device the engine band of its characteristic', () => {
    const study = parseStudy(readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'));
    const bands = bandsOf(study);
    expect([...bands.keys()]).toEqual(study.devices.map((d) => d.id));
    const main = study.devices.find((d) => d.id === 'MAIN')!;
    expect(bands.get('MAIN')!.maxTime(20_000)).toBe(bandOf(main.characteristic).maxTime(20_000));
  });

  it('bandsByDevice() gives each device of a lookup its band when asked, and covers every device', () => {
    const study = parseStudy(readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'));
    const devices = new Map(study.devices.map((d) => [d.id, d]));
    const bands = bandsByDevice(devices);
    expect(bands.size).toBe(study.devices.length);
    expect(bands.has('MAIN')).toBe(true);
    expect(bands.get('NOWHERE')).toBeUndefined();
    expect([...bands.keys()]).toEqual(study.devices.map((d) => d.id));
    const main = devices.get('MAIN')!;
    expect(bands.get('MAIN')!.minTime(20_000)).toBe(bandOf(main.characteristic).minTime(20_000));
    expect(bands.get('MAIN')).toBe(bands.get('MAIN'));
    expect([...bands].map(([id, band]) => [id, band.maxTime(5_000)])).toEqual(
      study.devices.map((d) => [d.id, bandOf(d.characteristic).maxTime(5_000)]),
    );
  });

  it('findingCountsWith() gives what counting the changed findings afresh gives (property, the full demo)', () => {
    const study = parseStudy(readFileSync(new URL('../../../demo/harrowmere-full.json', import.meta.url), 'utf8'));
    const findings = analyseStudy(study).findings;
    const index = fc.nat({ max: findings.length - 1 });
    fc.assert(
      fc.property(fc.uniqueArray(index), fc.uniqueArray(index), fc.array(index), (base, gone, added) => {
        const before = base.map((i) => findings[i]);
        const leaving = gone.filter((i) => base.includes(i)).map((i) => findings[i]);
        const joining = added.map((i) => findings[i]);
        const after = [...before.filter((f) => !leaving.includes(f)), ...joining];
        const counts = findingCountsOf(before);
        expect(findingCountsWith(counts, leaving, joining)).toEqual(findingCountsOf(after));
        expect(counts).toEqual(findingCountsOf(before));
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it('findingCountsOf() counts, per device, all findings naming it and those that fail or warn', () => {
    const base = { kind: 'coordination' as const, title: '', explanation: '', referenceVolts: 480 };
    const counts = findingCountsOf([
      { ...base, id: 'a', severity: 'fail', subjects: ['MAIN', 'FDR'] },
      { ...base, id: 'b', severity: 'ok', subjects: ['MAIN'] },
      { ...base, id: 'c', severity: 'warning', subjects: ['FDR'] },
    ]);
    expect(counts.get('MAIN')).toEqual({ all: 2, problems: 1 });
    expect(counts.get('FDR')).toEqual({ all: 2, problems: 2 });
  });

  it('lookupOf() and idSetOf() index by id', () => {
    const colours = lookupOf(
      [{ id: 'MAIN', colour: '#E69F00' }],
      (c) => c.id,
      (c) => c.colour,
    );
    expect(colours.get('MAIN')).toBe('#E69F00');
    expect(idSetOf(['MAIN']).has('MAIN')).toBe(true);
  });
});
