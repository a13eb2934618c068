import { z } from 'zod/mini';
import { quoteGot } from '../errors.ts';
import {
  boundedNumber,
  nameField,
  outsidePhysicalRange,
  percentField,
  PHYSICAL_RANGES,
  quantityField,
} from '../study/fields.ts';
import { INVERSE_CURVE_NAMES } from './inverseCurves.ts';

/** Curves of the time-overcurrent element: the standard inverse-time curves and definite time. */
export const RELAY_CURVES = [...INVERSE_CURVE_NAMES, 'definite-time'] as const;

/** A CT ratio written "600:5". */
const RATIO = /^\s*(\d+(?:\.\d+)?)\s*:\s*(\d+(?:\.\d+)?)\s*$/;

/**
 * Builds the relay schema for a system frequency (times in cycles, such as the default breaker
 * interrupting time "5 cycles", parse at it). `relaySchema` is the 60 Hz instance.
 *
 * Fields: `ct` ("600:5" or `{ primary, secondary }` in amperes); `timeOvercurrent` with `curve`,
 * `pickup` (tap, secondary A), `timeDial` (IEEE), `timeMultiplier` (IEC) or `delay` (definite time),
 * and `definiteTimeFrom` (IEC G_D as a multiple of pickup: the time is held above it); `instantaneous`
 * with `pickup` (secondary A) and `delay`; `operatingTime`, the fastest the relay operates (default
 * "1 cycle", common practice 0.016–0.025 s); `breakerTime`, the interrupting time added to the
 * clearing edge (default "5 cycles"); `tolerance.pickup` and `tolerance.time` in percent (default 0).
 *
 * @example createRelaySchema(50).parse({ kind: 'relay', ct: '600:5', instantaneous: { pickup: 40 } })
 */
export function createRelaySchema(frequency = 60) {
  const time = (description: string) => quantityField('time', { frequency, min: 0, description });
  const secondaryAmps = (description: string) =>
    quantityField('current', { min: 0, exclusiveMin: true, description: `${description} (secondary A)` });
  const ct = z
    .pipe(
      z.union([
        z.string(),
        z.strictObject({
          primary: quantityField('current', { min: 0, exclusiveMin: true }),
          secondary: quantityField('current', { min: 0, exclusiveMin: true }),
        }),
      ]),
      z.transform((value, ctx) => {
        if (typeof value !== 'string') return value;
        const match = RATIO.exec(value);
        const sides = match ? [Number(match[1]), Number(match[2])] : [];
        if (!match || sides.some((amps) => !(amps > 0) || outsidePhysicalRange(amps, 'current'))) {
          ctx.issues.push({
            code: 'custom',
            message: `expected a CT ratio such as "600:5", each side a current between ${PHYSICAL_RANGES.current.smallest} A and ${PHYSICAL_RANGES.current.largest} A, got ${quoteGot(value)}`,
            input: value,
          });
          return z.NEVER;
        }
        return { primary: sides[0], secondary: sides[1] };
      }),
    )
    .check(z.meta({ description: 'CT ratio: "600:5" or { primary, secondary } in amperes' }));

  const timeOvercurrent = z
    .strictObject({
      curve: z.enum(RELAY_CURVES),
      pickup: secondaryAmps('pickup (tap)'),
      timeDial: z.optional(boundedNumber(0.01, 100, 'time dial of an IEEE curve', 'relays offer about 0.05 to 15')),
      timeMultiplier: z.optional(
        boundedNumber(0.001, 100, 'time multiplier of an IEC curve', 'relays offer about 0.025 to 3.2'),
      ),
      delay: z.optional(time('delay of a definite-time element')),
      definiteTimeFrom: z
        .optional(z.number().check(z.gt(1), z.maximum(1000)))
        .check(
          z.meta({ description: 'multiple of pickup above which the time is held (IEC G_D; common practice 20)' }),
        ),
    })
    .check(
      z.superRefine((element, ctx) => {
        const family = element.curve === 'definite-time' ? 'definite' : element.curve.slice(0, 4);
        const wanted = { ieee: 'timeDial', 'iec-': 'timeMultiplier', definite: 'delay' }[
          family
        ] as keyof typeof element;
        const words = { timeDial: 'a time dial', timeMultiplier: 'a time multiplier', delay: 'a delay' };
        for (const field of ['timeDial', 'timeMultiplier', 'delay'] as const) {
          if (field === wanted && element[field] === undefined) {
            ctx.addIssue({
              code: 'custom',
              path: [field],
              message: `expected ${words[field]} for curve "${element.curve}", got nothing`,
            });
          } else if (field !== wanted && element[field] !== undefined) {
            ctx.addIssue({
              code: 'custom',
              path: [field],
              message: `expected no ${field} with curve "${element.curve}" (it takes ${String(wanted)}), got "${element[field]}"`,
            });
          }
        }
        if (family === 'definite' && element.definiteTimeFrom !== undefined) {
          ctx.addIssue({
            code: 'custom',
            path: ['definiteTimeFrom'],
            message: `expected no definiteTimeFrom on a definite-time curve, got "${element.definiteTimeFrom}"`,
          });
        }
      }),
    );

  return z
    .strictObject({
      kind: z.literal('relay'),
      label: z.optional(nameField),
      ct,
      timeOvercurrent: z.optional(timeOvercurrent),
      instantaneous: z.optional(
        z.strictObject({
          pickup: secondaryAmps('instantaneous pickup'),
          delay: z._default(time('intentional delay'), 0),
        }),
      ),
      operatingTime: z.prefault(time('fastest relay operating time; every element is floored to it'), '1 cycle'),
      breakerTime: z.prefault(time('breaker interrupting time, added to the clearing edge'), '5 cycles'),
      tolerance: z.prefault(
        z.strictObject({
          pickup: z._default(percentField({ min: 0, max: 50, description: 'pickup tolerance ± %' }), 0),
          time: z._default(percentField({ min: 0, max: 50, description: 'operating time tolerance ± %' }), 0),
        }),
        {},
      ),
    })
    .check(
      z.superRefine((relay, ctx) => {
        if (!relay.timeOvercurrent && !relay.instantaneous) {
          ctx.addIssue({
            code: 'custom',
            path: ['timeOvercurrent'],
            message: 'expected a timeOvercurrent or an instantaneous element, got neither',
          });
        }
      }),
      z.meta({ description: 'protective relay with CT and breaker' }),
    );
}

/** Schema of a relay characteristic at 60 Hz (see `createRelaySchema`). */
export const relaySchema = createRelaySchema(60);

/** A parsed relay: currents in secondary amperes as set on the relay, times in seconds. */
export type Relay = z.output<typeof relaySchema>;
