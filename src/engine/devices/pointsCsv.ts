import { InputError } from '../errors.ts';
import { pointProblem, type PointTable } from './pointTable.ts';

/** The curves a CSV of digitised points can hold (log-log interpolation of digitised points, common practice). */
export interface PointsCsv {
  /** Two-column files (`current,time`): the one curve. */
  points?: PointTable;
  /** Three-column files: `minimum-melting` or `min` rows (the fast edge). */
  minimum?: PointTable;
  /** Three-column files: `total-clearing` or `max` rows (the slow edge). */
  maximum?: PointTable;
}

const CURVE_NAMES: Record<string, 'minimum' | 'maximum'> = {
  'minimum-melting': 'minimum',
  min: 'minimum',
  'total-clearing': 'maximum',
  max: 'maximum',
};
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads digitised curve points from CSV text: rows of `current,time` (amperes, seconds), or
 * `curve,current,time` with curve `minimum-melting`/`total-clearing` (fuses) or `min`/`max` (a
 * thermal band, currents then in multiples of the rating). A header row is optional; `#` starts a
 * comment; blank lines are skipped; fields may be separated by commas, semicolons or tabs. Each
 * curve must have current ascending and time strictly descending. A bad row throws an `InputError`
 * naming its line: `row 7: expected a current in amperes greater than 0, got "abc"`.
 *
 * @example parsePointsCsv('current,time\n200,300\n2000,0.01').points // [[200, 300], [2000, 0.01]]
 */
export function parsePointsCsv(text: string): PointsCsv {
  const result: PointsCsv = {};
  const rows: Record<'points' | 'minimum' | 'maximum', number[]> = { points: [], minimum: [], maximum: [] };
  let columns: 2 | 3 | undefined;
  let seenData = false;
  text.split(/\r?\n/).forEach((line, index) => {
    const row = `row ${index + 1}`;
    const content = line.replace(/#.*$/, '').trim();
    if (content === '') return;
    const fields = content.split(/\s*[,;\t]\s*/);
    if (!seenData && !fields.some((field) => NUMBER.test(field)) && fields.length >= 2 && fields.length <= 3) {
      // A header names its columns; only the first non-comment row may be one.
      seenData = true;
      columns = fields.length as 2 | 3;
      return;
    }
    seenData = true;
    columns ??= fields.length === 3 ? 3 : 2;
    if (fields.length !== columns) {
      const shape = columns === 2 ? 'current,time' : 'curve,current,time';
      throw new InputError(row, `expected ${columns} fields (${shape}), got ${JSON.stringify(content)}`);
    }
    let curve: 'points' | 'minimum' | 'maximum' = 'points';
    if (columns === 3) {
      const name = CURVE_NAMES[fields[0].toLowerCase()];
      if (!name) {
        throw new InputError(
          row,
          `expected a curve "minimum-melting", "total-clearing", "min" or "max", got ${JSON.stringify(fields[0])}`,
        );
      }
      curve = name;
    }
    const [currentText, timeText] = fields.slice(columns - 2);
    const current = 'a current in amperes';
    if (!NUMBER.test(currentText) || !(Number(currentText) > 0)) {
      throw new InputError(row, `expected ${current} greater than 0, got ${JSON.stringify(currentText)}`);
    }
    if (!NUMBER.test(timeText) || !(Number(timeText) > 0)) {
      throw new InputError(row, `expected a time in seconds greater than 0, got ${JSON.stringify(timeText)}`);
    }
    const table = (result[curve] ??= []);
    table.push([Number(currentText), Number(timeText)]);
    rows[curve].push(index + 1);
    const problem = pointProblem(table, table.length - 1, { current, unit: '' });
    if (problem) throw new InputError(row, problem.message);
  });
  for (const curve of ['points', 'minimum', 'maximum'] as const) {
    const table = result[curve];
    if (table && table.length < 2) {
      throw new InputError(`row ${rows[curve][0]}`, `expected at least 2 points on this curve, got ${table.length}`);
    }
  }
  if (!result.points && !result.minimum && !result.maximum) {
    throw new InputError('row 1', 'expected rows of current,time or curve,current,time, got no points');
  }
  return result;
}
