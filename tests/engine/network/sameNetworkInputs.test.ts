import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { sameNetworkInputs } from '../../../src/engine/network/sameNetworkInputs.ts';
import { readEditableStudy, readStudyEdit, type Study } from '../../../src/engine/study/index.ts';

const document = JSON.parse(readFileSync('demo/harrowmere-full.json', 'utf8')) as {
  devices: { feeds: string; rating?: string }[];
  buses: { name?: string }[];
};
const reading = readEditableStudy(document);
const study = reading.study!;
const edited = (change: (copy: typeof document) => typeof document): Study =>
  readStudyEdit(reading, change(document)).study!;

describe('sameNetworkInputs', () => {
  it('has the expected defaults: a study has its own network', () => {
    expect(sameNetworkInputs(study, study)).toBe(true);
  });

  it('sameNetworkInputs() holds for an edit of a device setting', () => {
    const next = edited((d) => ({
      ...d,
      devices: d.devices.map((x, i) => (i === 0 ? { ...x, rating: '1200 A' } : x)),
    }));
    expect(next.devices[0].rating).toBe(1200);
    expect(sameNetworkInputs(study, next)).toBe(true);
  });

  it('sameNetworkInputs() fails for a device that feeds something else, or a bus edited', () => {
    const moved = { ...study, devices: study.devices.map((d, i) => (i === 1 ? { ...d, feeds: 'elsewhere' } : d)) };
    expect(sameNetworkInputs(study, moved)).toBe(false);
    const bus = edited((d) => ({ ...d, buses: d.buses.map((b, i) => (i === 1 ? { ...b, name: 'Renamed bus' } : b)) }));
    expect(sameNetworkInputs(study, bus)).toBe(false);
    expect(sameNetworkInputs(study, { ...study, devices: study.devices.slice(1) })).toBe(false);
  });

  it('sameNetworkInputs() fails for a conductor temperature changed, holds for the same two in a new object', () => {
    const hotter = { ...study, conductorTemperatures: { maximumFault: 20, minimumFault: 150 } };
    expect(sameNetworkInputs(study, hotter)).toBe(false);
    const colder = { ...study, conductorTemperatures: { maximumFault: 5, minimumFault: 90 } };
    expect(sameNetworkInputs(study, colder)).toBe(false);
    const spelledOut = { ...study, conductorTemperatures: { maximumFault: 20, minimumFault: 90 } };
    expect(sameNetworkInputs(study, spelledOut)).toBe(true);
  });
});
