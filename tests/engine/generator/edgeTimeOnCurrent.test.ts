import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandOf, fastestOf, groundFaultBandOf, scaleBand, type Band } from '../../../src/engine/band.ts';
import { compositeEdge, definiteElement, i2tElement, type EdgeElement } from '../../../src/engine/devices/composite.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import {
  decrementOperatingTime,
  edgeOperationOnCurrent,
  edgeTimeOnCurrent,
} from '../../../src/engine/generator/index.ts';
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
    // The element that acts is named, here and where the short time is left unfinished.
    expect(edgeOperationOnCurrent(BREAKER, 'max', step).element).toBe('short-time');
    expect(edgeOperationOnCurrent(BREAKER, 'max', (t) => (t < 0.2 ? 6000 : 3000)).element).toBe('long-time');
  });

  it('an instantaneous trip that outlasts its opening time clears by the clearing time, whatever the current does after; a shorter one leaves the breaker on long time (hand-worked)', () => {
    // BREAKER with an instantaneous trip at 6 × 1000 A: opening time half a cycle (1/120 s), clearing 3 cycles (0.05 s).
    const withInstantaneous = bandOf(
      readCharacteristic({
        kind: 'trip-unit',
        sensor: 1000,
        longTime: { pickup: 1, delay: 10 },
        shortTime: { pickup: 4, delay: 0.3 },
        instantaneous: { pickup: 6 },
        tolerance: NO_TOLERANCE,
      }),
    );
    const lasting = (t: number) => (t < 0.03 ? 10_000 : 3000);
    assertInDelta(edgeTimeOnCurrent(withInstantaneous, 'max', lasting), 0.05, 1e-9);
    // 10 kA for 5 ms only: long time at 3.6 s there, then 40 s at 3000 A.
    const brief = (t: number) => (t < 0.005 ? 10_000 : 3000);
    assertInDelta(edgeTimeOnCurrent(withInstantaneous, 'max', brief), 0.005 + 40 * (1 - 0.005 / 3.6), 1e-6);
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
    // 8000 A for 0.01 s, less than the relay's 1-cycle operating time (1/60 s): the instantaneous element
    // drops out unoperated, and the very inverse element carries on from what it gained.
    const brief = (t: number) => (t < 0.01 ? 8000 : 3000);
    const onCurve = 0.01 + curve(3000) * (1 - 0.01 / curve(8000)) + breaker;
    assertInDelta(edgeTimeOnCurrent(relay, 'max', brief), onCurve, 1e-6);
    // 8000 A for 0.02 s outlasts it: the instantaneous element operates, and the breaker clears 5 cycles later.
    const lasting = (t: number) => (t < 0.02 ? 8000 : 3000);
    assertInDelta(edgeTimeOnCurrent(relay, 'max', lasting), 1 / 60 + 5 / 60, 1e-6);
  });

  it('reads a band drawn on another voltage as the band itself at the current on its own voltage (IEEE 242 voltage-ratio reflection)', () => {
    // BREAKER at 480 V drawn on a 12.47 kV sheet: 12.47 kV amps × 12 470 / 480 are its own amps.
    const onSheet = scaleBand(BREAKER, 480 / 12_470);
    const factor = 12_470 / 480;
    const step = (t: number) => (t < 0.2 ? 6000 : 3000);
    expect(onSheet.parts).toBeDefined();
    assertInDelta(
      edgeTimeOnCurrent(onSheet, 'max', (t) => step(t) / factor),
      39.4,
      1e-6,
    );
    // A phase and ground band on one floor and added time read as one device's elements.
    const unit = readCharacteristic({
      kind: 'trip-unit',
      sensor: 1000,
      longTime: { pickup: 1, delay: 10 },
      ground: { pickup: 0.3, delay: 0.2 },
    });
    const both = fastestOf([bandOf(unit), groundFaultBandOf(unit)!]);
    expect(both.parts?.max.elements.length).toBe(2);
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

  it('on a falling current lies between the edge at its starting current and any time by which the edge at the current then has elapsed; at a constant current it is the edge (property)', () => {
    // Each element sees its largest current first, so none is faster than at I(0); and where
    // edge(I(T)) ≤ T, the element fastest at I(T) has been picked up throughout and done by then.
    const grid = Array.from({ length: 61 }, (_, k) => 10 ** (-3 + k / 10));
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
            const at = edge === 'min' ? band.minTime : band.maxTime;
            const read = edgeTimeOnCurrent(band, edge, decay);
            expect(read).toBeGreaterThanOrEqual(at(start) * (1 - 1e-6));
            // Told the current falls from `start`, it follows fewer elements to the same time.
            expect(edgeTimeOnCurrent(band, edge, decay, { fallingFrom: start })).toBe(read);
            for (const t of grid) if (at(decay(t)) <= t) expect(read).toBeLessThanOrEqual(t * (1 + 1e-6));
            const constant = edgeTimeOnCurrent(band, edge, () => start);
            if (at(start) === Infinity) expect(constant).toBe(Infinity);
            else assertInDelta(constant, at(start), 1e-6);
          }
        },
      ),
      { seed: 70_101, numRuns: 60 },
    );
  });
});

