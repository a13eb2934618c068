import { expect } from 'vitest';

/**
 * Asserts `actual` is within a relative tolerance of `expected` (default 1e-6). For an expected
 * value of zero the tolerance is absolute, since a relative one would demand exact equality.
 *
 * @example assertInDelta(relayTime, 1.37816, 1e-5) // IEEE C37.112 VI, TD 2, M 10
 */
export function assertInDelta(actual: number, expected: number, relative = 1e-6, message?: string): void {
  if (expected === Infinity || expected === -Infinity) {
    expect(actual, message).toBe(expected);
    return;
  }
  const tolerance = expected === 0 ? relative : Math.abs(expected) * relative;
  expect(Number.isFinite(actual), message ?? `expected a finite number near ${expected}, got ${actual}`).toBe(true);
  expect(
    Math.abs(actual - expected) <= tolerance,
    message ?? `expected ${actual} to be within ${relative} (relative) of ${expected}`,
  ).toBe(true);
}

/** Rounds every number in an SVG path string to `digits` decimals so paths compare across platforms. */
export function normalisePath(path: string, digits = 3): string {
  return path.replace(/-?\d*\.?\d+(e[-+]?\d+)?/gi, (n) => String(Number(Number(n).toFixed(digits))));
}

/** Asserts two SVG path strings are equal after rounding their numbers. */
export function assertPathEqual(actual: string, expected: string, digits = 3): void {
  expect(normalisePath(actual, digits)).toBe(normalisePath(expected, digits));
}
