import { expectedGot, InputError } from '../engine/errors.ts';
import { parsePercent, parseQuantity, type Dimension } from '../engine/quantity/index.ts';
import { NUMBER_MAGNITUDE, outsidePhysicalRange, physicalRangeText } from '../engine/study/fields.ts';

/** The flags a verb accepts: each takes a value (`'value'`) or stands alone (`'switch'`). */
export type FlagSpec = Readonly<Record<string, 'value' | 'switch'>>;

/** Flags by name without the dashes (`kva`), switches as `true`, and the positional arguments. */
export interface ParsedArgs {
  flags: Map<string, string | true>;
  positionals: string[];
}

/**
 * Splits `args` into flags and positionals. Accepts `--flag value` and `--flag=value`; a value may
 * start with a single dash (`--impedance -5`) so the range check can report it. `--` ends the flags.
 * Throws `InputError` for an unknown flag, a missing value, a value given to a switch, or a repeat.
 *
 * @example parseArgs(['--kva=1500', 'x.json'], { kva: 'value' }) // flags kva → '1500', positionals ['x.json']
 */
export function parseArgs(args: readonly string[], spec: FlagSpec): ParsedArgs {
  const flags = new Map<string, string | true>();
  const positionals: string[] = [];
  const known = Object.keys(spec)
    .map((name) => `--${name}`)
    .join(', ');
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--') {
      positionals.push(...args.slice(i + 1));
      break;
    }
    if (!arg.startsWith('--')) {
      positionals.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq === -1 ? undefined : eq);
    const flag = `--${name}`;
    const kind = spec[name];
    if (!Object.hasOwn(spec, name)) throw new InputError(flag, expectedGot(`one of ${known}`, arg));
    if (flags.has(name)) throw new InputError(flag, expectedGot('the flag once', `${flag} given twice`));
    if (kind === 'switch') {
      if (eq !== -1) throw new InputError(flag, expectedGot('no value (it is a switch)', arg.slice(eq + 1)));
      flags.set(name, true);
      continue;
    }
    const value = eq !== -1 ? arg.slice(eq + 1) : args[i + 1];
    if (value === undefined || (eq === -1 && value.startsWith('--')))
      throw new InputError(flag, expectedGot(`a value after ${flag}`, undefined));
    if (eq === -1) i++;
    flags.set(name, value);
  }
  return { flags, positionals };
}

/** The text of a value flag, or `undefined`. @example flagText(parsed, 'xr') // '6' */
export function flagText(parsed: ParsedArgs, name: string): string | undefined {
  const value = parsed.flags.get(name);
  return typeof value === 'string' ? value : undefined;
}

/**
 * The text of a required value flag; throws `--name: expected …, got nothing` when absent.
 * @example requiredFlag(parsed, 'kva', 'a transformer rating such as "1500" (kVA)') // '1500'
 */
export function requiredFlag(parsed: ParsedArgs, name: string, expected: string): string {
  const value = flagText(parsed, name);
  if (value === undefined) throw new InputError(`--${name}`, expectedGot(expected, undefined));
  return value;
}

/**
 * A flag holding a quantity greater than 0: a plain number in `plainUnit` or text with a unit
 * ("4.16 kV"), returned in SI base units.
 *
 * @example quantityFlag('4.16 kV', 'primary', 'voltage', 'V', 'a voltage greater than 0 such as "4.16 kV"') // 4160
 */
export function quantityFlag(text: string, name: string, dimension: Dimension, plainUnit: string, expected: string) {
  let value: number;
  try {
    value = parseQuantity(text, dimension, { plainUnit });
  } catch {
    throw new InputError(`--${name}`, expectedGot(expected, text));
  }
  if (!(value > 0)) throw new InputError(`--${name}`, expectedGot(expected, text));
  // As in a study: a flag's quantity keeps to its dimension's physical range ("0.000001" V is no voltage).
  if (outsidePhysicalRange(value, dimension))
    throw new InputError(`--${name}`, expectedGot(`a ${dimension} between ${physicalRangeText(dimension)}`, text));
  return value;
}

/**
 * `value` when it is within the sizes every number of a study keeps to (1e-9 to 1e12, here in the
 * flag's SI unit): a denormal voltage or an overflowed rating would otherwise carry Infinity into the
 * results.
 */
function withinMagnitude(value: number, name: string, text: string): number {
  const { smallest, largest } = NUMBER_MAGNITUDE;
  if (value < smallest || value > largest)
    throw new InputError(`--${name}`, expectedGot(`a number between ${smallest} and ${largest} in size`, text));
  return value;
}

/** A percentage flag greater than 0 and at most `max`. @example percentFlag('5.75 %', 'impedance') // 5.75 */
export function percentFlag(text: string, name: string, max = 100): number {
  const expected = `a percentage greater than 0`;
  let value: number;
  try {
    value = parsePercent(text);
  } catch {
    throw new InputError(`--${name}`, expectedGot(expected, text));
  }
  if (!(value > 0)) throw new InputError(`--${name}`, expectedGot(expected, text));
  if (!(value <= max)) throw new InputError(`--${name}`, expectedGot(`a percentage of at most ${max}`, text));
  return withinMagnitude(value, name, text);
}

/** A plain number greater than 0 (ratios such as X/R). @example positiveFlag('6', 'xr') // 6 */
export function positiveFlag(text: string, name: string, expected = 'a number greater than 0'): number {
  const value = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?\s*$/.test(text) ? Number(text) : NaN;
  if (!(value > 0) || !Number.isFinite(value)) throw new InputError(`--${name}`, expectedGot(expected, text));
  return withinMagnitude(value, name, text);
}
