import { z } from 'zod/mini';
import { nameField, quantityField } from '../study/fields.ts';
import { isValidTable } from './pointTable.ts';
import { pointTableSchema, upperBelowLowerOnce } from './pointTableSchema.ts';

const ampsTable = pointTableSchema({ current: 'a current in amperes', unit: ' A' });
const CURVES = new Set<PropertyKey | undefined>(['minimumMelting', 'totalClearing']);

/**
 * Schema of a fuse characteristic (minimum-melting and total-clearing curves, as ANSI C37.41 and
 * UL 248 publish them): `minimumMelting` and `totalClearing` as `[amperes, seconds]` tables (≥ 2 points, current ascending, time strictly descending), total
 * clearing never earlier than minimum melting and starting at no lower current; optional
 * `currentLimitingFrom` (A), `availableRatings` (the family's ratings, for NEC 450.3(A) note 1);
 * `illustrative` (invented data, not a product) and `label`.
 *
 * @example fuseSchema.parse({ kind: 'fuse', minimumMelting: [[200, 300], [2000, 0.01]],
 *   totalClearing: [[220, 300], [2000, 0.02]] })
 */
export const fuseSchema = z
  .strictObject({
    kind: z.literal('fuse'),
    label: z.optional(nameField),
    // A default is described by registering it (see createStudySchema).
    illustrative: z
      ._default(z.boolean(), false)
      .register(z.globalRegistry, { description: 'invented curve data, not a product' }),
    minimumMelting: ampsTable,
    totalClearing: ampsTable,
    currentLimitingFrom: z.optional(
      quantityField('current', {
        min: 0,
        exclusiveMin: true,
        description: 'current (A) from which the fuse is current-limiting',
      }),
    ),
    availableRatings: z.optional(z.array(z.number().check(z.positive())).check(z.minLength(1))).check(
      z.meta({
        description:
          'ampere (E) ratings the fuse family is made in, ascending: the next commercially available rating of NEC Table 450.3(A) note 1 above 1000 V; default a common E-rating series',
      }),
    ),
  })
  .check(
    z.superRefine(
      (fuse, ctx) => {
        // Read as given where another field has a problem: the ratings in order only where they are numbers.
        const given: unknown = fuse.availableRatings;
        const ratings = Array.isArray(given) && given.every(Number.isFinite) ? (given as number[]) : [];
        for (let i = 1; i < ratings.length; i++) {
          if (!(ratings[i] > ratings[i - 1]))
            ctx.addIssue({
              code: 'custom',
              path: ['availableRatings', i],
              message: `expected a rating above the previous ${ratings[i - 1]} A, got "${ratings[i]}"`,
            });
        }
        if (!isValidTable(fuse.minimumMelting) || !isValidTable(fuse.totalClearing)) return;
        const problem = upperBelowLowerOnce(fuse.minimumMelting, fuse.totalClearing);
        if (!problem) return;
        const at = `${Number(problem.amps.toPrecision(6))} A`;
        ctx.addIssue({
          code: 'custom',
          path: ['totalClearing'],
          message: Number.isFinite(problem.lowerSeconds)
            ? `expected total clearing no earlier than minimum melting, got ${Number(problem.upperSeconds.toPrecision(6))} s at ${at} (minimum melting ${Number(problem.lowerSeconds.toPrecision(6))} s)`
            : `expected total clearing to start at or above the first minimum-melting current, got ${at}`,
        });
      },
      // Run while the two curves read, whatever else is wrong: the curves' fit is worth saying beside
      // another problem (an import into a fuse with one would otherwise hear nothing of it). Not on
      // what is no fuse at all (null, text, a list), which has nothing to check.
      {
        when: ({ value, issues }) =>
          typeof value === 'object' &&
          value !== null &&
          !Array.isArray(value) &&
          !issues.some((issue) => CURVES.has(issue.path?.[0])),
      },
    ),
    z.meta({ description: 'fuse: minimum-melting and total-clearing point tables' }),
  );

/** A parsed fuse: tables in amperes and seconds. */
export type Fuse = z.output<typeof fuseSchema>;
