import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertInDelta } from '../../asserts.ts';
import { assertBandContract } from './bandInvariants.ts';
import { relayBand } from '../../../src/engine/devices/relay.ts';
import { createRelaySchema, relaySchema, RELAY_CURVES } from '../../../src/engine/devices/relaySchema.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { timeOvercurrentOf } from '../characteristicArbitraries.ts';

const veryInverse = {
  kind: 'relay',
  ct: '600:5',
  timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 },
} as const;

function bandOfInput(input: unknown) {
  return relayBand(relaySchema.parse(input));
}

function rejection(input: unknown): string {
  try {
    readCharacteristic(input, { path: 'study.devices[0].characteristic' });
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('relay', () => {
  it('has the expected defaults', () => {
    const relay = relaySchema.parse(veryInverse);
    expect(relay.ct).toEqual({ primary: 600, secondary: 5 });
    assertInDelta(relay.operatingTime, 1 / 60); // "1 cycle" at 60 Hz (common practice 0.016–0.025 s)
    assertInDelta(relay.breakerTime, 5 / 60); // "5 cycles"
    expect(relay.tolerance).toEqual({ pickup: 0, time: 0 });
    expect(relay.instantaneous).toBeUndefined();
    expect(RELAY_CURVES).toContain('definite-time');
  });

  it('createRelaySchema(50) reads cycles at 50 Hz', () => {
    const relay = createRelaySchema(50).parse(veryInverse);
    assertInDelta(relay.breakerTime, 0.1);
    assertInDelta(relay.operatingTime, 0.02);
  });

  it('relayBand is the CT 600:5, tap 5 A, IEEE VI TD 2 relay of hand-worked IEEE C37.112 relay times at 6000 A (computed)', () => {
    const band = bandOfInput(veryInverse);
    assertInDelta(band.minTime(6000), 1.37816, 1e-5); // 2 · (19.61/99 + 0.491), M = 10
    assertInDelta(band.maxTime(6000), 1.37816 + 5 / 60, 1e-5); // plus the 5-cycle breaker
    expect(band.minAmps).toBe(600); // pickup 5 A × 120 (IEEE 242 CT and tap practice)
    expect(band.minTime(600)).toBe(Infinity); // exactly at pickup the inverse curve never times out
    expect(band.minTime(599)).toBe(Infinity);
    expect([...band.breakpoints]).toEqual([600]);
    expect(band.currentLimitingFrom).toBe(Infinity);
  });

  it('relayBand reproduces the hand-worked IEEE C37.112 relay times pair at 4000 A: downstream 400 A TD 1 vs upstream 600 A TD 2 (computed)', () => {
    const down = bandOfInput({
      ...veryInverse,
      ct: '400:5',
      timeOvercurrent: { ...veryInverse.timeOvercurrent, timeDial: 1 },
    });
    const up = bandOfInput(veryInverse);
    assertInDelta(down.minTime(4000), 0.68908, 1e-5);
    assertInDelta(up.minTime(4000), 1.88476, 1e-5);
    assertInDelta(up.minTime(4000) - down.minTime(4000), 1.19568, 1e-4);
  });

  it('relayBand trips on the faster of time-overcurrent and instantaneous, never faster than the operating time', () => {
    const band = bandOfInput({ ...veryInverse, instantaneous: { pickup: 50 } }); // 6000 A primary
    assertInDelta(band.minTime(5999), bandOfInput(veryInverse).minTime(5999));
    assertInDelta(band.minTime(6000), 1 / 60); // instantaneous with no delay: the relay operating time
    assertInDelta(band.maxTime(6000), 1 / 60 + 5 / 60);
    expect([...band.breakpoints]).toEqual([600, 6000]);
    const delayed = bandOfInput({ ...veryInverse, instantaneous: { pickup: 50, delay: '6 cycles' } });
    assertInDelta(delayed.minTime(10000), 0.1);
  });

  it('relayBand applies pickup and time tolerance: low edges for minTime, high edges plus breaker for maxTime', () => {
    const band = bandOfInput({ ...veryInverse, tolerance: { pickup: 5, time: '10 %' } });
    expect(band.minAmps).toBeCloseTo(570, 9); // 600 × 0.95
    expect(band.maxTime(620)).toBe(Infinity); // high pickup edge 630 A
    assertInDelta(band.minTime(6000), 0.9 * 2 * (19.61 / ((6000 / 570) ** 2 - 1) + 0.491));
    assertInDelta(band.maxTime(6000), 1.1 * 2 * (19.61 / ((6000 / 630) ** 2 - 1) + 0.491) + 5 / 60);
    expect([...band.breakpoints].map((b) => Math.round(b))).toEqual([570, 630]);
  });

  it('relayBand holds an IEC curve flat above definiteTimeFrom (IEC 60255-151 G_D, common practice 20×)', () => {
    const band = bandOfInput({
      kind: 'relay',
      ct: '300:1',
      timeOvercurrent: { curve: 'iec-standard-inverse', pickup: 1, timeMultiplier: 0.1, definiteTimeFrom: 20 },
    });
    assertInDelta(band.minTime(3000), 0.29706, 2e-5); // M 10, hand-worked IEEE C37.112 relay times
    assertInDelta(band.minTime(6000), 0.226736, 1e-5); // M 20: 0.1 × 2.26736 (IEC 60255-151 table)
    expect(band.minTime(60000)).toBe(band.minTime(6000));
    expect([...band.breakpoints]).toEqual([300, 6000]);
  });

  it('relayBand places a breakpoint where an uncapped curve falls to the operating time', () => {
    const band = bandOfInput({
      kind: 'relay',
      ct: '100:5',
      timeOvercurrent: { curve: 'iec-extremely-inverse', pickup: 5, timeMultiplier: 0.05 },
    });
    // 0.05 · 80 / (M² − 1) = 1/60  →  M = √241 (computed)
    const knee = Math.sqrt(241) * 100;
    expect(band.breakpoints.length).toBe(2);
    assertInDelta(band.breakpoints[1], knee, 1e-9);
    assertInDelta(band.minTime(knee * 2), 1 / 60);
    // IEC 60255-151 ends the dependent-time range at G_D: without it given, the note says so.
    expect(band.diagnostics.join('\n')).toMatch(/no definite-time threshold G_D \(definiteTimeFrom\)/);
  });

  it('relayBand of a definite-time element is vertical at pickup then flat', () => {
    const band = bandOfInput({
      kind: 'relay',
      ct: '600:5',
      timeOvercurrent: { curve: 'definite-time', pickup: 6, delay: 0.5 },
    });
    expect(band.minTime(719.9)).toBe(Infinity);
    assertInDelta(band.minTime(720), 0.5);
    assertInDelta(band.maxTime(1e6), 0.5 + 5 / 60);
  });

  it('relayBand notes a time dial outside the usual range', () => {
    const band = bandOfInput({ ...veryInverse, timeOvercurrent: { ...veryInverse.timeOvercurrent, timeDial: 20 } });
    expect(band.diagnostics.join('\n')).toMatch(/time dial 20 is outside the usual 0\.5–15/);
  });

  it('relaySchema rejects bad settings with the field path', () => {
    expect(rejection({ ...veryInverse, ct: '600/5' })).toMatch(
      /^study\.devices\[0\]\.characteristic\.ct: expected a CT ratio such as "600:5", each side a current between 0\.001 A and 10000000 A, got "600\/5"$/,
    );
    // Each side is a current, held to the physical range of every current in a study: a primary of
    // four hundred digits reads as Infinity, and 1e-10 A is no CT.
    expect(rejection({ ...veryInverse, ct: `1${'0'.repeat(400)}:5` })).toMatch(
      /characteristic\.ct: expected a CT ratio/,
    );
    expect(rejection({ ...veryInverse, ct: '0.0000000001:5' })).toMatch(/characteristic\.ct: expected a CT ratio/);
    expect(rejection({ ...veryInverse, ct: '600:0.000001' })).toMatch(/characteristic\.ct: expected a CT ratio/);
    expect(rejection({ ...veryInverse, timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5 } })).toMatch(
      /^study\.devices\[0\]\.characteristic\.timeOvercurrent\.timeDial: expected a time dial for curve "ieee-very-inverse", got nothing$/,
    );
    expect(
      rejection({ ...veryInverse, timeOvercurrent: { ...veryInverse.timeOvercurrent, timeMultiplier: 0.1 } }),
    ).toMatch(
      /timeOvercurrent\.timeMultiplier: expected no timeMultiplier with curve "ieee-very-inverse" \(it takes timeDial\), got "0\.1"$/,
    );
    expect(rejection({ kind: 'relay', ct: '600:5' })).toMatch(
      /characteristic\.timeOvercurrent: expected a timeOvercurrent or an instantaneous element, got neither$/,
    );
    expect(rejection({ ...veryInverse, timeOvercurrent: { ...veryInverse.timeOvercurrent, pickup: -5 } })).toMatch(
      /timeOvercurrent\.pickup: expected a current greater than 0, got "-5"$/,
    );
    expect(rejection({ ...veryInverse, timeOvercurrent: { ...veryInverse.timeOvercurrent, curve: 'steep' } })).toMatch(
      /timeOvercurrent\.curve: expected one of "ieee-moderately-inverse", .*"definite-time", got "steep"$/,
    );
    expect(rejection({ ...veryInverse, breakerTime: 'soon' })).toMatch(
      /characteristic\.breakerTime: expected a time such as "0\.3 s", got "soon"$/,
    );
    expect(rejection({ ...veryInverse, tolerance: { pickup: 80 } })).toMatch(
      /tolerance\.pickup: expected a percentage of at most 50, got "80"$/,
    );
  });

  const relayInput = fc.record({
    curve: fc.constantFrom(...RELAY_CURVES),
    pickup: fc.double({ min: 0.5, max: 12, noNaN: true }),
    dial: fc.double({ min: 0.05, max: 15, noNaN: true }),
    primary: fc.integer({ min: 50, max: 4000 }),
    secondary: fc.constantFrom(1, 5),
    instantaneous: fc.option(fc.double({ min: 1, max: 200, noNaN: true }), { nil: undefined }),
    // A time is 0 or within its physical range (from 1 µs), as every study field reads it.
    instantaneousDelay: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 0.5, noNaN: true })),
    cap: fc.option(fc.double({ min: 1.5, max: 40, noNaN: true }), { nil: undefined }),
    pickupTolerance: fc.double({ min: 0, max: 10, noNaN: true }),
    timeTolerance: fc.double({ min: 0, max: 10, noNaN: true }),
  });

  type RelayDraw = typeof relayInput extends fc.Arbitrary<infer T> ? T : never;

  function relayOf(r: RelayDraw, scale = 1) {
    return relaySchema.parse({
      kind: 'relay',
      ct: { primary: r.primary * scale, secondary: r.secondary },
      timeOvercurrent: timeOvercurrentOf(r),
      instantaneous:
        r.instantaneous === undefined ? undefined : { pickup: r.instantaneous, delay: r.instantaneousDelay },
      tolerance: { pickup: r.pickupTolerance, time: r.timeTolerance },
    });
  }

  it('relayBand keeps the band contract over random settings (no NaN, min ≤ max, non-increasing, none below pickup)', () => {
    fc.assert(
      fc.property(
        relayInput,
        fc.array(fc.double({ min: 0, max: 1e7, noNaN: true }), { maxLength: 40 }),
        (r, currents) => {
          const relay = relayOf(r);
          const band = relayBand(relay);
          assertBandContract(band, currents);
          const lowPickup = ((r.pickup * r.primary) / r.secondary) * (1 - r.pickupTolerance / 100);
          const instantaneousBelow = r.instantaneous !== undefined && r.instantaneous < r.pickup;
          if (!instantaneousBelow) expect(band.minTime(lowPickup * (1 - 1e-9))).toBe(Infinity);
          expect(band.minAmps).toBeLessThanOrEqual(lowPickup * (1 + 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('relayBand scales in current with the CT ratio', () => {
    fc.assert(
      fc.property(
        relayInput,
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        (r, k, amps) => {
          const base = relayBand(relayOf(r));
          const scaled = relayBand(relayOf(r, k));
          assertInDelta(scaled.minTime(amps * k), base.minTime(amps), 1e-9);
          assertInDelta(scaled.maxTime(amps * k), base.maxTime(amps), 1e-9);
          assertInDelta(scaled.minAmps, base.minAmps * k, 1e-12);
        },
      ),
      { numRuns: 200 },
    );
  });
});
