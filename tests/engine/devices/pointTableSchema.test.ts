import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { pointProblem } from '../../../src/engine/devices/pointTable.ts';
import { pointTableSchema } from '../../../src/engine/devices/pointTableSchema.ts';

const options = { current: 'a current in amperes', unit: ' A' };
const schema = pointTableSchema(options);

/** The same table schema read by zod alone: the reference for every answer. */
const zodAlone = z
  .array(z.tuple([z.number().max(1e7), z.number().max(1e5)]))
  .max(1000)
  .superRefine((points, ctx) => {
    if (points.length < 2) {
      ctx.addIssue({ code: 'custom', message: `expected at least 2 points, got ${points.length}` });
      return;
    }
    for (let i = 0; i < points.length; i++) {
      const problem = pointProblem(points, i, options);
      if (problem) ctx.addIssue({ code: 'custom', path: [i, problem.column], message: problem.message });
    }
  });

/** What a reading says, as plain data: the table read, or each issue's code, path and message. */
const answerOf = (result: ReturnType<typeof schema.safeParse>) =>
  result.success
    ? { data: result.data }
    : { issues: result.error.issues.map(({ code, path, message }) => ({ code, path, message })) };

describe('pointTableSchema', () => {
  it('reads a good table as zod does, into a copy of its own', () => {
    const table = [
      [200, 300],
      [2000, 0.1],
    ];
    const read = schema.parse(table);
    expect(read).toEqual(table);
    expect(read).not.toBe(table);
    expect(read[0]).not.toBe(table[0]);
  });

  it('answers every table, good or bad, exactly as zod alone does', () => {
    const number = fc.oneof(
      fc.double({ min: 1e-3, max: 2e7, noNaN: true }),
      fc.constantFrom(0, -1, NaN, Infinity, -Infinity, 1e7, 1e5, 1e5 + 1, '12', null),
    );
    const point = fc.oneof(
      { weight: 8, arbitrary: fc.tuple(number, number) },
      { weight: 1, arbitrary: fc.constantFrom([1], [1, 2, 3], 'point', null, {}) },
    );
    const ordered = fc
      .array(fc.tuple(fc.double({ min: 1, max: 1e6, noNaN: true }), fc.double({ min: 1e-2, max: 1e4, noNaN: true })), {
        minLength: 2,
        maxLength: 12,
      })
      .map((points) => {
        const amps = points.map(([a]) => a).sort((a, b) => a - b);
        const seconds = points.map(([, t]) => t).sort((a, b) => b - a);
        return amps.map((a, i) => [a, seconds[i]]);
      });
    fc.assert(
      fc.property(fc.oneof(fc.array(point, { maxLength: 12 }), ordered, fc.constantFrom('table', 3, null)), (table) => {
        expect(answerOf(schema.safeParse(table))).toEqual(answerOf(zodAlone.safeParse(table)));
      }),
      { numRuns: 2000 },
    );
  });
});
