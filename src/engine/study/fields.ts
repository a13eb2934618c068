import { z } from 'zod/mini';
import { parsePercent, parseQuantity, type Dimension } from '../quantity/index.ts';
import { quoteGot } from '../errors.ts';
import { NOT_PLAIN, withPlainReading, type PlainReader } from './plainReading.ts';

/** Limits a parsed field must respect; each gives the phrase used in the error. */
export interface FieldLimits {
  /** Smallest allowed value (SI units), inclusive unless `exclusiveMin`. */
  min?: number;
  /** When true, `min` itself is rejected ("greater than"). @default false */
  exclusiveMin?: boolean;
  /** Largest allowed value (SI units), inclusive. */
  max?: number;
}

/**
 * The physically meaningful range of each dimension, in SI units, applied to every quantity field on
 * top of its own limits: a value other than 0 must lie in `[smallest, largest]`. The bounds are wide
 * (no real system comes near them) but they keep denormals, 1e-300 pickups and 1e308 voltages out of
 * the engine, whose loops and logarithms are only meaningful on physical numbers. A field may narrow
 * them (`min`, `max`); `why` is stated in the field's description and the JSON Schema.
 */
export const PHYSICAL_RANGES: Record<Dimension, { smallest: number; largest: number; unit: string; why: string }> = {
  voltage: {
    smallest: 1,
    largest: 2e6,
    unit: 'V',
    why: 'from 1 V up to 2 MV, above the highest AC transmission voltage in service (1,100 kV)',
  },
  current: {
    smallest: 1e-3,
    largest: 1e7,
    unit: 'A',
    why: 'from 1 mA (the most sensitive relay pickups on 1 A CT secondaries) to 10 MA, beyond any fault current a power system delivers (a few hundred kA)',
  },
  power: {
    smallest: 1,
    largest: 1e12,
    unit: 'VA',
    why: 'from 1 VA to 1 TVA, beyond the fault level of any interconnected grid (about 100 GVA)',
  },
  impedance: {
    smallest: 1e-9,
    largest: 1e6,
    unit: 'Ω',
    why: 'from 1 nΩ to 1 MΩ, the span of power-system conductors and grounding impedances',
  },
  length: {
    smallest: 1e-3,
    largest: 1e6,
    unit: 'm',
    why: 'from 1 mm to 1000 km, longer than any feeder',
  },
  time: {
    smallest: 1e-6,
    largest: 1e5,
    unit: 's',
    why: 'zero, or from 1 µs to 100 000 s (about a day): a time-current sheet spans 0.01 s to 1000 s',
  },
  frequency: { smallest: 1, largest: 1e3, unit: 'Hz', why: 'from 1 Hz to 1 kHz' },
};

/**
 * Every plain number in a study, in whatever unit its field reads it, is 0 or between these in
 * magnitude. No physical quantity of a power system, in the units the study format uses (V, A, kVA,
 * MVA, ft, s, %, multiples), needs more; the bound keeps denormals (1e-310), overflowed JSON numbers
 * (1e400 reads as Infinity) and 1e308 out before any field's own range is even asked. A percentage
 * written as text ("1e-310 %") keeps to the same bound.
 */
export const NUMBER_MAGNITUDE = { smallest: 1e-9, largest: 1e12 };

export interface QuantityFieldOptions extends FieldLimits {
  /** Unit of a bare number, e.g. 'kVA'. @default the dimension's plain unit (DIMENSIONS) */
  plainUnit?: string;
  /** Frequency used for times in cycles. @default 60 */
  frequency?: number;
  /** Short description for the JSON Schema and editors. */
  description?: string;
}

/** The physical range of a dimension as the user reads it. @example physicalRangeText('voltage') // "1 V and 2000000 V" */
export function physicalRangeText(dimension: Dimension): string {
  const { smallest, largest, unit } = PHYSICAL_RANGES[dimension];
  return `${smallest} ${unit} and ${largest} ${unit}`;
}

