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
    ['600 kcmil', '600 kcmil'],
    ['600 MCM', '600 kcmil'],
    ['1000 kcmil', '1000 kcmil'],
    ['14 AWG', '14 AWG'],
    ['#3', '3 AWG'],
    ['1 AWG', '1 AWG'],
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

  // NFPA 70 Chapter 9 Table 8 areas (from memory).
  it.each([
    ['14 AWG', 4110],
    ['3 AWG', 52620],
    ['1 AWG', 83690],
    ['600 kcmil', 600000],
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
  ])('%s is %d cmil (NFPA 70 Ch. 9 Table 8)', (size, cmil) => {
    expect(conductorAreaCmil(size)).toBe(cmil);
  });

  it('AWG areas agree with the AWG law d = 5 · 92^((36 − n)/39) mil within the table rounding (ASTM B258)', () => {
    const gauge: Record<string, number> = { '14 AWG': 14, '12 AWG': 12, '3 AWG': 3, '1 AWG': 1, '1/0': 0, '4/0': -3 };
    for (const [size, n] of Object.entries(gauge)) {
      const area = (5 * 92 ** ((36 - n) / 39)) ** 2;
      expect(Math.abs(AWG_AREA_CMIL[size] - area) / area, size).toBeLessThan(0.002);
    }
  });

  it('names the field on bad text', () => {
    expect(() => conductorAreaCmil('4/5', 'study.cables[0].size')).toThrow(/^study\.cables\[0\]\.size: expected/);
  });
});

function escape(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
}
