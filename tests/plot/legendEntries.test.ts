import { describe, expect, it } from 'vitest';
import { legendEntriesOf } from '../../src/plot/legendEntries.ts';
import { fixtureInput } from './fixtures.ts';

const codes = {
  colours: new Map([
    ['R1', '#000000'],
    ['CB1', '#E69F00'],
    ['R2', '#56B4E9'],
    ['TX1', '#009E73'],
    ['M1', '#0072B2'],
  ]),
  coincident: new Map([['R2', true]]),
  dashes: new Map([['R2', '10 3']]),
  patternIds: new Map([['overlap', 'tcc-hatch-1']]),
  markerColours: ['#009E73'],
};

describe('legendEntriesOf', () => {
  it('has the expected defaults', () => {
    const entries = legendEntriesOf(fixtureInput(), codes);
    expect([...new Set(entries.map((e) => e.group))]).toEqual([
      'Devices',
      'Withstand (damage) curves',
      'Motor starting',
      'Markers',
      'Fault current',
      'Findings on this sheet',
    ]);
  });

  it('legendEntriesOf draws each entry in its curve code: fill, dash, dots, symbol, hatch', () => {
    const entries = legendEntriesOf(fixtureInput(), codes);
    const swatch = (text: string) => entries.find((e) => e.text.startsWith(text))!.swatch;
    expect(swatch('Relay R1')).toEqual({ kind: 'band', colour: '#000000', coincident: false, dash: undefined });
    expect(swatch('Relay R2')).toEqual({ kind: 'band', colour: '#56B4E9', coincident: true, dash: '10 3' });
    expect(swatch('TX1 through-fault')).toMatchObject({ kind: 'line', dash: '7 4' });
    expect(swatch('Compressor 1')).toMatchObject({ kind: 'line', dash: '1.5 3.5', round: true });
    expect(swatch('TX1 inrush')).toEqual({ kind: 'symbol', colour: '#009E73', symbol: 'inrush' });
    expect(swatch('Minimum')).toMatchObject({ kind: 'line', dash: '9 3 2 3' });
    expect(swatch('Overlap')).toEqual({ kind: 'hatch', colour: '#D55E00', patternId: 'tcc-hatch-1' });
    expect(entries.find((e) => e.group === 'Findings on this sheet')!.text).toBe('Overlap, 3.2–12 kA: R1 over CB1');
  });

  it('legendEntriesOf says when a curve is drawn on another voltage base', () => {
    const base = fixtureInput();
    const input = { ...base, referenceVolts: 12_470 };
    const entries = legendEntriesOf(input, codes);
    expect(entries[0].text).toBe('Relay R1 (VI, TD 1) (480 V device, shown at 12.47 kV)');
    expect(entries.find((e) => e.group === 'Withstand (damage) curves')!.text).toBe(
      'TX1 through-fault — C57.109 Category II, frequent faults (480 V values, shown at 12.47 kV)',
    );
  });
});