/**
 * A study field holding a quantity: a number in `plainUnit` or text with a unit ("12.47 kV").
 * The parsed value is a plain number in SI base units.
 *
 * @example quantityField('voltage', { min: 0, exclusiveMin: true }).parse('480 V') // 480
 */
export function quantityField(dimension: Dimension, options: QuantityFieldOptions = {}) {
  const { plainUnit, frequency, description, ...limits } = options;
  const read = (value: number | string): number | string => {
    let parsed: number;
    try {
      parsed = parseQuantity(value, dimension, { plainUnit, frequency });
    } catch (error) {
      return `${(error as Error).message}, got ${quoteGot(value)}`;
    }
    // Bare or with a unit, the value keeps to its dimension's SI range ("1e-9" kVA is no rating).
    const problem = limitProblem(parsed, limits) ?? physicalProblem(parsed, dimension);
    return problem ? `expected a ${dimension} ${problem}, got ${quoteGot(value)}` : parsed;
  };
  return withPlainReading(
    z.pipe(z.union([z.number(), z.string()]), z.transform(reportedBy(read))).check(
      z.meta({
        description: `${description ?? `${dimension}: a number in ${plainUnit ?? 'SI units'} or text with a unit`}; range: ${PHYSICAL_RANGES[dimension].why}`,
      }),
    ),
    plainReadingOf(read),
  );
}

/**
 * The transform of a field helper from its reading (`read`: the parsed value, or the message saying
 * what is wrong), so that zod's reading and the plain one (`plainReadingOf`) are the same function.
 */
function reportedBy<T>(read: (value: number | string) => T | string) {
  return (value: number | string, ctx: z.core.ParsePayload): T => {
    const parsed = read(value);
    if (typeof parsed !== 'string') return parsed;
    ctx.issues.push({ code: 'custom', message: parsed, input: value });
    return z.NEVER;
  };
}

/** How many distinct values a field's plain reading remembers (a study repeats its settings). */
const REMEMBERED_VALUES = 512;

/**
 * The plain reading of a `union([number, string])` field read by `read`: a finite number or any text.
 * `read` gives a number or a message for each value, always the same, so the reading of each value
 * is remembered: a study repeats its ratings, delays and lengths thousands of times, and reading one
 * ("3 cycles", "40 ft") costs a unit lookup and a range check.
 */
function plainReadingOf(read: (value: number | string) => unknown): PlainReader {
  const readings = new Map<number | string, unknown>();
  return (value) => {
    if (!(typeof value === 'string' || (typeof value === 'number' && Number.isFinite(value)))) return NOT_PLAIN;
    let parsed = readings.get(value);
    if (parsed === undefined) {
      parsed = read(value);
      if (readings.size < REMEMBERED_VALUES) readings.set(value, parsed);
    }
    return typeof parsed === 'string' ? NOT_PLAIN : parsed;
  };
}

/**
 * A percentage field ("5.75 %" or 5.75); the parsed value stays in percent.
 * @example percentField({ min: 0, exclusiveMin: true }).parse('5.75 %') // 5.75
 */
export function percentField(limits: FieldLimits & { description?: string } = {}) {
  const { description, ...given } = limits;
  // Percentages are bounded like every number: at most 100 % unless the field says less, and 0 or at
  // least NUMBER_MAGNITUDE.smallest in size (a bare number's denormal is refused before any field is
  // read, see readStudy; text such as "1e-310 %" is refused here).
  const rest = { ...given, max: Math.min(given.max ?? 100, 100) };
  const read = (value: number | string): number | string => {
    let parsed: number;
    try {
      parsed = parsePercent(value);
    } catch (error) {
      return `${(error as Error).message}, got ${quoteGot(value)}`;
    }
    const problem =
      limitProblem(parsed, rest) ??
      (typeof value === 'string' && parsed !== 0 && Math.abs(parsed) < NUMBER_MAGNITUDE.smallest
        ? `of 0 or at least ${NUMBER_MAGNITUDE.smallest} in size`
        : undefined);
    return problem ? `expected a percentage ${problem}, got ${quoteGot(value)}` : parsed;
  };
  return withPlainReading(
    z.pipe(z.union([z.number(), z.string()]), z.transform(reportedBy(read))).check(
      z.meta({
        description: `${description ?? 'percentage: a number or text such as "5.75 %"'}; range: ${rest.min ?? 0} % to ${rest.max} %`,
      }),
    ),
    plainReadingOf(read),
  );
}

