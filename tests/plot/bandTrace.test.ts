import { describe, expect, it } from 'vitest';
import { clampTime, traceBand } from '../../src/plot/bandTrace.ts';
import { breakerBand, relayBand, singleLineBand } from './fixtures.ts';

const window = { amps: [10, 1e5] as [number, number], seconds: [0.01, 1000] as [number, number] };

describe('traceBand', () => {
  it('has the expected defaults', () => {
    const trace = traceBand(relayBand(), window, 100)!;
    expect(trace.coincident).toBe(false);
    expect(trace.amps[0]).toBe(380);
    expect(trace.amps.at(-1)).toBe(1e5);
    expect(trace.amps.length).toBeGreaterThan(100 * Math.log10(1e5 / 380));
  });

  it('traceBand samples both sides of every breakpoint', () => {
    const trace = traceBand(breakerBand(), window, 50)!;
    const has = (a: number) => trace.amps.some((x) => Math.abs(x / a - 1) < 1e-14);
    for (const b of [1100, 9000, 11000]) {
      expect(trace.amps.includes(b)).toBe(true);
      expect(has(b * (1 - 1e-9)) && has(b * (1 + 1e-9))).toBe(true);
    }
  });

  it('traceBand finds where an edge crosses the top of the sheet, to 1e-12 in current', () => {
    // The relay's minimum edge reaches 1000 s where VI gives 1000 s: M² = 1 + 19.61 / (1000 − 0.491) (computed).
    const trace = traceBand(relayBand(), window, 100)!;
    const i = trace.minTimes.indexOf(1000);
    const expected = 380 * Math.sqrt(1 + 19.61 / (1000 - 0.491));
    expect(Math.abs(trace.amps[i] / expected - 1)).toBeLessThan(1e-11);
  });

  it('traceBand marks the crossing of the half-cycle line on an instantaneous drop', () => {
    // The breaker's minimum edge drops from 3.56 s to 0.005 s at 9000 A, through the 0.01 s line.
    const trace = traceBand(breakerBand(), window, 50)!;
    const i = trace.minTimes.indexOf(0.01);
    expect(Math.abs(trace.amps[i] / 9000 - 1)).toBeLessThan(1e-8);
  });

  it('traceBand is null for a band that never reaches the current range', () => {
    expect(traceBand(breakerBand(), { ...window, amps: [10, 500] }, 50)).toBeNull();
    expect(traceBand(singleLineBand(), window, 50)!.coincident).toBe(true);
  });
});

describe('clampTime', () => {
  it('clampTime holds times inside the window, Infinity at the top', () => {
    expect(clampTime(Infinity, [0.01, 1000])).toBe(1000);
    expect(clampTime(0.005, [0.01, 1000])).toBe(0.01);
    expect(clampTime(2, [0.01, 1000])).toBe(2);
  });
});
