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

  it('tells equal characteristics from ones that differ in a single value, however the file orders their fields', () => {
    // Illustrative fuse tables (invented): the second differs from the first in one time only.
    const fuse = (lastTime: number, reversed = false) => {
      const fields = {
        kind: 'fuse',
        label: 'Illustrative 100 A fuse (illustrative, not a product)',
        illustrative: true,
        minimumMelting: [
          [150, 300],
          [500, 10],
          [2000, lastTime],
        ],
        totalClearing: [
          [150, 330],
          [500, 12],
          [2000, 0.05],
        ],
      };
      const ordered = reversed ? Object.fromEntries(Object.entries(fields).reverse()) : fields;
      return characteristicSchema.parse(ordered);
    };
    const band = cachedBandOf(fuse(0.02));
    expect(cachedBandOf(fuse(0.02, true))).toBe(band);
    const other = cachedBandOf(fuse(0.03));
    expect(other).not.toBe(band);
    expect(other.minTime(2000)).toBe(0.03);
    expect(band.minTime(2000)).toBe(0.02);
    // Many kinds seen since: an equal characteristic still finds its band (by its content as text).
    for (let pickup = 1; pickup <= 40; pickup++)
      cachedBandOf(
        characteristicSchema.parse({ kind: 'trip-unit', sensor: 100 * pickup, longTime: { pickup: 1, delay: 4 } }),
      );
    expect(cachedBandOf(fuse(0.02))).toBe(band);
  });

  it('gives a ground-fault band once per content, to a twin read later too', () => {
    const first = cachedGroundBandOf(unit())!;
    expect(cachedGroundBandOf(unit())).toBe(first);
    const other = characteristicSchema.parse({ ...unit(), ground: { pickup: 0.6, delay: 0.2 } });
    expect(cachedGroundBandOf(other)).not.toBe(first);
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