/** A plain positive number (ratios, multiples, time dials). */
export function positiveNumber(description?: string) {
  return z.number().check(z.positive(), z.meta({ description }));
}

/**
 * A plain number within a physically meaningful range, both ends inclusive; `why` states the range's
 * reason in the field's description (and so in the JSON Schema and the editor's help).
 *
 * @example boundedNumber(0.1, 1000, 'X/R ratio', 'from nearly resistive to the stiffest sources').parse(12) // 12
 */
export function boundedNumber(min: number, max: number, description: string, why: string) {
  return z
    .number()
    .check(z.minimum(min), z.maximum(max), z.meta({ description: `${description}; range: ${min} to ${max}, ${why}` }));
}

/** Why an X/R ratio lies in 0.1–1000: from nearly resistive circuits to the stiffest sources (published values stay below about 100). */
export const XR_RANGE = [
  0.1,
  1000,
  'from nearly resistive circuits to the stiffest sources (published values stay below about 100)',
] as const;

/** An X/R ratio in `XR_RANGE`. @example xrRatio('X/R ratio at the source').parse(12) // 12 */
export function xrRatio(description: string) {
  return boundedNumber(XR_RANGE[0], XR_RANGE[1], description, XR_RANGE[2]);
}

/**
 * The longest list a view may hold (devices, fault lines, withstand curves, motors): a sheet with
 * more curves than this cannot be read, and the cap keeps plotting time bounded.
 */
export const MAX_VIEW_ITEMS = 100;

/**
 * The longest list of one kind of element in a study: far beyond any site (a large industrial study
 * has a few thousand buses), it keeps a corrupted or hostile file from exhausting memory.
 */
export const MAX_ELEMENTS = 20_000;

/** Names and labels: 200 characters, about the width of a printed sheet in the sheet's font. */
export const MAX_NAME = 200;

/** Free text (descriptions, notes): 10 000 characters, a few printed pages. */
export const MAX_NOTES = 10_000;

/**
 * A `[low, high]` range of a sheet's axis, low below high, both within `[smallest, largest]` of `unit`.
 * @example axisRangeField('A', 1e-3, 1e7).parse([10, 100000]) // [10, 100000]
 */
export function axisRangeField(unit: string, smallest: number, largest: number, why: string) {
  const end = z.number().check(z.minimum(smallest), z.maximum(largest));
  return z.tuple([end, end]).check(
    z.superRefine(([low, high], ctx) => {
      if (!(high > low))
        ctx.addIssue({ code: 'custom', path: [1], message: `expected a value above ${low} ${unit}, got "${high}"` });
    }),
    z.meta({
      description: `[low, high] in ${unit}, low below high; each from ${smallest} to ${largest} ${unit}, ${why}`,
    }),
  );
}

/**
 * A name or free text shown on sheets and reports: at most `max` characters (a label longer than a
 * sheet is wide is not a name) and no control characters or non-characters (U+FFFE, U+FFFF), which
 * make an SVG figure invalid XML and a PDF blank. Tabs and line breaks are allowed only in notes.
 *
 * @example textField(200, 'display name').parse('Main 2000 A') // 'Main 2000 A'
 */
