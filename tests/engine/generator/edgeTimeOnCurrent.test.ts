import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandOf } from '../../../src/engine/band.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { decrementOperatingTime, edgeTimeOnCurrent } from '../../../src/engine/generator/index.ts';
import { assertInDelta } from '../../asserts.ts';

const NO_TOLERANCE = {
  pickup: 0,
  groundPickup: 0,
  longTimeBelow: 0,
  longTimeAbove: 0,
  shortTimeBelow: 0,
  shortTimeAbove: 0,
};

/**
 * A 1000 A trip unit without tolerance: long-time pickup 1000 A, 10 s at 6 × (t = 10 · (6000 / I)² s),
 * short-time 4 × (4000 A) flat at 0.3 s, clearing within 3 cycles (0.05 s at 60 Hz). Invented settings.
 */
const BREAKER = bandOf(
  readCharacteristic({
    kind: 'trip-unit',
    sensor: 1000,
    longTime: { pickup: 1, delay: 10 },
    shortTime: { pickup: 4, delay: 0.3 },
    tolerance: NO_TOLERANCE,
  }),
);

describe('edgeTimeOnCurrent', () => {
  it('has the expected defaults: a constant current gives the edge at that current', () => {
    assertInDelta(
      edgeTimeOnCurrent(BREAKER, 'max', () => 3000),
      BREAKER.maxTime(3000),
      1e-8,
    );
    assertInDelta(
      edgeTimeOnCurrent(BREAKER, 'min', () => 6000),
      BREAKER.minTime(6000),
      1e-8,
    );
    expect(edgeTimeOnCurrent(BREAKER, 'max', () => 900)).toBe(Infinity);
  });

  it('a short-time delay the current leaves unfinished gives no head start: 6000 A for 0.2 s then 3000 A clears on long time at 0.2 + 40 × (1 − 0.2/10) = 39.4 s (hand-worked, IEEE C37.112 integral per element)', () => {
    // Long time: 10 s at 6000 A, 40 s at 3000 A. The 0.3 s short-time element sees 6000 A for 0.2 s only
    // and resets below its 4000 A pickup; integrating the edge whole would take it two thirds done and
    // clear at 0.2 + 40 × (1 − 0.2/0.3) = 13.53 s.
    const step = (t: number) => (t < 0.2 ? 6000 : 3000);
    assertInDelta(edgeTimeOnCurrent(BREAKER, 'max', step), 39.4, 1e-6);
    assertInDelta(decrementOperatingTime(BREAKER.maxTime, step), 0.2 + 40 / 3, 1e-6);
  });

  it('a short-time delay the current outlasts operates at its delay: 6000 A for 0.5 s then 3000 A clears at 0.3 s', () => {
    const step = (t: number) => (t < 0.5 ? 6000 : 3000);
    assertInDelta(edgeTimeOnCurrent(BREAKER, 'max', step), 0.3, 1e-6);
  });

  it('adds a relay edge’s breaker time once, after the first element operates (IEEE C37.112 very inverse, TD 2, 600 A; instantaneous 6000 A)', () => {
    const relay = bandOf(
      readCharacteristic({
        kind: 'relay',
        ct: '600:5',
        timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 },
        instantaneous: { pickup: 50 },
        tolerance: { pickup: 0, time: 0 },
      }),
    );
    const curve = (amps: number) => 2 * (19.61 / ((amps / 600) ** 2 - 1) + 0.491);
    const breaker = relay.maxTime(3000) - curve(3000);
    // 5000 A (M = 8.33) for 0.5 s, then 3000 A (M = 5): the instantaneous element never picks up, and
    // the very inverse element integrates on its own curve.
    const falling = (t: number) => (t < 0.5 ? 5000 : 3000);
    const expected = 0.5 + curve(3000) * (1 - 0.5 / curve(5000)) + breaker;
    assertInDelta(edgeTimeOnCurrent(relay, 'max', falling), expected, 1e-6);
    // 8000 A at the start picks up the instantaneous element, which operates at once.
    const high = (t: number) => (t < 0.01 ? 8000 : 3000);
    assertInDelta(edgeTimeOnCurrent(relay, 'max', high), relay.maxTime(8000), 1e-9);
  });

  it('reads a fuse, one curve each edge, as the whole edge', () => {
    const fuse = bandOf(
      readCharacteristic({
        kind: 'fuse',
        illustrative: true,
        minimumMelting: [
          [300, 100],
          [30_000, 0.01],
        ],
        totalClearing: [
          [300, 150],
          [30_000, 0.015],
        ],
      }),
    );
    const decay = (t: number) => 400 + 3000 * Math.exp(-t / 0.4);
    expect(edgeTimeOnCurrent(fuse, 'min', decay)).toBe(decrementOperatingTime(fuse.minTime, decay));
  });

  it('is never earlier than the whole edge integrated, and equals the edge at any constant current (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1.5, max: 10, noNaN: true }),
        fc.double({ min: 0.05, max: 0.5, noNaN: true }),
        fc.double({ min: 1200, max: 30_000, noNaN: true }),
        fc.double({ min: 0.01, max: 2, noNaN: true }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        (shortPickup, shortDelay, start, tau, floor) => {
          const band = bandOf(
            readCharacteristic({
              kind: 'trip-unit',
              sensor: 1000,
              longTime: { pickup: 1, delay: 10 },
              shortTime: { pickup: shortPickup, delay: shortDelay },
              instantaneous: { pickup: 12 },
            }),
          );
          const decay = (t: number) => start * (floor + (1 - floor) * Math.exp(-t / tau));
          for (const edge of ['min', 'max'] as const) {
            const whole = decrementOperatingTime(edge === 'min' ? band.minTime : band.maxTime, decay);
            expect(edgeTimeOnCurrent(band, edge, decay)).toBeGreaterThanOrEqual(whole * (1 - 1e-6));
            const constant = edge === 'min' ? band.minTime(start) : band.maxTime(start);
            const read = edgeTimeOnCurrent(band, edge, () => start);
            if (constant === Infinity) expect(read).toBe(Infinity);
            else assertInDelta(read, constant, 1e-6);
          }
        },
      ),
      { seed: 70_101, numRuns: 60 },
    );
  });
});
