import fc from 'fast-check';
import { create, unitDependencies } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { COMMON_UNITS, DIMENSIONS, parseQuantity, type Dimension } from '../../../src/engine/quantity/parse.ts';

// The reference: mathjs itself (the project's unit library), reading the same text.
const math = create({ unitDependencies });
const viaMathjs = (text: string, dimension: Dimension) => math.unit(text).toNumber(DIMENSIONS[dimension].si);

describe('the common units read without mathjs', () => {
  const entries = Object.entries(COMMON_UNITS).flatMap(([dimension, units]) =>
    Object.keys(units).map((unit) => [dimension as Dimension, unit] as const),
  );

  it.each(entries)('%s in %s gives exactly the double mathjs gives', (dimension, unit) => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.boolean(), (value, spaced) => {
        const text = `${value}${spaced ? ' ' : ''}${unit}`;
        expect(Object.is(parseQuantity(text, dimension), viaMathjs(text, dimension))).toBe(true);
      }),
      { numRuns: 200, seed: 1203 },
    );
  });

  it.each(entries)('a plain number in %s read as %s gives exactly what mathjs gives', (dimension, unit) => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (value) => {
        const expected = math.unit(value, unit).toNumber(DIMENSIONS[dimension].si);
        expect(Object.is(parseQuantity(value, dimension, { plainUnit: unit }), expected)).toBe(true);
      }),
      { numRuns: 200, seed: 1203 },
    );
  });

  it('still refuses a unit of another dimension and a real power (through mathjs)', () => {
    expect(() => parseQuantity('13.8 kV', 'current')).toThrow('expected a current such as "25 kA"');
    expect(() => parseQuantity('1500 kW', 'power')).toThrow(/apparent power/);
    expect(parseQuantity('2 hours', 'time')).toBe(7200);
  });
});
