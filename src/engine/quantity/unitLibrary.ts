import { createComplexClass, createFractionClass, createUnitClass } from 'mathjs';

/** What the quantity reader uses of mathjs: its `Unit` class (parsing, base dimensions, conversion). */
export interface UnitLibrary {
  /** `"4.16 kV"` as a unit with its value, or a valueless unit such as `"kV"`; throws on text it cannot read. */
  parse(text: string): UnitValue;
  /** A value in a named unit: `of(480, 'V')`. */
  of(value: number, unit: string): UnitValue;
}

/** The parts of a mathjs `Unit` the reader asks for. */
export interface UnitValue {
  value: unknown;
  units: { unit: { name: string } }[];
  equalBase(other: UnitValue): boolean;
  toNumber(unit: string): number;
}

let library: UnitLibrary | undefined;

/**
 * mathjs's `Unit` class built from its own factories on plain numbers only. A quantity is read as
 * a value in a unit, never evaluated as an expression, so the library needs none of mathjs's typed
 * dispatch, matrices or big numbers: the scalar operations the class asks for are given as the
 * number arithmetic mathjs itself does for two numbers (so conversions give the same doubles; a test
 * holds them to mathjs's full build). Built on first use; studies in the common units never need it.
 *
 * @example unitLibrary().parse('4.16 kV').toNumber('V') // 4160
 */
export function unitLibrary(): UnitLibrary {
  library ??= build();
  return library;
}

function build(): UnitLibrary {
  const config = {
    relTol: 1e-12,
    absTol: 1e-15,
    matrix: 'Matrix',
    number: 'number',
    numberFallback: 'number',
    precision: 64,
    predictable: false,
    randomSeed: null,
  };
  const Unit = createUnitClass({
    config,
    addScalar: (a: number, b: number) => a + b,
    subtractScalar: (a: number, b: number) => a - b,
    multiplyScalar: (a: number, b: number) => a * b,
    divideScalar: (a: number, b: number) => a / b,
    pow: powNumber,
    abs: Math.abs,
    fix: (x: number) => (x > 0 ? Math.floor(x) : Math.ceil(x)),
    round: (x: number, digits = 0) => Number.parseFloat(x.toFixed(digits)),
    equal: (a: number, b: number) =>
      a === b || Math.abs(a - b) <= Math.max(config.relTol * Math.max(Math.abs(a), Math.abs(b)), config.absTol),
    isNumeric: (x: unknown) => typeof x === 'number' || (x as { isFraction?: boolean })?.isFraction === true,
    format: (x: unknown) => String(x),
    number: (x: unknown) => Number(x),
    Complex: createComplexClass({}),
    Fraction: createFractionClass({}),
    BigNumber: NoBigNumbers,
  }) as {
    new (value: number | null, name?: string): UnitValue;
    parse(text: string, options: { allowNoUnits: boolean }): UnitValue;
    isValuelessUnit(text: string): boolean;
  };
  return {
    // As mathjs's own `unit(text)` does.
    parse: (text) => (Unit.isValuelessUnit(text) ? new Unit(null, text) : Unit.parse(text, { allowNoUnits: true })),
    of: (value, name) => new Unit(value, name),
  };
}

/** mathjs's power of two numbers (`powNumber`): `Math.pow`, with its two limits at ±∞. */
function powNumber(x: number, y: number): number {
  if ((x * x < 1 && y === Infinity) || (x * x > 1 && y === -Infinity)) return 0;
  return Math.pow(x, y);
}

/** The reader runs on plain numbers; a big number is never made. */
class NoBigNumbers {
  constructor() {
    throw new Error('expected plain numbers, got a request for a big number');
  }
}
