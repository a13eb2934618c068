import { expect } from 'vitest';
import type { Band } from '../../../src/engine/band.ts';

/** Currents every band is probed at besides its own breakpoints: zero, tiny, huge, unbounded. */
export const EDGE_CURRENTS = [0, 1e-9, 1e-3, 1, 1e6, 1e9, 1e300, Infinity];

/**
 * Asserts the `Band` contract at the given currents plus the band's breakpoints (each, and just
 * either side of it): no NaN, `minTime ≤ maxTime`, both edges non-increasing in current, `Infinity`
 * below `minAmps`, and ascending unique breakpoints.
 */
export function assertBandContract(band: Band, currents: readonly number[] = []): void {
  const breakpoints = [...band.breakpoints];
  breakpoints.forEach((b, i) => {
    expect(Number.isFinite(b) && b > 0, `breakpoint ${b}`).toBe(true);
    if (i > 0) expect(b > breakpoints[i - 1], `breakpoints ascending at ${b}`).toBe(true);
  });
  const probe = [...currents, ...EDGE_CURRENTS, ...breakpoints.flatMap((b) => [b * (1 - 1e-9), b, b * (1 + 1e-9)])]
    .filter((amps) => !Number.isNaN(amps))
    .sort((a, b) => a - b);
  let previous = { min: Infinity, max: Infinity };
  for (const amps of probe) {
    const min = band.minTime(amps);
    const max = band.maxTime(amps);
    expect(Number.isNaN(min) || Number.isNaN(max), `NaN at ${amps} A`).toBe(false);
    expect(min >= 0 && max >= 0, `negative time at ${amps} A`).toBe(true);
    expect(min <= max, `minTime ${min} > maxTime ${max} at ${amps} A`).toBe(true);
    // A relative slack of 1e-12 forgives rounding where two formulas meet at a breakpoint.
    expect(min <= previous.min * (1 + 1e-12), `minTime rises to ${min} at ${amps} A`).toBe(true);
    expect(max <= previous.max * (1 + 1e-12), `maxTime rises to ${max} at ${amps} A`).toBe(true);
    if (amps < band.minAmps) expect(min, `operates below minAmps at ${amps} A`).toBe(Infinity);
    previous = { min, max };
  }
  expect(Number.isFinite(band.minTime(band.minAmps * (1 + 1e-6)))).toBe(true);
}
