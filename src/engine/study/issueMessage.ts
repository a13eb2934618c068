import type { z } from 'zod';
import { quoteGot } from '../errors.ts';

/**
 * One zod issue as the `expected …, got "…"` half of an error message (DESIGN §5). An unknown
 * discriminator shows the value itself, not the whole object around it.
 *
 * @example issueMessage(issue) // 'expected a percentage greater than 0, got "-5"'
 */
export function issueMessage(issue: z.core.$ZodIssue): string {
  const input = 'input' in issue ? issue.input : undefined;
  const got = input === undefined ? 'nothing' : quoteGot(input);
  switch (issue.code) {
    case 'custom':
      return issue.message;
    case 'invalid_type':
      return `expected ${/^[aeiou]/.test(issue.expected) ? 'an' : 'a'} ${issue.expected}, got ${got}`;
    case 'invalid_value':
      return `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}, got ${got}`;
    case 'unrecognized_keys':
      return `expected no field ${issue.keys.map((k) => `"${k}"`).join(', ')} here, got one`;
    case 'invalid_key': {
      const nested = issue.issues[0]?.message ?? 'expected a known key';
      return `${nested.replace(/, got .*$/, '')}, got ${got}`;
    }
    case 'invalid_union': {
      if (!('discriminator' in issue) || !issue.discriminator) return `expected one of the accepted forms, got ${got}`;
      const key = String(issue.discriminator);
      const value = input !== null && typeof input === 'object' ? (input as Record<string, unknown>)[key] : input;
      return `expected a known "${key}", got ${value === undefined ? 'nothing' : quoteGot(value)}`;
    }
    case 'too_small':
      return `expected ${issue.origin === 'array' ? `at least ${issue.minimum} item(s)` : `a value ${issue.inclusive ? 'of at least' : 'greater than'} ${issue.minimum}`}, got ${got}`;
    case 'too_big':
      return `expected ${issue.origin === 'array' ? `at most ${issue.maximum} item(s)` : `a value of at most ${issue.maximum}`}, got ${got}`;
    case 'invalid_format':
      return `${issue.message.startsWith('expected') ? issue.message : `expected ${issue.format}`}, got ${got}`;
    default:
      return `${issue.message}, got ${got}`;
  }
}

/**
 * A zod path as the user reads it, after `base`: `study.devices[2].characteristic.kind`, with keys
 * that are not plain names quoted (`study.coordination.margins["relay/fuse"]`).
 */
export function formatIssuePath(base: string, path: readonly PropertyKey[]): string {
  return path.reduce<string>((text, key) => {
    if (typeof key === 'number') return `${text}[${key}]`;
    const name = String(key);
    return /^[A-Za-z_$][\w$]*$/.test(name) ? `${text}.${name}` : `${text}[${JSON.stringify(name)}]`;
  }, base);
}
