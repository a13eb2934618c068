import { z } from 'zod/mini';
import relayCurves from '../../../curves/relay-curves.json' with { type: 'json' };
import tripUnitRanges from '../../../curves/trip-unit-ranges.json' with { type: 'json' };
import { INVERSE_CURVE_NAMES } from '../devices/inverseCurves.ts';

/** Schema of `curves/relay-curves.json`: the IEEE/IEC constant sets with their source marks. */
export const relayCurveSetSchema = z.strictObject({
  note: z.string(),
  curves: z
    .array(
      z.strictObject({
        id: z.enum(INVERSE_CURVE_NAMES as [string, ...string[]]),
        label: z.string(),
        a: z.number().check(z.positive()),
        b: z.number().check(z.nonnegative()),
        p: z.number().check(z.positive()),
        reset: z.nullable(z.number().check(z.positive())),
        source: z.string().check(z.minLength(1)),
      }),
    )
    .check(z.minLength(1)),
});

const range = z
  .strictObject({
    min: z.number().check(z.positive()),
    max: z.number().check(z.positive()),
    step: z.number().check(z.positive()),
    unit: z.string(),
  })
  .check(z.refine((r) => r.min <= r.max, 'expected min no greater than max'));

/** Schema of `curves/trip-unit-ranges.json`: generic trip-unit setting ranges for settings editors. */
export const tripUnitRangesSchema = z.strictObject({
  note: z.string(),
  ranges: z.strictObject({
    longTimePickup: range,
    longTimeDelay: range,
    shortTimePickup: range,
    shortTimeDelay: range,
    instantaneousPickup: range,
    groundPickup: range,
    groundDelay: range,
  }),
});

/** The relay curve constant sets of `curves/relay-curves.json`, validated. */
export const relayCurveSet = relayCurveSetSchema.parse(relayCurves);

/** The generic trip-unit setting ranges of `curves/trip-unit-ranges.json`, validated. */
export const tripUnitSettingRanges = tripUnitRangesSchema.parse(tripUnitRanges);
