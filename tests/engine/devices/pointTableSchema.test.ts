import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { upperBelowLower } from '../../../src/engine/devices/pointTable.ts';
import {
  pointTableSchema,
  upperBelowLowerOnce,
  zodPointTableSchema,
} from '../../../src/engine/devices/pointTableSchema.ts';

const options = { current: 'a current in amperes', unit: ' A' };
const schema = pointTableSchema(options);

/** The same table schema read by zod alone: the reference for every answer. */
const zodAlone = zodPointTableSchema(options);

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

  // A study's breakers and fuses of one kind carry one digitised curve: read once, held once.
  it('gives back one array for tables equal point for point, and its own for any other', () => {
    const fuseCurve = () => [
      [200, 300],
      [600, 10],
      [2000, 0.1],
    ];
    const first = schema.parse(fuseCurve());
    const second = schema.parse(fuseCurve());
    expect(second).toBe(first);

    const lastTimeDiffers = fuseCurve();
    lastTimeDiffers[2][1] = 0.1 * (1 + 1e-15);
    const other = schema.parse(lastTimeDiffers);
    expect(other).not.toBe(first);
    expect(other).toEqual(lastTimeDiffers);

    const longer = [...fuseCurve(), [5000, 0.01]];
    expect(schema.parse(longer)).not.toBe(first);
    expect(schema.parse(fuseCurve())).toBe(first);
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

  // Each point of a good table in turn given each kind of bad value or bad point: every way a table
  // can leave the quicker reading, met one at a time.
  it('answers a good table with one bad value or point anywhere exactly as zod alone does', () => {
    const good = [
      [150, 1000],
      [300, 30],
      [2000, 0.1],
    ];
    const badValues = [1e7 * (1 + 1e-15), 2e7, 1e300, 1e5 * (1 + 1e-15), NaN, Infinity, -Infinity, '12', null, 0, -1];
    const badPoints = [[1], [1, 2, 3], 'point', null, {}, [150, 1000, 5]];
    const tables: unknown[][] = [];
    for (let i = 0; i < good.length; i++) {
      for (const column of [0, 1]) {
        for (const value of badValues) {
          const table: unknown[][] = good.map((point) => [...point]);
          table[i][column] = value;
          tables.push(table);
        }
      }
      for (const point of badPoints) tables.push(good.map((p, j) => (j === i ? point : p)));
    }
    for (const table of tables) {
      expect(answerOf(schema.safeParse(table)), JSON.stringify(table)).toEqual(answerOf(zodAlone.safeParse(table)));
    }
  });
});

describe('upperBelowLowerOnce', () => {
  // A fuse's two tables as read: a total-clearing curve that dips under minimum melting at 600 A.
  const melting = schema.parse([
    [200, 300],
    [600, 10],
    [2000, 0.1],
  ]) as [number, number][];
  const clearing = schema.parse([
    [200, 400],
    [600, 8],
    [2000, 0.2],
  ]) as [number, number][];
  const sound = schema.parse([
    [200, 400],
    [600, 12],
    [2000, 0.2],
  ]) as [number, number][];

  it('answers each pair of tables as upperBelowLower does, asked again and again, either way round', () => {
    for (let i = 0; i < 3; i++) {
      expect(upperBelowLowerOnce(melting, clearing)).toEqual(upperBelowLower(melting, clearing));
      expect(upperBelowLowerOnce(melting, clearing)).toEqual({ amps: 600, lowerSeconds: 10, upperSeconds: 8 });
      expect(upperBelowLowerOnce(melting, sound)).toBeUndefined();
      expect(upperBelowLowerOnce(clearing, melting)).toEqual(upperBelowLower(clearing, melting));
    }
  });
});
