import fc from 'fast-check';
import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { unitLibrary } from '../../../src/engine/quantity/unitLibrary.ts';

// The reference: mathjs's full build (typed dispatch, every numeric type) reading the same text.
const full = create(all);

/** Units a study may be written in, beyond the common ones, each with the SI unit it converts to. */
const UNITS: [string, string][] = [
  ['mV', 'V'],
  ['MV', 'V'],
  ['uA', 'A'],
  ['GA', 'A'],
  ['GVA', 'VA'],
  ['mVA', 'VA'],
  ['uohm', 'ohm'],
  ['Mohm', 'ohm'],
  ['mm', 'm'],
  ['km', 'm'],
  ['inch', 'm'],
  ['yd', 'm'],
  ['mi', 'm'],
  ['us', 's'],
  ['minute', 's'],
  ['hour', 's'],
  ['day', 's'],
  ['kHz', 'Hz'],
  ['V*A', 'VA'],
  ['V/A', 'ohm'],
  ['s^-1', 'Hz'],
];

describe('unitLibrary', () => {
  it('has the expected defaults: reads a value in a unit and converts it', () => {
    expect(unitLibrary().parse('4.16 kV').toNumber('V')).toBe(4160);
    expect(unitLibrary().of(2, 'kA').toNumber('A')).toBe(2000);
    expect(unitLibrary().parse('kV').value).toBeNull();
  });

  it.each(UNITS)('reads %s to %s as exactly the double mathjs gives', (unit, si) => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.boolean(), (value, spaced) => {
        const text = `${value}${spaced ? ' ' : ''}${unit}`;
        expect(Object.is(unitLibrary().parse(text).toNumber(si), full.unit(text).toNumber(si))).toBe(true);
        expect(Object.is(unitLibrary().of(value, unit).toNumber(si), full.unit(value, unit).toNumber(si))).toBe(true);
      }),
      { numRuns: 100, seed: 1204 },
    );
  });

  it('tells dimensions apart and names the units, as mathjs does', () => {
    for (const [unit, si] of UNITS) {
      for (const [, other] of UNITS) {
        expect(unitLibrary().parse(`1 ${unit}`).equalBase(unitLibrary().of(1, other))).toBe(
          full.unit(`1 ${unit}`).equalBase(full.unit(1, other)),
        );
      }
      expect(
        unitLibrary()
          .parse(`3 ${unit}`)
          .units.map((part) => part.unit.name),
      ).toEqual(full.unit(`3 ${unit}`).units.map((part) => part.unit.name));
      expect(si).toBeTruthy();
    }
  });

  it('refuses text that is no unit, as mathjs does', () => {
    for (const text of ['4 kVV', '12 parsecs per fortnight', '5 +', '7 ohms!']) {
      expect(() => full.unit(text)).toThrow();
      expect(() => unitLibrary().parse(text)).toThrow();
    }
  });
});
