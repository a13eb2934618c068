import { z } from 'zod';
import relayCurves from '../../../curves/relay-curves.json' with { type: 'json' };
import tripUnitRanges from '../../../curves/trip-unit-ranges.json' with { type: 'json' };
import { INVERSE_CURVE_NAMES } from '../devices/inverseCurves.ts';

/** Schema of `curves/relay-curves.json`: the IEEE/IEC constant sets with their source marks. */
export const relayCurveSetSchema = z
  .object({
    note: z.string(),
    curves: z
      .array(
        z
          .object({
            id: z.enum(INVERSE_CURVE_NAMES as [string, ...string[]]),
            label: z.string(),
            a: z.number().positive(),
            b: z.number().nonnegative(),
            p: z.number().positive(),
            reset: z.number().positive().nullable(),
            source: z.string().min(1),
          })
          .strict(),
      )
      .min(1),
  })
  .strict();

const range = z
  .object({ min: z.number().positive(), max: z.number().positive(), step: z.number().positive(), unit: z.string() })
  .strict()
  .refine((r) => r.min <= r.max, 'expected min no greater than max');

/** Schema of `curves/trip-unit-ranges.json`: generic trip-unit setting ranges for settings editors. */
export const tripUnitRangesSchema = z
  .object({
    note: z.string(),
    ranges: z
      .object({
        longTimePickup: range,
        longTimeDelay: range,
        shortTimePickup: range,
        shortTimeDelay: range,
        instantaneousPickup: range,
        groundPickup: range,
        groundDelay: range,
      })
      .strict(),
  })
  .strict();

/** The relay curve constant sets of `curves/relay-curves.json`, validated. */
export const relayCurveSet = relayCurveSetSchema.parse(relayCurves);

/** The generic trip-unit setting ranges of `curves/trip-unit-ranges.json`, validated. */
export const tripUnitSettingRanges = tripUnitRangesSchema.parse(tripUnitRanges);
