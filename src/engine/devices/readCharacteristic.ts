import { InputError } from '../errors.ts';
import { formatIssuePath, issueMessage } from '../study/issueMessage.ts';
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
  throw new InputError(formatIssuePath(path, issue.path), issueMessage(issue));
}

/**
 * Every problem of one characteristic, each as `path: expected …, got "…"` (the path from `options.path`),
 * in the schema's order; an empty list where it reads. For comparing a characteristic before and after an
 * edit, where the first problem alone could be one the edit did not make.
 *
 * @example characteristicProblems({ kind: 'fuse', minimumMelting: [[1, 2]] }) // ['characteristic.minimumMelting: expected at least 2 points, got 1', …]
 */
export function characteristicProblems(input: unknown, options: ReadCharacteristicOptions = {}): string[] {
  const { path = 'characteristic', frequency = 60 } = options;
  const parsed = createCharacteristicSchema(frequency).safeParse(input, { reportInput: true });
  if (parsed.success) return [];
  return parsed.error.issues.map((issue) => `${formatIssuePath(path, issue.path)}: ${issueMessage(issue)}`);
}
