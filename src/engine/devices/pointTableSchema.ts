import { z } from 'zod/mini';
import { NOT_PLAIN, withPlainReading } from '../study/plainReading.ts';
import { pointProblem, upperBelowLower, type PointTable, type PointTableOptions } from './pointTable.ts';

/** The largest current (A, or multiple of the rating) and time (s) a point may hold, as elsewhere in a study. */
const MAX_AMPS = 1e7;
const MAX_SECONDS = 1e5;

/**
 * Schema of a point table (a digitised curve, common practice): at least 2 points, every value greater than 0, current
 * ascending and time strictly descending. Each rejection names the point: `[3][1]: expected a time
 * below the previous point's 10 s, got "12"`.
 *
 * @example pointTableSchema({ current: 'a current in amperes', unit: ' A' }).parse([[200, 300], [1000, 0.1]])
 */
export function pointTableSchema(options: PointTableOptions) {
  return withPlainReading(withPlainPath(zodPointTableSchema(options)), (points) =>
    Array.isArray(points) ? (plainCopyOf(points) ?? NOT_PLAIN) : NOT_PLAIN,
  );
}

/**
 * `pointTableSchema` as zod alone reads it, without the quicker reading of plain tables: the reference
 * its every answer is held to.
 */
export function zodPointTableSchema({ current, unit }: PointTableOptions) {
  return z.array(z.tuple([z.number().check(z.maximum(MAX_AMPS)), z.number().check(z.maximum(MAX_SECONDS))])).check(
    // At most 1e7 A (or ×) and 1e5 s, like every current and time in a study; 1000 points is far
    // more than any digitised curve needs and keeps band evaluation cheap.
    z.maxLength(1000),
    z.superRefine((points, ctx) => {
      if (points.length < 2) {
        ctx.addIssue({ code: 'custom', message: `expected at least 2 points, got ${points.length}` });
        return;
      }
      for (let i = 0; i < points.length; i++) {
        const problem = pointProblem(points, i, { current, unit });
        if (problem) ctx.addIssue({ code: 'custom', path: [i, problem.column], message: problem.message });
      }
    }),
    z.meta({ description: `[${current.replace(/^an? /, '')}, seconds] pairs, current ascending, time descending` }),
  );
}

/**
 * `schema` (an array of `[current, time]` tuples) with a quicker reading of a table whose every point is
 * a pair of finite numbers within the tuples' limits: such a table is copied point by point, as zod's
 * own reading would, without a result object per number, and the array's checks (its length, the
 * ordering rules) run after it as before. Any other table goes through zod's reading, so every message
 * is zod's. A study holds thousands of tables (every fuse and breaker has two), and this reading was
 * most of the time spent checking a study's devices.
 */
function withPlainPath<T extends z.ZodMiniArray>(schema: T): T {
  let read = schema._zod.parse;
  const readPlain: typeof read = (payload, ctx) => {
    const points = payload.value;
    const copy = Array.isArray(points) ? plainCopyOf(points) : undefined;
    if (copy) {
      payload.value = copy;
      return payload;
    }
    const result = read(payload, ctx);
    // zod's reader may put another in its place on its first use (a memoizer, which zod/mini installs
    // only when configured, removes its guard against cycles that this schema cannot have): take that
    // one as zod's reading, and stay in front of it.
    if (schema._zod.parse !== readPlain) {
      read = schema._zod.parse;
      schema._zod.parse = readPlain;
    }
    return result;
  };
  schema._zod.parse = readPlain;
  return schema;
}

/**
 * Tables read lately, the latest first. A study's many breakers and fuses of one kind carry the same
 * digitised curve: a table equal to one of these, point for point, is given back as that same array
 * rather than copied again, so a 2,000-device study holds a few tables instead of thousands (less for
 * the collector to copy) and comparing two devices' characteristics meets the same array. A parsed
 * study is read, never written to, so sharing a table between devices and studies is safe.
 */
const recentTables: [number, number][][] = [];
const RECENT_TABLES = 16;

/**
 * `points` as a table of `[current, time]` pairs when each is a pair of finite numbers, at most 1e7 and
 * 1e5 (a recent table of the same content, else a copy); else undefined.
 */
function plainCopyOf(points: unknown[]): [number, number][] | undefined {
  for (let t = 0; t < recentTables.length; t++) {
    const table = recentTables[t];
    if (table.length === points.length && holdsTable(points, table)) {
      recentTables.copyWithin(1, 0, t);
      recentTables[0] = table;
      return table;
    }
  }
  const copy: [number, number][] = new Array(points.length);
  for (let i = 0; i < points.length; i++) {
    const point = points[i];
    if (!Array.isArray(point) || point.length !== 2) return undefined;
    const amps: unknown = point[0];
    const seconds: unknown = point[1];
    if (typeof amps !== 'number' || typeof seconds !== 'number') return undefined;
    if (!Number.isFinite(amps) || !Number.isFinite(seconds) || amps > MAX_AMPS || seconds > MAX_SECONDS)
      return undefined;
    copy[i] = [amps, seconds];
  }
  recentTables.unshift(copy);
  if (recentTables.length > RECENT_TABLES) recentTables.pop();
  return copy;
}

/** What `upperBelowLower` found for each pair of tables checked, by the tables themselves. */
const checkedPairs = new WeakMap<PointTable, WeakMap<PointTable, ReturnType<typeof upperBelowLower> | null>>();

/**
 * `upperBelowLower(lower, upper)`, worked out once per pair of tables: a study's devices of one kind
 * share their tables as read (`plainCopyOf`), so a 2,000-device study checks a few pairs, not one per
 * fuse and breaker. Tables as read are never written to, so an answer stays true of its pair.
 *
 * @example upperBelowLowerOnce(fuse.minimumMelting, fuse.totalClearing) // undefined for a sound fuse
 */
export function upperBelowLowerOnce(lower: PointTable, upper: PointTable): ReturnType<typeof upperBelowLower> {
  let byUpper = checkedPairs.get(lower);
  if (!byUpper) checkedPairs.set(lower, (byUpper = new WeakMap()));
  let problem = byUpper.get(upper);
  if (problem === undefined) byUpper.set(upper, (problem = upperBelowLower(lower, upper) ?? null));
  return problem ?? undefined;
}

/** Whether each of `points` is a pair holding the same two numbers as `table`'s point there (0 and −0 told apart). */
function holdsTable(points: unknown[], table: [number, number][]): boolean {
  for (let i = 0; i < points.length; i++) {
    const point = points[i];
    if (!Array.isArray(point) || point.length !== 2) return false;
    // Read by index: taking the pair apart by destructuring builds an iterator for every point.
    const tablePoint = table[i];
    if (!Object.is(point[0], tablePoint[0]) || !Object.is(point[1], tablePoint[1])) return false;
  }
  return true;
}
