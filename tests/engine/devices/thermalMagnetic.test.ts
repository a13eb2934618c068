import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertInDelta } from '../../asserts.ts';
import { assertBandContract } from './bandInvariants.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { thermalMagneticBand } from '../../../src/engine/devices/thermalMagnetic.ts';
import {
  createThermalMagneticSchema,
  thermalMagneticSchema,
} from '../../../src/engine/devices/thermalMagneticSchema.ts';

/** An invented 100 A breaker (illustrative, not a product): thermal band in multiples of the rating. */
const breaker = {
  kind: 'thermal-magnetic',
  illustrative: true,
  rating: 100,
  thermal: {
    minimum: [
      [1.05, 3600],
      [2, 80],
      [10, 1.2],
    ],
    maximum: [
      [1.35, 3600],
      [2, 400],
      [10, 6],
    ],
  },
  magnetic: { pickup: 10 },
} as const;

function rejection(input: unknown): string {
  try {
    readCharacteristic(input, { path: 'device.characteristic' });
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('thermalMagnetic', () => {
  it('has the expected defaults', () => {
    const parsed = thermalMagneticSchema.parse(breaker);
    expect(parsed.magnetic.tolerance).toBe(20); // ±20 % (common practice, UL 489 thermal-magnetic practice)
    assertInDelta(parsed.openingTime, 0.5 / 60);
    assertInDelta(parsed.clearingTime, 1 / 60); // ≤ 1 cycle (UL 489 thermal-magnetic practice)
    expect(parsed.currentLimiting).toBe(false);
    assertInDelta(createThermalMagneticSchema(50).parse(breaker).clearingTime, 0.02);
  });

  it('thermalMagneticBand scales the thermal tables by the rating and interpolates log-log', () => {
    const band = thermalMagneticBand(thermalMagneticSchema.parse(breaker));
    expect(band.minAmps).toBeCloseTo(105, 9);
    expect(band.minTime(104)).toBe(Infinity);
    assertInDelta(band.minTime(200), 80, 1e-12);
    assertInDelta(band.maxTime(200), 400, 1e-12);
    expect(band.maxTime(130)).toBe(Infinity); // slow edge starts at 135 A
    // Half way in log between 2× and 10× (447.2 A): √(80 · 1.2) s on the fast edge (computed).
    assertInDelta(band.minTime(100 * Math.sqrt(20)), Math.sqrt(80 * 1.2), 1e-12);
  });

  it('thermalMagneticBand trips magnetically between pickup − 20 % and pickup + 20 %', () => {
    const band = thermalMagneticBand(thermalMagneticSchema.parse(breaker));
    expect(band.minTime(799)).toBeGreaterThan(1.2); // still on the thermal fast edge (10× = 1000 A is its last point)
    assertInDelta(band.minTime(800), 0.5 / 60);
    assertInDelta(band.maxTime(1199), 6); // thermal slow edge held at its last point beyond 1000 A
    assertInDelta(band.maxTime(1200), 1 / 60);
    expect([...band.breakpoints].map((b) => Math.round(b * 1e6) / 1e6)).toEqual([105, 135, 200, 800, 1000, 1200]);
    expect(band.diagnostics[0]).toMatch(/illustrative curve, not a product/);
  });

  it('thermalMagneticBand takes the magnetic pickup in amperes and notes one outside its range', () => {
    const band = thermalMagneticBand(
      thermalMagneticSchema.parse({
        ...breaker,
        thermal: {
          minimum: [...breaker.thermal.minimum, [15, 0.6]],
          maximum: [...breaker.thermal.maximum, [15, 3]],
        },
        magnetic: { pickupAmps: '1.5 kA', range: [500, 1000], tolerance: 10 },
      }),
    );
    assertInDelta(band.minTime(1350), 0.5 / 60);
    expect(band.minTime(1349)).toBeGreaterThan(0.6);
    expect(band.diagnostics.join('\n')).toMatch(/magnetic pickup 1500 is outside its adjustable range 500–1000/);
  });

  it('thermalMagneticBand does not extend a minimum thermal curve that ends below the magnetic trip', () => {
    // The table stops at 10 × (1.2 s); the magnetic trip at 15 × ± 20 % starts at 12 ×. Between them the
    // breaker is not known to wait: the fast edge takes the magnetic opening time (0.5 cycle) from 10 ×.
    const band = thermalMagneticBand(thermalMagneticSchema.parse({ ...breaker, magnetic: { pickup: 15 } }));
    assertInDelta(band.minTime(999.999), 1.2, 1e-5);
    assertInDelta(band.minTime(1000), 0.5 / 60);
    expect(band.maxTime(1100)).toBe(6);
    expect(band.diagnostics.join('\n')).toMatch(
      /minimum thermal curve ends at 10× rating, below the magnetic trip's lower edge at 12×/,
    );
  });

  it('thermalMagneticBand notes a thermal table that starts far above pickup, as one entered in amperes would', () => {
    // The 100 A breaker's table typed in amperes (105 A … 1000 A) reads as 105 × … 1000 × rating: no overload trip at 200 A.
    const inAmps = {
      ...breaker,
      thermal: {
        minimum: breaker.thermal.minimum.map(([m, t]) => [m * 100, t]),
        maximum: breaker.thermal.maximum.map(([m, t]) => [m * 100, t]),
      },
    };
    const band = thermalMagneticBand(thermalMagneticSchema.parse(inAmps));
    expect(band.minTime(200)).toBe(Infinity);
    expect(band.diagnostics.join('\n')).toMatch(
      /the thermal curve starts at 105× rating \(10500 A\): its currents are multiples of the rating, not amperes/,
    );
    // A table in multiples says nothing of the kind.
    expect(thermalMagneticBand(thermalMagneticSchema.parse(breaker)).diagnostics.join('\n')).not.toMatch(/starts at/);
  });

  it('thermalMagneticBand is current limiting from the magnetic slow edge when flagged', () => {
    const band = thermalMagneticBand(thermalMagneticSchema.parse({ ...breaker, currentLimiting: true }));
    assertInDelta(band.currentLimitingFrom, 1200);
  });

  it('thermalMagneticSchema rejects bad thermal tables and magnetic settings', () => {
    expect(rejection({ ...breaker, magnetic: { pickup: 10, pickupAmps: 1000 } })).toMatch(
      /^device\.characteristic\.magnetic\.pickup: expected exactly one of pickup \(× rating\) or pickupAmps, got both$/,
    );
    expect(rejection({ ...breaker, magnetic: {} })).toMatch(/magnetic\.pickup: expected exactly one .*, got neither$/);
    expect(
      rejection({
        ...breaker,
        thermal: {
          minimum: breaker.thermal.minimum,
          maximum: [
            [1.35, 3600],
            [2, 60],
            [10, 6],
          ],
        },
      }),
    ).toMatch(
      /thermal\.maximum: expected the maximum edge no earlier than the minimum edge, got 60 s at 2× \(minimum 80 s\)$/,
    );
    expect(
      rejection({
        ...breaker,
        thermal: {
          ...breaker.thermal,
          minimum: [
            [2, 80],
            [1.5, 100],
          ],
        },
      }),
    ).toMatch(/thermal\.minimum\[1\]\[0\]: expected a current above the previous point's 2×, got "1\.5"$/);
    expect(
      rejection({
        ...breaker,
        thermal: {
          ...breaker.thermal,
          minimum: [
            [-1, 80],
            [2, 10],
          ],
        },
      }),
    ).toMatch(/thermal\.minimum\[0\]\[0\]: expected a multiple of the rating greater than 0, got "-1"$/);
  });

  it('thermalMagneticBand keeps the band contract over random settings', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 15, max: 1200 }),
        fc.double({ min: 3, max: 15, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 1, max: 5, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 1e6, noNaN: true })),
        (rating, pickup, tolerance, slower, currents) => {
          const minimum = breaker.thermal.minimum.map(([m, t]) => [m, t] as [number, number]);
          const maximum = minimum.map(([m, t]) => [m * 1.2, t * slower] as [number, number]);
          const band = thermalMagneticBand(
            thermalMagneticSchema.parse({
              ...breaker,
              rating,
              thermal: { minimum, maximum },
              magnetic: { pickup, tolerance },
            }),
          );
          assertBandContract(band, currents);
        },
      ),
      { numRuns: 200 },
    );
  });
});
