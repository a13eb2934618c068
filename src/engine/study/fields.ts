import { z } from 'zod';
import { parsePercent, parseQuantity, type Dimension } from '../quantity/index.ts';
import { quoteGot } from '../errors.ts';

/** Limits a parsed field must respect; each gives the phrase used in the error. */
export interface FieldLimits {
  /** Smallest allowed value (SI units), inclusive unless `exclusiveMin`. */
  min?: number;
  /** When true, `min` itself is rejected ("greater than"). @default false */
  exclusiveMin?: boolean;
  /** Largest allowed value (SI units), inclusive. */
  max?: number;
}

export interface QuantityFieldOptions extends FieldLimits {
  /** Unit of a bare number, e.g. 'kVA'. @default the dimension's plain unit (DIMENSIONS) */
  plainUnit?: string;
  /** Frequency used for times in cycles. @default 60 */
  frequency?: number;
  /** Short description for the JSON Schema and editors. */
  description?: string;
}

/**
 * A study field holding a quantity: a number in `plainUnit` or text with a unit ("12.47 kV").
 * The parsed value is a plain number in SI base units.
 *
 * @example quantityField('voltage', { min: 0, exclusiveMin: true }).parse('480 V') // 480
 */
export function quantityField(dimension: Dimension, options: QuantityFieldOptions = {}) {
  const { plainUnit, frequency, description, ...limits } = options;
  return z
    .union([z.number(), z.string()])
    .transform((value, ctx) => {
      let parsed: number;
      try {
        parsed = parseQuantity(value, dimension, { plainUnit, frequency });
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: `${(error as Error).message}, got ${quoteGot(value)}`, input: value });
        return z.NEVER;
      }
      const problem = limitProblem(parsed, limits);
      if (problem) {
        ctx.addIssue({ code: 'custom', message: `expected a ${dimension} ${problem}, got ${quoteGot(value)}` });
        return z.NEVER;
      }
      return parsed;
    })
    .meta({ description: description ?? `${dimension}: a number in ${plainUnit ?? 'SI units'} or text with a unit` });
}

/**
 * A percentage field ("5.75 %" or 5.75); the parsed value stays in percent.
 * @example percentField({ min: 0, exclusiveMin: true }).parse('5.75 %') // 5.75
 */
export function percentField(limits: FieldLimits & { description?: string } = {}) {
  const { description, ...rest } = limits;
  return z
    .union([z.number(), z.string()])
    .transform((value, ctx) => {
      let parsed: number;
      try {
        parsed = parsePercent(value);
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: `${(error as Error).message}, got ${quoteGot(value)}` });
        return z.NEVER;
      }
      const problem = limitProblem(parsed, rest);
      if (problem) {
        ctx.addIssue({ code: 'custom', message: `expected a percentage ${problem}, got ${quoteGot(value)}` });
        return z.NEVER;
      }
      return parsed;
    })
    .meta({ description: description ?? 'percentage: a number or text such as "5.75 %"' });
}

/** A plain positive number (ratios, multiples, time dials). */
export function positiveNumber(description?: string) {
  return z.number().positive().meta({ description });
}

/** Element ids: short, unique across the study, usable in file names and flags. */
export const idField = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/, 'expected an id of letters, digits, ".", "_" or "-"')
  .meta({ description: 'identifier, unique in the study' });

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
  .union([z.number(), z.string()])
  .transform((value, ctx): { va: number; amps?: undefined } | { amps: number; va?: undefined } => {
    const expected = 'an available fault such as "250 MVA" or "11.6 kA" greater than 0';
    for (const [dimension, plainUnit] of [
      ['power', 'MVA'],
      ['current', 'A'],
    ] as const) {
      try {
        const parsed = parseQuantity(value, dimension, { plainUnit });
        if (!(parsed > 0)) break;
        return dimension === 'power' ? { va: parsed } : { amps: parsed };
      } catch {
        // not this dimension; try the next
      }
    }
    ctx.addIssue({ code: 'custom', message: `expected ${expected}, got ${quoteGot(value)}` });
    return z.NEVER;
  })
  .meta({ description: 'available three-phase fault: "250 MVA" (a bare number is MVA) or "11.6 kA"' });