/** A band whose two edges are one composite edge of the given elements (invented, for the checks below). */
function bandOfParts(elements: EdgeElement[], floor: number, add: number): Band {
  const edge = compositeEdge(elements, floor, add);
  return {
    minTime: edge.time,
    maxTime: edge.time,
    breakpoints: Float64Array.from(edge.breakpoints),
    minAmps: edge.minAmps,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
    parts: { min: edge.parts, max: edge.parts },
  };
}

/** The plain reading the early exits must agree with: every element followed to the horizon. */
function followingEveryElement(band: Band, current: (t: number) => number): number {
  const parts = band.parts!.min;
  let first = Infinity;
  for (const element of parts.elements) {
    const time = (amps: number) => (amps >= element.pickup ? element.time(amps) : Infinity);
    first = Math.min(first, decrementOperatingTime(time, current));
  }
  return first === Infinity ? Infinity : Math.max(first, parts.floor) + parts.add;
}

describe('edgeTimeOnCurrent, its early exits', () => {
  it('reads an element faster than a microsecond after one at a microsecond (floor 0)', () => {
    const constant = () => 1000;
    const band = bandOfParts([definiteElement(100, 1e-6), definiteElement(100, 5e-7)], 0, 0);
    expect(edgeTimeOnCurrent(band, 'min', constant)).toBe(5e-7);
    const added = bandOfParts([definiteElement(100, 1e-6), definiteElement(100, 0)], 0, 0.05);
    expect(edgeTimeOnCurrent(added, 'min', constant)).toBe(0.05);
  });

  it.each([0.0128, 0.0163])(
    'give the time of following every element fully where a %s s delay ends just as the current falls through its pickup',
    (delay) => {
      // Behind an element 0.5 % slower: followed only as far as that one, the integral must take the same steps.
      const amps = (t: number) => 600 + 8000 * Math.exp(-t / 0.05);
      const band = bandOfParts([definiteElement(100, delay * 1.005), definiteElement(amps(delay), delay)], 0, 0);
      const full = followingEveryElement(band, amps);
      assertInDelta(edgeTimeOnCurrent(band, 'min', amps, { fallingFrom: amps(0) }), full, 1e-9);
    },
  );

  it.each(['decay', 'step'] as const)(
    'give the time of following every element fully, on a %s current, even where a delay ends as the current leaves its pickup (property)',
    (shape) => {
      const seconds = fc.oneof(
        fc.constantFrom(0, 5e-7, 1e-6, 2e-6, 0.0083, 0.05, 0.3, 1),
        fc.double({ min: 1e-3, max: 5, noNaN: true }),
      );
      const element = fc.oneof(
        fc.record({ kind: fc.constant('flat' as const), pickup: fc.constantFrom(100, 1000, 2000, 4000), seconds }),
        fc.record({
          kind: fc.constant('i2t' as const),
          pickup: fc.constantFrom(100, 1000, 2000),
          seconds: fc.constantFrom(0.05, 0.3, 1, 10),
          through: fc.constantFrom(1000, 6000),
          flatFrom: fc.constantFrom(Infinity, 3000, 8000),
        }),
      );
      const toElement = (e: {
        kind: 'flat' | 'i2t';
        pickup: number;
        seconds: number;
        through?: number;
        flatFrom?: number;
      }) =>
        e.kind === 'flat'
          ? definiteElement(e.pickup, e.seconds)
          : i2tElement(e.pickup, e.seconds, e.through!, e.flatFrom);
      fc.assert(
        fc.property(
          fc.array(element, { minLength: 1, maxLength: 4 }),
          fc.constantFrom(0, 0.0083, 0.05),
          fc.constantFrom(0, 0.083),
          fc.constantFrom(1500, 5000, 9000),
          fc.constantFrom(0.01, 0.1, 1),
          fc.constantFrom(0, 600, 2500, 12_000),
          (elements, floor, add, start, tau, after) => {
            const band = bandOfParts(elements.map(toElement), floor, add);
            const amps =
              shape === 'decay'
                ? (t: number) => Math.max(Math.min(after, start), start * Math.exp(-t / tau))
                : (t: number) => (t < tau / 10 ? start : after);
            const falling = shape === 'decay' || after <= start;
            const full = followingEveryElement(band, amps);
            const read = edgeTimeOnCurrent(band, 'min', amps, falling ? { fallingFrom: start } : {});
            if (full === Infinity || read === Infinity) expect(read).toBe(full);
            else expect(Math.abs(read - full)).toBeLessThanOrEqual(1e-7 * full);
          },
        ),
        { seed: 70_102, numRuns: 400 },
      );
    },
  );
});
