import type { z } from 'zod';
import { InputError, quoteGot } from '../errors.ts';
import { createCharacteristicSchema, type Characteristic } from './characteristic.ts';

/** Options of `readCharacteristic`. */
export interface ReadCharacteristicOptions {
  /** Field path of the characteristic, prefixed to every error. @default 'characteristic' */
  path?: string;
  /** System frequency (Hz) for times in cycles. @default 60 */
  frequency?: number;
}

/**
 * Parses one characteristic (outside a study: a device file, a template, an editor field) or
 * throws an `InputError` with the first problem as `path: expected …, got "…"`.
 *
 * @example readCharacteristic({ kind: 'fuse', minimumMelting: [[1, 2]] }, { path: 'device.characteristic' })
 * // throws 'device.characteristic.minimumMelting: expected at least 2 points, got 1'
 */
export function readCharacteristic(input: unknown, options: ReadCharacteristicOptions = {}): Characteristic {
  const { path = 'characteristic', frequency = 60 } = options;
  const parsed = createCharacteristicSchema(frequency).safeParse(input, { reportInput: true });
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new InputError(joinPath(path, issue.path), describe(issue));
}

function joinPath(base: string, path: readonly PropertyKey[]): string {
  return path.reduce<string>(
    (text, key) => (typeof key === 'number' ? `${text}[${key}]` : `${text}.${String(key)}`),
    base,
  );
}

/** One zod issue as the `expected …, got "…"` half of a message. */
function describe(issue: z.core.$ZodIssue): string {
  const input = 'input' in issue ? issue.input : undefined;
  const got = input === undefined ? 'nothing' : quoteGot(input);
  switch (issue.code) {
    case 'custom':
      return issue.message;
    case 'invalid_type':
      return `expected ${/^[aeiou]/.test(issue.expected) ? 'an' : 'a'} ${issue.expected}, got ${got}`;
    case 'invalid_value':
      return `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}, got ${got}`;
    case 'invalid_union': {
      if (!('discriminator' in issue) || !issue.discriminator) return `expected one of the accepted forms, got ${got}`;
      // Show the unknown discriminator value itself, not the whole object around it.
      const key = String(issue.discriminator);
      const value = input !== null && typeof input === 'object' ? (input as Record<string, unknown>)[key] : input;
      return `expected a known "${key}", got ${value === undefined ? 'nothing' : quoteGot(value)}`;
    }
    case 'unrecognized_keys':
      return `expected no field ${issue.keys.map((k) => `"${k}"`).join(', ')} here, got one`;
    case 'too_small':
      return `expected a value ${issue.inclusive ? 'of at least' : 'greater than'} ${issue.minimum}, got ${got}`;
    case 'too_big':
      return `expected a value of at most ${issue.maximum}, got ${got}`;
    default:
      return `${issue.message}, got ${got}`;
  }
}
