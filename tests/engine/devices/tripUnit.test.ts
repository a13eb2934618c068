import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertInDelta } from '../../asserts.ts';
import { assertBandContract } from './bandInvariants.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { groundBandOf, longTimeRampBasis, tripUnitBand } from '../../../src/engine/devices/tripUnit.ts';
import { tripUnitSchema } from '../../../src/engine/devices/tripUnitSchema.ts';
import { findOverlaps } from '../../../src/engine/overlap.ts';

/** Invented settings worked by hand: I_r = 800 A, 10 s at 6 × I_r; short-time 4 × I_r, I²t in through (10 × I_r, 0.3 s). */
const example = {
  kind: 'trip-unit',
  sensor: 800,
  longTime: { pickup: 1, delay: 10 },
  shortTime: { pickup: 4, delay: 0.3, i2t: true },
} as const;

const noTolerance = {
  pickup: 0,
  longTimeBelow: 0,
  longTimeAbove: 0,
  shortTimeBelow: 0,
  shortTimeAbove: 0,
};

function rejection(input: unknown): string {
  try {
    readCharacteristic(input, { path: 'device.characteristic' });
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('tripUnit', () => {
  it('has the expected defaults', () => {
    const unit = tripUnitSchema.parse(example);
    expect(unit.longTime.delayAt).toBe(6);
    expect(unit.shortTime?.i2tThrough).toBe(10);
    // Common practice tolerances: pickup ±10 %, long-time −10/+20 %, short-time band +0.05 s.
    expect(unit.tolerance).toEqual({
      pickup: 10,
      groundPickup: 10,
      longTimeBelow: 10,
      longTimeAbove: 20,
      shortTimeBelow: 0,
      shortTimeAbove: 0.05,
    });
    assertInDelta(unit.openingTime, 0.5 / 60);
    assertInDelta(unit.clearingTime, 3 / 60); // LV power breaker instantaneous ≤ 3 cycles (common practice)
    expect(unit.currentLimiting).toBe(false);
  });

  it('tripUnitBand without tolerance is the nominal I²t curve t = 10 · (4800 / I)², worked by hand (computed)', () => {
    const band = tripUnitBand(tripUnitSchema.parse({ ...example, tolerance: noTolerance }));
    const table: Array<[number, number]> = [
      [1200, 160],
      [2400, 40],
      [3200, 1.875], // short-time picks up at 3200 A: 0.3 · (8000/3200)²
      [4800, 0.83333],
      [6400, 0.46875],
      [8000, 0.3],
      [20000, 0.3], // flat above 10 × I_r
    ];
    for (const [amps, seconds] of table) {
      assertInDelta(band.minTime(amps), seconds, 1e-5);
      assertInDelta(band.maxTime(amps), seconds, 1e-5);
    }
    assertInDelta(band.minTime(3199), 10 * (4800 / 3199) ** 2); // long-time just below the short-time pickup
    expect(band.minTime(799)).toBe(Infinity);
  });

  it('tripUnitBand edges with the default tolerances, worked by hand (common practice)', () => {
    const band = tripUnitBand(tripUnitSchema.parse(example));
    // Long-time: fast edge from 720 A at 0.9 · 10 s, slow edge from 880 A at 1.2 · 10 s.
    expect(band.minAmps).toBeCloseTo(720, 9);
    assertInDelta(band.minTime(1200), 144);
    assertInDelta(band.maxTime(1200), 192);
    expect(band.maxTime(870)).toBe(Infinity);
    // Short-time pickup 3200 A ± 10 %: the fast edge is on short time at 3200 A, the slow edge still long time.
    assertInDelta(band.minTime(3200), 1.875);
    assertInDelta(band.maxTime(3200), 27); // 12 · (4800/3200)²
    assertInDelta(band.maxTime(3600), 0.35 * (8000 / 3600) ** 2); // slow edge picked up at 3520 A
    assertInDelta(band.minTime(8000), 0.3);
    assertInDelta(band.maxTime(8000), 0.35);
    expect([...band.breakpoints].slice(0, 5).map((b) => Math.round(b))).toEqual([720, 880, 2880, 3520, 8000]);
  });

  it('tripUnitBand drops to the opening and clearing times above the instantaneous pickup', () => {
    const band = tripUnitBand(tripUnitSchema.parse({ ...example, instantaneous: { pickup: 12 } })); // 9600 A
    assertInDelta(band.minTime(8640), 0.5 / 60); // 9600 × 0.9
    assertInDelta(band.maxTime(8640), 0.35);
    assertInDelta(band.maxTime(10560), 3 / 60); // 9600 × 1.1
    expect(band.currentLimitingFrom).toBe(Infinity);
  });

  it('tripUnitBand lets the long-time ramp fall below a flat short-time delay at high current by default', () => {
    const flat = tripUnitSchema.parse({ ...example, shortTime: { pickup: 4, delay: 0.3 } });
    // Each function acts on its own (IEEE 1015 application practice, from memory): 0.9 · 10 · (4800/100000)².
    assertInDelta(tripUnitBand(flat).minTime(100_000), 9 * (4800 / 100_000) ** 2);
    // Handed over at the short-time pickup, the ramp no longer acts there and the short-time delay holds.
    const handOver = tripUnitBand({ ...flat, longTimeRamp: 'ends-at-short-time-pickup' });
    assertInDelta(handOver.minTime(100_000), 0.3);
    assertInDelta(handOver.maxTime(100_000), 0.35);
    // Below the short-time pickup both read the long-time ramp: 1.2 · 10 · (4800/3000)².
    assertInDelta(handOver.maxTime(3000), 30.72);
  });

  it('tripUnitBand with odd settings, worked by hand: 1200 A sensor, 0.85 × I_n, 7 s, short-time 3.5 × at 0.17 s', () => {
    // I_r = 0.85 · 1200 = 1020 A; the ramp passes 7 s at 6 · 1020 = 6120 A (fast 6.3 s, slow 8.4 s).
    // Short-time 3.5 · 1020 = 3570 A: fast edge from 3213 A at 0.17 s, slow edge from 3927 A at 0.22 s.
    const band = tripUnitBand(
      tripUnitSchema.parse({
        kind: 'trip-unit',
        sensor: 1200,
        longTime: { pickup: 0.85, delay: 7 },
        shortTime: { pickup: 3.5, delay: 0.17 },
      }),
    );
    assertInDelta(band.minTime(3212.9), 6.3 * (6120 / 3212.9) ** 2); // just below the fast short-time pickup: 22.86 s
    assertInDelta(band.minTime(3213), 0.17);
    assertInDelta(band.maxTime(3500), 25.683017, 1e-6); // 8.4 · (6120/3500)² = 8.4 · 3.0575020
    assertInDelta(band.maxTime(3927 * (1 + 1e-9)), 0.22);
    assertInDelta(band.maxTime(3926.9), 8.4 * (6120 / 3926.9) ** 2); // 20.40 s just below it
    // Far up the ramp passes under the delay: fast edge at 6120 · √(6.3/0.17) = 37 256 A, slow at 37 816 A.
    assertInDelta(band.minTime(37_000), 0.17);
    assertInDelta(band.minTime(50_000), 0.0943851, 1e-6); // 6.3 · (6120/50 000)² = 6.3 · 0.01498176
    assertInDelta(band.maxTime(50_000), 0.1258468, 1e-6); // 8.4 · 0.01498176
  });

  describe('the long-time ramp below the short-time delay before the short-time pickup', () => {
    // 800 A sensor, long-time 1 × I_n, 0.5 s at 6 × I_r, short-time 10 × I_r, 0.4 s flat (invented settings).
    // Worked by hand with the I²t law t = t_LT · (6 · I_r / I)² and the common-practice tolerances:
    // fast edge 0.9 · 0.5 = 0.45 s through 4800 A, short-time from 7200 A at 0.40 s;
    // slow edge 1.2 · 0.5 = 0.60 s through 4800 A, short-time from 8800 A at 0.45 s.
    const main = tripUnitSchema.parse({
      kind: 'trip-unit',
      sensor: 800,
      longTime: { pickup: 1, delay: 0.5 },
      shortTime: { pickup: 10, delay: 0.4 },
    });
    const fastRamp = (amps: number) => 0.45 * (4800 / amps) ** 2;
    const slowRamp = (amps: number) => 0.6 * (4800 / amps) ** 2;

    it('reads about 0.21 / 0.28 s at 7 kA, not the short-time 0.40 / 0.45 s', () => {
      const band = tripUnitBand(main);
      // 0.45 · (4800/7000)² = 0.45 · 0.470204 = 0.211592 s; 0.60 · 0.470204 = 0.282122 s.
      assertInDelta(band.minTime(7000), 0.211592, 1e-5);
      assertInDelta(band.maxTime(7000), 0.282122, 1e-5);
      expect(longTimeRampBasis(main)).toMatch(/each function acts on its own/);
    });

    it('follows the ramp straight through the ramp-meets-delay points', () => {
      const band = tripUnitBand(main);
      const fastMeets = 4800 * Math.sqrt(0.45 / 0.4); // 5091.17 A, where the fast ramp reaches 0.40 s
      const slowMeets = 4800 * Math.sqrt(0.6 / 0.45); // 5542.56 A, where the slow ramp reaches 0.45 s
      assertInDelta(fastMeets, 5091.169, 1e-6);
      assertInDelta(slowMeets, 5542.563, 1e-6);
      for (const factor of [1 - 1e-6, 1, 1 + 1e-6, 1.1]) {
        assertInDelta(band.minTime(fastMeets * factor), fastRamp(fastMeets * factor));
        assertInDelta(band.maxTime(slowMeets * factor), slowRamp(slowMeets * factor));
      }
    });

    it('is not raised by the short-time pickup on either side of it', () => {
      const band = tripUnitBand(main);
      for (const amps of [7200 * (1 - 1e-9), 7200, 7200 * (1 + 1e-9), 8000]) {
        assertInDelta(band.minTime(amps), fastRamp(amps)); // 0.2 s at 7200 A, below the 0.40 s delay
      }
      for (const amps of [8800 * (1 - 1e-9), 8800, 8800 * (1 + 1e-9)]) {
        assertInDelta(band.maxTime(amps), slowRamp(amps)); // 0.17851 s at 8800 A
      }
      assertInDelta(band.maxTime(8800), 0.178512, 1e-5);
      // Far above: the fast ramp is 0.02592 s at 20 kA; the slow edge is floored at the 3-cycle clearing.
      assertInDelta(band.minTime(20_000), 0.02592);
      assertInDelta(band.maxTime(20_000), 3 / 60);
      assertBandContract(band);
    });

    it('ends the ramp at the short-time pickup only when the unit says so, and still bounds it', () => {
      const unit = { ...main, longTimeRamp: 'ends-at-short-time-pickup' as const };
      const band = tripUnitBand(unit);
      expect(longTimeRampBasis(unit)).toMatch(/ends at the short-time pickup/);
      expect(band.diagnostics).toContain(longTimeRampBasis(unit)); // named among the band's notes
      expect(tripUnitBand(main).diagnostics.join('\n')).not.toMatch(/short-time pickup/);
      // Fast edge: a unit whose short-time pickup is at the top of its band (8800 A) is still on its ramp
      // up to there, so the ramp to 8800 A, then held at its 0.45 · (4800/8800)² = 0.133884 s.
      assertInDelta(band.minTime(7000), 0.211592, 1e-5);
      assertInDelta(band.minTime(7200), 0.2);
      assertInDelta(band.minTime(8000), fastRamp(8000)); // 0.162 s, not the 0.2 s held from 7200 A
      assertInDelta(band.minTime(10_000), 0.133884, 1e-5);
      // Slow edge: the ramp to where it meets 0.45 s (5542.56 A), then the short-time delay.
      assertInDelta(band.maxTime(5000), slowRamp(5000));
      assertInDelta(band.maxTime(7000), 0.45);
      assertInDelta(band.maxTime(10_000), 0.45);
      expect(band.diagnostics.join('\n')).toMatch(/long-time ramp is at 0\.2 s at the short-time pickup 7200 A/);
      assertBandContract(band);
    });

    it('with an I²t short-time, bounds a unit that leaves its ramp at the bottom of the pickup band', () => {
      // The same main with its short-time I²t in, through 10 × I_r = 8000 A (invented settings). Its
      // slow short-time curve is 0.45 · (8000/I)² below 8000 A: 0.5556 s at 7200 A, above the slow
      // ramp's 0.2667 s there. A unit picking up at 7200 A follows that curve above 7200 A, so the slow
      // edge is the ramp to where it meets 0.5556 s (4800 · √(0.6/0.5556) = 4988.0 A), 0.5556 s to
      // 7200 A, then the short-time curve: 0.512 s at 7500 A, where the curve from 8800 A would say 0.45 s.
      const band = tripUnitBand({
        ...main,
        shortTime: { ...main.shortTime!, i2t: true },
        longTimeRamp: 'ends-at-short-time-pickup',
      });
      const slowShort = (amps: number) => 0.45 * (8000 / amps) ** 2;
      assertInDelta(band.maxTime(4900), slowRamp(4900));
      assertInDelta(band.maxTime(6000), slowShort(7200));
      assertInDelta(band.maxTime(7500), slowShort(7500));
      assertInDelta(band.maxTime(7500), 0.512, 1e-3);
      assertInDelta(band.maxTime(9000), 0.45);
      // Never below the fast edge, which holds the fast ramp's 0.133884 s from 8800 A.
      for (const amps of [5000, 7200, 7500, 8800, 9000, 20_000])
        expect(band.minTime(amps)).toBeLessThanOrEqual(band.maxTime(amps));
      assertBandContract(band);
    });

    it('keeps its edges ordered where the fast short-time curve meets the slow ramp (found by the property test)', () => {
      // 100 A sensor, 0.4 × I_n, long-time 0.9615 s, short-time 1.5 × I_r I²t at 0.4154 s: the fast edge's
      // short-time curve and the slow edge's held level met at 62.35 A, and the slow edge lay below.
      const band = tripUnitBand(
        tripUnitSchema.parse({
          kind: 'trip-unit',
          sensor: 100,
          longTime: { pickup: 0.4, delay: 0.961538461555409 },
          shortTime: { pickup: 1.5, delay: 0.4153846153923523, i2t: true },
          longTimeRamp: 'ends-at-short-time-pickup',
        }),
      );
      for (const amps of [50, 54, 58, 62.35382907251078, 64, 66, 100])
        expect(band.minTime(amps)).toBeLessThanOrEqual(band.maxTime(amps));
      assertBandContract(band);
    });

    it('with the hand-over, each edge bounds every unit whose short-time pickup lies in its tolerance band', () => {
      // A unit of the band is the same settings with its short-time pickup anywhere in ±10 % and no pickup
      // tolerance of its own: the band's fast edge is never slower, its slow edge never faster.
      const settings = fc.record({
        sensor: fc.integer({ min: 100, max: 5000 }),
        pickup: fc.double({ min: 0.4, max: 1, noNaN: true }),
        delay: fc.double({ min: 0.5, max: 30, noNaN: true }),
        shortPickup: fc.double({ min: 1.5, max: 12, noNaN: true }),
        shortDelay: fc.double({ min: 0.05, max: 0.5, noNaN: true }),
        i2t: fc.boolean(),
        i2tThrough: fc.double({ min: 2, max: 16, noNaN: true }),
      });
      fc.assert(
        fc.property(settings, (t) => {
          const unitWith = (shortPickup: number, pickupTolerance: number) =>
            tripUnitSchema.parse({
              kind: 'trip-unit',
              sensor: t.sensor,
              longTime: { pickup: t.pickup, delay: t.delay },
              shortTime: { pickup: shortPickup, delay: t.shortDelay, i2t: t.i2t, i2tThrough: t.i2tThrough },
              tolerance: { pickup: pickupTolerance },
              longTimeRamp: 'ends-at-short-time-pickup',
            });
          const band = tripUnitBand(unitWith(t.shortPickup, 10));
          const ratedAmps = t.pickup * t.sensor;
          for (const factor of [0.9, 0.95, 1, 1.05, 1.1]) {
            const unit = tripUnitBand(unitWith(t.shortPickup * factor, 0));
            for (let k = 0; k <= 60; k++) {
              const amps = 1.2 * ratedAmps * 40 ** (k / 60);
              expect(band.minTime(amps)).toBeLessThanOrEqual(unit.minTime(amps) * (1 + 1e-9));
              expect(band.maxTime(amps)).toBeGreaterThanOrEqual(unit.maxTime(amps) * (1 - 1e-9));
            }
          }
        }),
        { numRuns: 200 },
      );
    });

    it('makes an upstream main overlap a feeder between about 5.9 and 7.3 kA', () => {
      // Feeder (invented): 600 A sensor, long-time 0.5 s handed over at its short-time pickup, short-time
      // 4 × I_r at 0.25 s flat (slow edge 0.30 s from 2640 A), instantaneous 11 × I_n (slow edge 7260 A).
      const feeder = tripUnitBand(
        tripUnitSchema.parse({
          kind: 'trip-unit',
          sensor: 600,
          longTime: { pickup: 1, delay: 0.5 },
          shortTime: { pickup: 4, delay: 0.25 },
          instantaneous: { pickup: 11 },
          longTimeRamp: 'ends-at-short-time-pickup',
        }),
      );
      const intervals = findOverlaps(tripUnitBand(main), feeder, { toAmps: 12_000, margin: 0 });
      const overlap = intervals.find((interval) => interval.status === 'overlap')!;
      // The main's fast ramp reaches the feeder's 0.30 s at 4800 · √(0.45 / 0.30) = 5878.78 A.
      assertInDelta(overlap.fromAmps, 4800 * Math.sqrt(0.45 / 0.3), 1e-5);
      assertInDelta(overlap.toAmps, 7260, 1e-5);
      // Below it the margin thins from where the ramp is 0.1 s above 0.30 s: 4800 · √(0.45 / 0.40) = 5091.17 A.
      expect(intervals.slice(0, 3).map((interval) => interval.status)).toEqual(['selective', 'thin margin', 'overlap']);
      assertInDelta(intervals[1].fromAmps, 4800 * Math.sqrt(0.45 / 0.4), 1e-5);
    });
  });

  it('tripUnitBand starts current limiting at the instantaneous slow edge when flagged', () => {
    const flagged = tripUnitBand(
      tripUnitSchema.parse({ ...example, instantaneous: { pickup: 10 }, currentLimiting: true }),
    );
    assertInDelta(flagged.currentLimitingFrom, 8800);
    const given = tripUnitBand(tripUnitSchema.parse({ ...example, currentLimitingFrom: '20 kA' }));
    expect(given.currentLimitingFrom).toBe(20000);
  });

  it('groundBandOf is undefined without a ground element and banded like short time with one', () => {
    expect(groundBandOf(tripUnitSchema.parse(example))).toBeUndefined();
    const unit = tripUnitSchema.parse({ ...example, sensor: 2000, ground: { pickup: 0.6, delay: 0.3 } });
    const ground = groundBandOf(unit)!;
    expect(ground.minAmps).toBeCloseTo(1080, 9); // 1200 A − 10 %
    expect(ground.maxTime(1300)).toBe(Infinity); // 1200 A + 10 % = 1320 A
    assertInDelta(ground.minTime(3000), 0.3);
    assertInDelta(ground.maxTime(3000), 0.35);
    expect(ground.diagnostics).toEqual([]);
    const i2t = groundBandOf(
      tripUnitSchema.parse({ ...example, sensor: 2000, ground: { pickup: 0.6, delay: 0.3, i2t: true } }),
    )!;
    assertInDelta(i2t.minTime(1500), 0.3 * (2000 / 1500) ** 2); // I²t through (1 × I_n, 0.3 s)
  });

  it('groundBandOf notes settings beyond NEC 230.95 (from memory)', () => {
    const unit = tripUnitSchema.parse({ ...example, sensor: 3000, ground: { pickup: 0.5, delay: 1 } });
    const text = groundBandOf(unit)!.diagnostics.join('\n');
    expect(text).toMatch(/ground-fault pickup 1500 A is above the 1200 A of NEC 230\.95/);
    expect(text).toMatch(/clearing at 3000 A is later than the 1 s/);
  });

  it('tripUnitBand notes settings outside the usual ranges', () => {
    const band = tripUnitBand(tripUnitSchema.parse({ ...example, longTime: { pickup: 0.3, delay: 40 } }));
    expect(band.diagnostics.join('\n')).toMatch(/long-time pickup 0\.3 × I_n is outside the usual 0\.4–1 × I_n/);
    expect(band.diagnostics.join('\n')).toMatch(/long-time delay 40 s is outside the usual 2–30 s/);
  });

  it('tripUnitSchema rejects bad settings with the field path', () => {
    expect(rejection({ ...example, sensor: 0 })).toMatch(
      /^device\.characteristic\.sensor: expected a current greater than 0, got "0"$/,
    );
    expect(rejection({ ...example, longTime: { pickup: 1 } })).toMatch(
      /^device\.characteristic\.longTime\.delay: expected/,
    );
    expect(rejection({ ...example, longTime: { pickup: 1, delay: 0 } })).toMatch(
      /longTime\.delay: expected a time greater than 0, got "0"$/,
    );
    expect(rejection({ ...example, shortTime: { pickup: -2, delay: 0.3 } })).toMatch(
      /shortTime\.pickup: expected a value of at least 0\.05, got "-2"$/,
    );
    expect(rejection({ ...example, openingTime: 0.1, clearingTime: 0.05 })).toMatch(
      /characteristic\.openingTime: expected an opening time no later than the clearing time 0\.05 s, got "0\.1"$/,
    );
    expect(
      rejection({ ...example, shortTime: { pickup: 4, delay: 0.02 }, tolerance: { shortTimeBelow: 0.05 } }),
    ).toMatch(/shortTime\.delay: expected a delay greater than the band's 0\.05 s below it, got "0\.02"$/);
    expect(rejection({ ...example, instantaneous: { pickup: 10, delay: 1 } })).toMatch(
      /instantaneous: expected no field "delay" here, got one$/,
    );
  });

  it('tripUnitBand keeps the band contract over random settings', () => {
    const settings = fc.record({
      sensor: fc.integer({ min: 100, max: 5000 }),
      ltPickup: fc.double({ min: 0.4, max: 1, noNaN: true }),
      ltDelay: fc.double({ min: 2, max: 30, noNaN: true }),
      shortTime: fc.option(
        fc.record({
          pickup: fc.double({ min: 1.5, max: 10, noNaN: true }),
          delay: fc.double({ min: 0.05, max: 0.5, noNaN: true }),
          i2t: fc.boolean(),
          i2tThrough: fc.double({ min: 2, max: 12, noNaN: true }),
        }),
        { nil: undefined },
      ),
      instantaneous: fc.option(fc.double({ min: 2, max: 15, noNaN: true }), { nil: undefined }),
      pickupTolerance: fc.integer({ min: 0, max: 200 }).map((tenths) => tenths / 10),
      longTimeRamp: fc.constantFrom('independent', 'ends-at-short-time-pickup'),
    });
    fc.assert(
      fc.property(
        settings,
        fc.array(fc.double({ min: 0, max: 1e7, noNaN: true }), { maxLength: 40 }),
        (s, currents) => {
          const unit = tripUnitSchema.parse({
            kind: 'trip-unit',
            sensor: s.sensor,
            longTime: { pickup: s.ltPickup, delay: s.ltDelay },
            shortTime: s.shortTime,
            instantaneous: s.instantaneous === undefined ? undefined : { pickup: s.instantaneous },
            tolerance: { pickup: s.pickupTolerance },
            longTimeRamp: s.longTimeRamp,
          });
          const band = tripUnitBand(unit);
          assertBandContract(band, currents);
          const lowPickup = s.sensor * s.ltPickup * (1 - s.pickupTolerance / 100);
          expect(band.minTime(lowPickup * (1 - 1e-9))).toBe(Infinity);
        },
      ),
      { numRuns: 300 },
    );
  });
});
