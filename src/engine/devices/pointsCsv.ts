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
/** A field that starts as a number does: such a row is data, never a header, whatever follows. */
const STARTS_AS_NUMBER = /^[+-]?(\d|\.\d)/;

/** The units a header may give a column, with the factor to amperes (or multiples) and to seconds. */
const CURRENT_UNITS: Record<string, number> = {
  a: 1,
  amp: 1,
  amps: 1,
  ampere: 1,
  amperes: 1,
  ka: 1000,
  x: 1,
  '×': 1,
  multiple: 1,
  multiples: 1,
  pu: 1,
};
const TIME_UNITS: Record<string, number> = {
  s: 1,
  sec: 1,
  second: 1,
  seconds: 1,
  ms: 1e-3,
  millisecond: 1e-3,
  milliseconds: 1e-3,
};

/**
 * Reads digitised curve points from CSV text: rows of `current,time` (amperes, seconds), or
 * `curve,current,time` with curve `minimum-melting`/`total-clearing` (fuses) or `min`/`max` (a
 * thermal band, currents then in multiples of the rating). A header row is optional, and the units it
 * gives are used: kA or A (or multiples) for current, ms or s for time ("current (kA),time (ms)"); a unit
 * it gives that is not one of these is refused. `#` starts a comment; blank lines are skipped; lines may
 * end in LF, CR LF or CR; fields may be separated by commas, semicolons or tabs. Each
 * curve must have current ascending and time strictly descending. A bad row throws an `InputError`
 * naming its line: `row 7: expected a current in amperes greater than 0, got "abc"`. `options.columns`
 * reads a piece of a file with that file's number of fields (2 or 3), so a row is judged as in the file.
 *
 * @example parsePointsCsv('current,time\n200,300\n2000,0.01').points // [[200, 300], [2000, 0.01]]
 */
export function parsePointsCsv(text: string, options: { columns?: 2 | 3 } = {}): PointsCsv {
  const result: PointsCsv = {};
  const rows: Record<'points' | 'minimum' | 'maximum', number[]> = { points: [], minimum: [], maximum: [] };
  // Given, the columns of the whole file this text is a piece of (its header or first row sets them).
  let columns: 2 | 3 | undefined = options.columns;
  let seenData = false;
  let scale = { current: 1, time: 1 };
  text.split(/\r\n|\r|\n/).forEach((line, index) => {
    const row = `row ${index + 1}`;
    const content = line.replace(/#.*$/, '').trim();
    if (content === '') return;
    const fields = content.split(/\s*[,;\t]\s*/);
    if (
      !seenData &&
      !fields.some((field) => STARTS_AS_NUMBER.test(field)) &&
      fields.length >= 2 &&
      fields.length <= 3
    ) {
      // A header names its columns; only the first non-comment row may be one. Units it gives are
      // used, and one it gives that is not understood is refused: a file in kA or ms read as A or s
      // would be a thousand times off.
      seenData = true;
      columns = fields.length as 2 | 3;
      const [currentName, timeName] = fields.slice(columns - 2);
      scale = {
        current: unitFactor(currentName, CURRENT_UNITS, row, 'A, kA or multiples (×)'),
        time: unitFactor(timeName, TIME_UNITS, row, 's or ms'),
      };
      return;
    }
    seenData = true;
    columns ??= fields.length === 3 ? 3 : 2;
    if (fields.length !== columns) {
      const shape = columns === 2 ? 'current,time' : 'curve,current,time';
      throw new InputError(
        row,
        `expected ${columns} fields (${shape}), got ${JSON.stringify(content)}${separatorHint(content)}`,
      );
    }
    let curve: 'points' | 'minimum' | 'maximum' = 'points';
    if (columns === 3) {
      const name = CURVE_NAMES[fields[0].toLowerCase()];
      if (!name) {
        throw new InputError(
          row,
          `expected a curve "minimum-melting", "total-clearing", "min" or "max", got ${JSON.stringify(fields[0])}${STARTS_AS_NUMBER.test(fields[0]) ? separatorHint(content) : ''}`,
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
    table.push([Number(currentText) * scale.current, Number(timeText) * scale.time]);
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

/**
 * A hint for a row that a comma split into too many fields: a decimal comma in a file separated by
 * semicolons or tabs ("1,5;300"), or a thousands separator ("1,500,0.5", "1,234.5,0.2"), reads as a field
 * separator. A row such as "400,100,5" may be either a thousands separator or a stray field: the hint asks.
 */
function separatorHint(content: string): string {
  const decimalComma = /[;\t]/.test(content) && /\d,\d/.test(content);
  const thousands = /\d,\d{3}(?!\d)/.test(content);
  return decimalComma || thousands
    ? ' (a decimal comma or a thousands separator? write numbers as 1.5 and 1500, without separators)'
    : '';
}

/**
 * The factor a header field's unit gives its column: from a unit in brackets ("current (kA)", "time [ms]",
 * "current (A rms)", "current (× In)") or a last word ("time ms", "current_kA", "t/ms"); 1 where the field
 * names no unit ("current", "time"). A unit in brackets that is not one of `units`, or a last word that
 * is a unit of another scale (cycles, µs, minutes, mA), is refused.
 */
function unitFactor(field: string, units: Record<string, number>, row: string, expected: string): number {
  const name = field.toLowerCase().trim();
  const bracketed = /[([]\s*(?:in\s+)?([^)\]]*?)\s*[)\]]/.exec(name)?.[1];
  const words = name.split(/[\s_/]+/).filter(Boolean);
  const unit = bracketed ?? (words.length > 1 ? words[words.length - 1] : undefined);
  if (unit === undefined) return 1;
  const bare = unit.replace(/\b(rms|sym|symmetrical)\b/g, '').replace(/[\s.]+/g, '');
  const factor = units[bare] ?? (units === CURRENT_UNITS && MULTIPLES.test(bare) ? 1 : undefined);
  if (factor !== undefined) return factor;
  if (bracketed !== undefined || OTHER_UNITS.test(bare))
    throw new InputError(row, `expected a column in ${expected}, got ${JSON.stringify(field)}`);
  return 1;
}

/** Multiples of a rating, however written: "×", "x In", "× Ir", "multiples of rating", "times rating", "pu". */
const MULTIPLES = /^([x×]|multiples?|times|pu)/;
/** Last words of a header that are units of another scale: refused, not ignored. */
const OTHER_UNITS = /^(cycles?|cyc|~|[µu]s|min|minutes?|h|hours?|ma|milliamps?|kiloamps?|kiloamperes?|ma)$/;
