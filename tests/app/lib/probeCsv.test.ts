import { describe, it, expect } from 'vitest';
import { csvCell, probesCsv } from '../../../src/app/lib/probeCsv.ts';
import type { Probe } from '../../../src/engine/probe.ts';

describe('probeCsv', () => {
  it('has the expected defaults', () => {
    expect(probesCsv([]).trimEnd().split('\n')[1]).toBe(
      'amps at reference,reference V,device,own amps,own V,min time s,max time s,clears first,margin s',
    );
  });

  it('probesCsv() writes one row per pinned probe and device, blank where a device does not operate', () => {
    const probe: Probe = {
      amps: 20000,
      referenceVolts: 480,
      readings: [
        { deviceId: 'MAIN', name: 'Main', ownAmps: 20000, ownVolts: 480, minTime: 0.35, maxTime: 0.45 },
        { deviceId: 'R-T1', name: 'Relay', ownAmps: 769.9, ownVolts: 12470, minTime: Infinity, maxTime: Infinity },
      ],
      first: 'MAIN',
      margin: Infinity,
      summary: 'Main clears first',
    };
    const lines = probesCsv([probe]).trimEnd().split('\n');
    expect(lines[0]).toMatch(/^"# For review by a qualified engineer/);
    expect(lines[2]).toBe('20000,480,MAIN,20000,480,0.35,0.45,yes,no limit');
    expect(lines[3]).toBe('20000,480,R-T1,769.9,12470,,,,');
  });

  it('csvCell() quotes only cells that need it', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a, b')).toBe('"a, b"');
    expect(csvCell('say "x"')).toBe('"say ""x"""');
    expect(csvCell('a\nb')).toBe('"a\nb"');
  });

  it.each([
    ['=1+2', "'=1+2"],
    ['+1+cmd', "'+1+cmd"],
    ['-1+2', "'-1+2"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\tcmd', "'\tcmd"],
    ['\r=cmd', '"\'\r=cmd"'],
    ['-0.25', '-0.25'],
  ])('csvCell() neutralises formula injection (OWASP CSV Injection): %j', (cell, safe) => {
    expect(csvCell(cell)).toBe(safe);
  });
});
