import { describe, expect, it } from 'vitest';
import { AWG_AREA_CMIL, conductorAreaCmil, parseConductorSize } from '../../../src/engine/conductors/index.ts';

describe('parseConductorSize', () => {
  it('has the expected defaults', () => {
    // Without a path the error names the field "size".
    expect(() => parseConductorSize('big')).toThrow(/^size: expected a conductor size/);
  });

  it.each([
    ['4/0', '4/0'],
    ['4/0 AWG', '4/0'],
    ['1/0', '1/0'],
    ['12 AWG', '12 AWG'],
    ['#12', '12 AWG'],
    ['500 kcmil', '500 kcmil'],
    ['250 MCM', '250 kcmil'],
    ['750kcmil', '750 kcmil'],
  ])('reads "%s" as %s', (text, canonical) => {
    expect(parseConductorSize(text)).toBe(canonical);
  });

  it.each(['250', '4/1', '13 AWG', '', 'five hundred kcmil', '0 kcmil'])('refuses "%s" naming the field', (text) => {
    expect(() => parseConductorSize(text, 'study.cables[2].size')).toThrow(
      new RegExp(
        `^study\\.cables\\[2\\]\\.size: expected a conductor size such as "4/0", "12 AWG" or "500 kcmil", got ${escape(JSON.stringify(text))}$`,
      ),
    );
  });

  it('refuses a non-string', () => {
    expect(() => parseConductorSize(500, 'cable.size')).toThrow(
      /^cable\.size: expected a conductor size .*, got "500"$/,
    );
  });
});

describe('conductorAreaCmil', () => {
  it('has the expected defaults', () => {
    expect(AWG_AREA_CMIL['4/0']).toBe(211600);
  });

  // NEC Chapter 9 Table 8 areas as listed in REFERENCE §1.4 (from memory).
  it.each([
    ['12 AWG', 6530],
    ['10 AWG', 10380],
    ['8 AWG', 16510],
    ['6 AWG', 26240],
    ['4 AWG', 41740],
    ['2 AWG', 66360],
    ['1/0', 105600],
    ['2/0', 133100],
    ['3/0', 167800],
    ['4/0 AWG', 211600],
    ['250 kcmil', 250000],
    ['500 MCM', 500000],
  ])('%s is %d cmil (REFERENCE §1.4)', (size, cmil) => {
    expect(conductorAreaCmil(size)).toBe(cmil);
  });

  it('names the field on bad text', () => {
    expect(() => conductorAreaCmil('4/5', 'study.cables[0].size')).toThrow(/^study\.cables\[0\]\.size: expected/);
  });
});

function escape(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
}