export function textField(max: number, description: string, { multiline = false } = {}) {
  const forbidden = multiline ? FORBIDDEN_IN_NOTES : FORBIDDEN_IN_NAMES;
  return z.string().check(
    z.maxLength(max),
    z.superRefine((text, ctx) => {
      if (!forbidden.test(text)) return;
      const allowed = multiline ? ' (other than tab and line breaks)' : '';
      ctx.addIssue({
        code: 'custom',
        message: `expected text without control characters${allowed} or U+FFFE/U+FFFF, got ${quoteGot(text)}`,
      });
    }),
    z.meta({ description: `${description}; at most ${max} characters, no control characters` }),
  );
}

/** C0 and C1 controls, and the non-characters U+FFFE/U+FFFF (invalid in XML 1.0). */
// eslint-disable-next-line no-control-regex
const FORBIDDEN_IN_NAMES = /[\u0000-\u001f\u007f-\u009f\ufffe\uffff]/;
// eslint-disable-next-line no-control-regex
const FORBIDDEN_IN_NOTES = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\ufffe\uffff]/;

/** A display name or label: see `textField`. */
export const nameField = textField(MAX_NAME, 'display name');

/** Free text such as a description or notes: see `textField`. */
export const notesField = textField(MAX_NOTES, 'free text', { multiline: true });

/** Element ids: short, unique across the study, usable in file names and flags. */
export const idField = z
  .string()
  .check(
    z.regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/, 'expected an id of letters, digits, ".", "_" or "-"'),
    z.meta({ description: 'identifier, unique in the study' }),
  );

/**
 * Whether a number other than 0 lies outside its dimension's physical range (`PHYSICAL_RANGES`), for
 * numbers a field reads out of its own text, such as the two sides of a CT ratio "600:5".
 */
export function outsidePhysicalRange(value: number, dimension: Dimension): boolean {
  return physicalProblem(value, dimension) !== undefined;
}

/** A value other than 0 outside the dimension's physical range. */
function physicalProblem(value: number, dimension: Dimension): string | undefined {
  const { smallest, largest } = PHYSICAL_RANGES[dimension];
  if (value === 0) return undefined;
  const magnitude = Math.abs(value);
  return magnitude < smallest || magnitude > largest ? `between ${physicalRangeText(dimension)}` : undefined;
}

function limitProblem(value: number, { min, exclusiveMin = false, max }: FieldLimits): string | undefined {
  if (min !== undefined && (exclusiveMin ? !(value > min) : !(value >= min))) {
    return exclusiveMin ? `greater than ${min}` : `of at least ${min}`;
  }
  if (max !== undefined && !(value <= max)) return `of at most ${max}`;
  return undefined;
}

/**
 * The available three-phase fault at a source: a power ("250 MVA"; a bare number is MVA) or a
 * current ("11.6 kA"). Parses to `{ va }` or `{ amps }`; the fault engine converts amps at the bus voltage.
 *
 * @example availableFaultField.parse('250 MVA') // { va: 250e6 }
 */
export const availableFaultField = z
  .pipe(
    z.union([z.number(), z.string()]),
    z.transform((value, ctx): { va: number; amps?: undefined } | { amps: number; va?: undefined } => {
      const expected = `an available fault such as "250 MVA" or "11.6 kA" greater than 0 (a power between ${physicalRangeText('power')}, or a current between ${physicalRangeText('current')})`;
      for (const [dimension, plainUnit] of [
        ['power', 'MVA'],
        ['current', 'A'],
      ] as const) {
        try {
          const parsed = parseQuantity(value, dimension, { plainUnit });
          if (!(parsed > 0) || physicalProblem(parsed, dimension)) break;
          return dimension === 'power' ? { va: parsed } : { amps: parsed };
        } catch {
          // not this dimension; try the next
        }
      }
      ctx.issues.push({ code: 'custom', message: `expected ${expected}, got ${quoteGot(value)}`, input: value });
      return z.NEVER;
    }),
  )
  .check(
    z.meta({
      description: `available three-phase fault: "250 MVA" (a bare number is MVA) or "11.6 kA"; range: ${PHYSICAL_RANGES.power.why}; ${PHYSICAL_RANGES.current.why}`,
    }),
  );
