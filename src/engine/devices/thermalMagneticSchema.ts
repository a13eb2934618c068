import { z } from 'zod/mini';
import { requireOpeningBeforeClearing } from './breakerTimes.ts';
import { boundedNumber, nameField, percentField, quantityField } from '../study/fields.ts';
import { isValidTable } from './pointTable.ts';
import { pointTableSchema, upperBelowLowerOnce } from './pointTableSchema.ts';

const multiplesTable = pointTableSchema({ current: 'a multiple of the rating', unit: '×' });

/**
 * Builds the thermal-magnetic breaker schema for a system frequency; `thermalMagneticSchema` is the
 * 60 Hz instance (UL 489 thermal-magnetic practice). Fields: `rating` (A); `thermal.minimum` and `thermal.maximum`,
 * the band's edges as `[multiple of rating, seconds]` tables (a template supplies them; the study keeps
 * its own copy); `magnetic` with `pickup` (× rating) or `pickupAmps`, an optional adjustable `range`
 * (same terms as the pickup), and `tolerance` ± % (default 20, common practice); `openingTime`
 * (default "0.5 cycles") and `clearingTime` (default "1 cycle"); `currentLimiting`/`currentLimitingFrom`;
 * `illustrative` and `label` for invented curves.
 *
 * @example createThermalMagneticSchema().parse({ kind: 'thermal-magnetic', rating: 100,
 *   thermal: { minimum: [[1.05, 7200], [10, 2]], maximum: [[1.3, 7200], [10, 5]] }, magnetic: { pickup: 10 } })
 */
export function createThermalMagneticSchema(frequency = 60) {
  const time = (description: string) => quantityField('time', { frequency, min: 0, description });
  return z
    .strictObject({
      kind: z.literal('thermal-magnetic'),
      label: z.optional(nameField),
      // A default is described by registering it (see createStudySchema).
      illustrative: z
        ._default(z.boolean(), false)
        .register(z.globalRegistry, { description: 'invented curve data, not a product' }),
      rating: quantityField('current', { min: 0, exclusiveMin: true, description: 'breaker rating (A)' }),
      thermal: z.strictObject({ minimum: multiplesTable, maximum: multiplesTable }).check(
        z.superRefine(({ minimum, maximum }, ctx) => {
          if (!isValidTable(minimum) || !isValidTable(maximum)) return;
          const problem = upperBelowLowerOnce(minimum, maximum);
          if (problem) {
            ctx.addIssue({
              code: 'custom',
              path: ['maximum'],
              message: `expected the maximum edge no earlier than the minimum edge, got ${Number(problem.upperSeconds.toPrecision(6))} s at ${problem.amps}× (minimum ${Number(problem.lowerSeconds.toPrecision(6))} s)`,
            });
          }
        }),
      ),
      magnetic: z
        .strictObject({
          pickup: z.optional(boundedNumber(0.5, 100, 'magnetic pickup × rating', 'breakers offer about 3 × to 20 ×')),
          pickupAmps: z.optional(quantityField('current', { min: 0, exclusiveMin: true })),
          range: z
            .optional(
              z.tuple([z.number().check(z.positive(), z.maximum(1e7)), z.number().check(z.positive(), z.maximum(1e7))]),
            )
            .check(
              z.meta({
                description: 'adjustable range [low, high] in the terms of the pickup; omit for a fixed trip',
              }),
            ),
          tolerance: z._default(percentField({ min: 0, max: 90, description: 'pickup tolerance ± %' }), 20),
        })
        .check(
          z.superRefine((magnetic, ctx) => {
            if ((magnetic.pickup === undefined) === (magnetic.pickupAmps === undefined)) {
              ctx.addIssue({
                code: 'custom',
                path: ['pickup'],
                message: `expected exactly one of pickup (× rating) or pickupAmps, got ${magnetic.pickup === undefined ? 'neither' : 'both'}`,
              });
            }
          }),
        ),
      openingTime: z.prefault(time('fastest magnetic operation'), '0.5 cycles'),
      clearingTime: z.prefault(time('latest clearing at high current'), '1 cycle'),
      currentLimiting: z._default(z.boolean(), false),
      currentLimitingFrom: z.optional(quantityField('current', { min: 0, exclusiveMin: true })),
    })
    .check(
      z.superRefine((breaker, ctx) => requireOpeningBeforeClearing(breaker, ctx)),
      z.meta({ description: 'thermal-magnetic molded-case breaker' }),
    );
}

/** Schema of a thermal-magnetic characteristic at 60 Hz (see `createThermalMagneticSchema`). */
export const thermalMagneticSchema = createThermalMagneticSchema(60);

/** A parsed thermal-magnetic breaker: `rating` in amperes, tables in multiples of it, times in seconds. */
export type ThermalMagnetic = z.output<typeof thermalMagneticSchema>;
