import type { z } from 'zod/mini';
import { quoteGot } from '../errors.ts';

/**
 * One zod issue as the `expected …, got "…"` half of an error message (DEVELOPERS.md, command line). An unknown
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
      if (issue.origin === 'array') return `expected at least ${issue.minimum} item(s), got ${countOf(input)}`;
      if (issue.origin === 'string') return `expected at least ${issue.minimum} character(s), got ${got}`;
      return `expected a value ${issue.inclusive ? 'of at least' : 'greater than'} ${issue.minimum}, got ${got}`;
    case 'too_big':
      if (issue.origin === 'array') return `expected at most ${issue.maximum} item(s), got ${countOf(input)}`;
      if (issue.origin === 'string')
        return `expected at most ${issue.maximum} characters, got ${typeof input === 'string' ? `"${input.length} characters"` : got}`;
      return `expected a value of at most ${issue.maximum}, got ${got}`;
    case 'invalid_format':
      return `${issue.message.startsWith('expected') ? issue.message : `expected ${issue.format}`}, got ${got}`;
    default:
      return `${issue.message}, got ${got}`;
  }
}

/** How many items an array input held, for "expected at most 500 item(s), got 100000". */
function countOf(input: unknown): string {
  return Array.isArray(input) ? `"${input.length} items"` : quoteGot(input);
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
