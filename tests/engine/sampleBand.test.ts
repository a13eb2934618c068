import { describe, expect, it } from 'vitest';
import { bandOf } from '../../src/engine/band.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';
import { sampleBand } from '../../src/engine/sampleBand.ts';

const relay = bandOf(
  characteristicSchema.parse({
    kind: 'relay',
    ct: '600:5',
    timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 },
    instantaneous: { pickup: 50 },
  }),
); // breakpoints 600 A and 6000 A

function rejection(options: Parameters<typeof sampleBand>[1]): string {
  try {
    sampleBand(relay, options);
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('sampleBand', () => {
  it('has the expected defaults', () => {
    const { amps } = sampleBand(relay, { fromAmps: 10, toAmps: 100 });
    expect(amps.length).toBe(101); // 100 per decade, both ends included, no breakpoint inside
    expect(amps[0]).toBe(10);
    expect(amps[amps.length - 1]).toBe(100);
  });

  it('sampleBand log-spaces currents and adds each breakpoint with a point just below it', () => {
    const { amps, minTimes, maxTimes } = sampleBand(relay, { fromAmps: 100, toAmps: 100_000, pointsPerDecade: 10 });
    expect(amps).toBeInstanceOf(Float64Array);
    expect(amps.length).toBe(31 + 4);
    for (const breakpoint of [600, 6000]) {
      const at = amps.indexOf(breakpoint);
      expect(at).toBeGreaterThan(0);
      expect(amps[at - 1]).toBeCloseTo(breakpoint * (1 - 1e-9), 9);
    }
    const below = amps.indexOf(6000) - 1;
    expect(minTimes[below]).toBeGreaterThan(1); // still on the inverse curve
    expect(minTimes[below + 1]).toBeCloseTo(1 / 60, 12); // the vertical edge is exact
    expect(minTimes[amps.indexOf(600)]).toBe(Infinity);
    expect(maxTimes.length).toBe(amps.length);
    for (let i = 1; i < amps.length; i++) expect(amps[i]).toBeGreaterThan(amps[i - 1]);
  });

  it('sampleBand keeps breakpoints at the range ends without duplicates', () => {
    const { amps } = sampleBand(relay, { fromAmps: 600, toAmps: 6000, pointsPerDecade: 1 });
    expect([...amps]).toEqual([600, 6000 * (1 - 1e-9), 6000]);
  });

  it('sampleBand rejects a bad range with the option named', () => {
    expect(rejection({ fromAmps: 0, toAmps: 10 })).toMatch(/^fromAmps: expected a current greater than 0, got "0"$/);
    expect(rejection({ fromAmps: 10, toAmps: 5 })).toMatch(/^toAmps: expected a current above fromAmps 10, got "5"$/);
    expect(rejection({ fromAmps: 1, toAmps: 10, pointsPerDecade: 0 })).toMatch(
      /^pointsPerDecade: expected a number of at least 1, got "0"$/,
    );
  });
});
