import { z } from 'zod';
import { pointProblem, type PointTableOptions } from './pointTable.ts';

/**
 * Schema of a point table (a digitised curve, common practice): at least 2 points, every value greater than 0, current
 * ascending and time strictly descending. Each rejection names the point: `[3][1]: expected a time
 * below the previous point's 10 s, got "12"`.
 *
 * @example pointTableSchema({ current: 'a current in amperes', unit: ' A' }).parse([[200, 300], [1000, 0.1]])
 */
export function pointTableSchema({ current, unit }: PointTableOptions) {
  return (
    z
      .array(z.tuple([z.number().max(1e7), z.number().max(1e5)]))
      // At most 1e7 A (or ×) and 1e5 s, like every current and time in a study; 1000 points is far
      // more than any digitised curve needs and keeps band evaluation cheap.
      .max(1000)
      .superRefine((points, ctx) => {
        if (points.length < 2) {
          ctx.addIssue({ code: 'custom', message: `expected at least 2 points, got ${points.length}` });
          return;
        }
        for (let i = 0; i < points.length; i++) {
          const problem = pointProblem(points, i, { current, unit });
          if (problem) ctx.addIssue({ code: 'custom', path: [i, problem.column], message: problem.message });
        }
      })
      .meta({ description: `[${current.replace(/^an? /, '')}, seconds] pairs, current ascending, time descending` })
  );
}
