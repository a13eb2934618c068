import { describe, expect, it } from 'vitest';
import { bandOf, fastestOf, groundFaultBandOf } from '../../src/engine/band.ts';
import { cachedBandOf, cachedFastestOf, cachedGroundBandOf, lazyBandsOf } from '../../src/engine/bandCache.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';

const unit = () =>
  characteristicSchema.parse({
    kind: 'trip-unit',
    sensor: 800,
    longTime: { pickup: 1, delay: 4 },
    shortTime: { pickup: 6, delay: 0.2 },
    ground: { pickup: 0.5, delay: 0.2 },
  });
const currents = [900, 2400, 4800, 6000, 20_000];

describe('bandCache', () => {
  it('has the expected defaults: the cached band is the band bandOf builds, shared by equal characteristics', () => {
    const a = unit();
    const b = unit();
    const band = cachedBandOf(a);
    expect(cachedBandOf(b)).toBe(band);
    const fresh = bandOf(a);
    expect(currents.map(band.minTime)).toEqual(currents.map(fresh.minTime));
    expect(currents.map(band.maxTime)).toEqual(currents.map(fresh.maxTime));
  });

  it('gives the ground-fault band of a trip unit with one, and none otherwise', () => {
    const ground = cachedGroundBandOf(unit())!;
    expect(currents.map(ground.minTime)).toEqual(currents.map(groundFaultBandOf(unit())!.minTime));
    const { ground: _, ...rest } = unit() as ReturnType<typeof unit> & { ground?: unknown };
    expect(cachedGroundBandOf(characteristicSchema.parse(rest))).toBeUndefined();
  });

  it('combines a phase and a ground band once', () => {
    const phase = cachedBandOf(unit());
    const ground = cachedGroundBandOf(unit())!;
    const both = cachedFastestOf(phase, ground);
    expect(cachedFastestOf(phase, ground)).toBe(both);
    expect(currents.map(both.minTime)).toEqual(currents.map(fastestOf([phase, ground]).minTime));
  });

  it('lazyBandsOf builds a device band only when asked, yet counts and lists every device', () => {
    const devices = [
      { id: 'A', characteristic: unit() },
      { id: 'B', characteristic: unit() },
    ];
    const bands = lazyBandsOf(devices);
    expect(bands.size).toBe(2);
    expect(bands.has('B')).toBe(true);
    expect(bands.get('C')).toBeUndefined();
    expect(bands.get('A')!.minTime(4800)).toBe(bandOf(devices[0].characteristic).minTime(4800));
    expect([...bands.keys()]).toEqual(['A', 'B']);
    expect([...bands].map(([id]) => id).sort()).toEqual(['A', 'B']);
  });
});
