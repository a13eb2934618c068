import { unitLibrary } from './unitLibrary.ts';

/** The physical dimensions discern accepts, each with the SI base unit the engine computes in. */
export const DIMENSIONS = {
  voltage: { si: 'V', plain: 'V' },
  current: { si: 'A', plain: 'A' },
  power: { si: 'VA', plain: 'kVA' },
  impedance: { si: 'ohm', plain: 'ohm' },
  length: { si: 'm', plain: 'ft' },
  time: { si: 's', plain: 's' },
  frequency: { si: 'Hz', plain: 'Hz' },
} as const;

export type Dimension = keyof typeof DIMENSIONS;

export interface ParseQuantityOptions {
  /**
   * Unit assumed for a bare number, e.g. `'kVA'` so that `1500` means 1500 kVA.
   * @default the dimension's SI unit
   */
  plainUnit?: string;
  /** System frequency in Hz, needed only to read times given in cycles. @default 60 */
  frequency?: number;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const NUMBER_AND_UNIT = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-z]+)$/;

/**
 * The units studies are written in, by dimension, each with the factor to SI that mathjs uses (its unit
 * value times its prefix value, multiplied in that order, so the result is the same double). Text in
 * these units is read without mathjs; anything else goes to mathjs. A test holds each entry to mathjs.
 */
export const COMMON_UNITS: Record<Dimension, Record<string, number>> = {
  voltage: { V: 1, mV: 1 * 1e-3, kV: 1 * 1e3, MV: 1 * 1e6 },
  current: { A: 1, mA: 1 * 1e-3, kA: 1 * 1e3, MA: 1 * 1e6 },
  power: { VA: 1, kVA: 1 * 1e3, MVA: 1 * 1e6, GVA: 1 * 1e9 },
  impedance: { ohm: 1, mohm: 1 * 1e-3, kohm: 1 * 1e3 },
  length: { m: 1, mm: 1 * 1e-3, cm: 1 * 1e-2, km: 1 * 1e3, ft: 0.3048 * 1, in: 0.0254 * 1 },
  time: { s: 1, ms: 1 * 1e-3, min: 60 * 1, h: 3600 * 1 },
  frequency: { Hz: 1, kHz: 1 * 1e3 },
};
const CYCLES = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(cycles?|cyc|~)$/i;

/**
 * Parses an engineering quantity to a plain number in SI base units (V, A, VA, Ω, m, s, Hz).
 * Accepts a number (in `plainUnit`) or text such as `"13.8 kV"`, `"1500 kVA"`, `"100 ft"`,
 * `"12 cycles"` (times only, at `frequency`). A power must be apparent (VA, kVA, MVA): "1500 kW" is
 * refused, since reading it as kVA would assume a unity power factor. A value that overflows
 * ("1e400 MVA") is refused rather than becoming Infinity. Throws `InputError`-shaped `RangeError` text on failure;
 * callers at file and flag boundaries wrap it with the field path.
 *
 * @example parseQuantity('4.16 kV', 'voltage') // 4160
 */
export function parseQuantity(value: unknown, dimension: Dimension, options: ParseQuantityOptions = {}): number {
  const parsed = parseUnchecked(value, dimension, options);
  // "1e400 MVA" or 1e308 MVA overflow to Infinity on the way to SI units: refuse, never compute with it.
  if (!Number.isFinite(parsed)) throw new RangeError(`expected a finite ${dimension}`);
  return asSmallInteger(parsed);
}

/**
 * A whole number as a small integer (`480`, not the float `480.0` that `0.48 × 1000` gives): the same
 * value, which V8 keeps unboxed, where a float it keeps boxed (16 bytes) in every object field that
 * holds it, and an analysis keeps a bus's voltage in thousands of results. −0 stays −0.
 */
function asSmallInteger(value: number): number {
  return (value | 0) === value && !Object.is(value, -0) ? value | 0 : value;
}

function parseUnchecked(value: unknown, dimension: Dimension, options: ParseQuantityOptions): number {
  const { si, plain } = DIMENSIONS[dimension];
  const { plainUnit = plain, frequency = 60 } = options;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new RangeError(`expected a finite ${dimension}`);
    if (value === 0) return 0;
    const factor = COMMON_UNITS[dimension][plainUnit];
    return factor === undefined ? unitLibrary().of(value, plainUnit).toNumber(si) : value * factor;
  }
  if (typeof value !== 'string') throw new TypeError(`expected a ${dimension} as a number or text with a unit`);
  const text = value.trim().replace(/Ω/g, 'ohm').replace(/µ/g, 'u');
  if (NUMBER.test(text)) return parseUnchecked(Number(text), dimension, options);
  const cycles = CYCLES.exec(text);
  if (cycles) {
    if (dimension !== 'time') throw new RangeError(`expected a ${dimension}, not a time in cycles`);
    return Number(cycles[1]) / frequency;
  }
  const written = NUMBER_AND_UNIT.exec(text);
  const factor = written ? COMMON_UNITS[dimension][written[2]] : undefined;
  if (written && factor !== undefined) return Number(written[1]) * factor;
  let unit;
  try {
    unit = unitLibrary().parse(text);
  } catch {
    throw new RangeError(`expected a ${dimension} such as "${example(dimension)}"`);
  }
  if (unit.value === null || !unit.equalBase(unitLibrary().of(1, si))) {
    throw new RangeError(`expected a ${dimension} such as "${example(dimension)}"`);
  }
  // Ratings and fault levels are apparent powers. A real power (W, hp) shares the dimension but is
  // not the same quantity: without a stated power factor "1500 kW" is not 1500 kVA, so it is refused.
  if (dimension === 'power' && !unit.units.every((part) => part.unit.name === 'VA')) {
    throw new RangeError('expected an apparent power in VA, kVA or MVA (a real power in W needs a power factor)');
  }
  return unit.toNumber(si);
}

/**
 * Parses a percentage: `5.75`, `"5.75"` or `"5.75 %"` all give 5.75 (percent, not per unit).
 * @example parsePercent('5.75 %') // 5.75
 */
export function parsePercent(value: unknown): number {
  const text = typeof value === 'number' ? String(value) : typeof value === 'string' ? value.trim() : '';
  const match = /^(.+?)\s*%?$/.exec(text);
  const number = match && NUMBER.test(match[1]) ? Number(match[1]) : NaN;
  if (!Number.isFinite(number)) throw new RangeError('expected a percentage such as "5.75 %"');
  return number;
}

function example(dimension: Dimension): string {
  return {
    voltage: '13.8 kV',
    current: '25 kA',
    power: '1500 kVA',
    impedance: '0.05 ohm',
    length: '100 ft',
    time: '0.3 s',
    frequency: '60 Hz',
  }[dimension];
}
