import fc from 'fast-check';
import { RELAY_CURVES } from '../../src/engine/devices/relaySchema.ts';

// Random characteristics of every family, as a study would hold them (before the schema reads them),
// with settings across each family's usual range: for properties that must hold for any device.

/** A digitised curve: ascending currents, strictly falling times, from positive log steps. */
export const pointTable = (startAmps: number) =>
  fc
    .array(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })), {
      minLength: 2,
      maxLength: 25,
    })
    .map((steps) => {
      let logAmps = Math.log(startAmps);
      let logSeconds = Math.log(1000);
      return steps.map(([da, dt]) => {
        logAmps += da;
        logSeconds -= dt;
        return [Math.exp(logAmps), Math.exp(logSeconds)] as [number, number];
      });
    });

/** Total clearing a hair slower than melting (down to one ulp) or plainly slower: the rounding case. */
export const slower = fc.oneof(
  fc.integer({ min: 0, max: 8 }).map((ulps) => 1 + ulps * Number.EPSILON),
  fc.double({ min: 1, max: 3, noNaN: true }),
);

export const fuse = fc.tuple(pointTable(50), slower).map(([mm, factor]) => ({
  kind: 'fuse',
  minimumMelting: mm,
  totalClearing: mm.map(([amps, seconds]) => [amps, seconds * factor]),
}));

export const thermalMagnetic = fc
  .record({
    rating: fc.integer({ min: 15, max: 1200 }),
    pickup: fc.double({ min: 3, max: 15, noNaN: true }),
    tolerance: fc.integer({ min: 0, max: 40 }),
    minimum: pointTable(1.05),
    factor: slower,
  })
  .map((t) => ({
    kind: 'thermal-magnetic',
    rating: t.rating,
    thermal: { minimum: t.minimum, maximum: t.minimum.map(([m, s]) => [m * 1.2, s * t.factor]) },
    magnetic: { pickup: t.pickup, tolerance: t.tolerance },
  }));

/**
 * A relay's time-overcurrent element from one draw: `dial` is the IEEE time dial, a fifteenth of it the
 * IEC time multiplier, a tenth of it a definite-time delay (s); `cap` the multiple where the curve turns flat.
 */
export function timeOvercurrentOf(r: {
  curve: (typeof RELAY_CURVES)[number];
  pickup: number;
  dial: number;
  cap?: number;
}) {
  return r.curve === 'definite-time'
    ? { curve: r.curve, pickup: r.pickup, delay: r.dial / 10 }
    : {
        curve: r.curve,
        pickup: r.pickup,
        [r.curve.startsWith('ieee') ? 'timeDial' : 'timeMultiplier']: r.curve.startsWith('ieee') ? r.dial : r.dial / 15,
        definiteTimeFrom: r.cap,
      };
}

export const relay = fc
  .record({
    curve: fc.constantFrom(...RELAY_CURVES),
    pickup: fc.double({ min: 0.5, max: 12, noNaN: true }),
    dial: fc.double({ min: 0.1, max: 15, noNaN: true }),
    primary: fc.integer({ min: 50, max: 4000 }),
    instantaneous: fc.option(fc.double({ min: 1, max: 200, noNaN: true }), { nil: undefined }),
    cap: fc.option(fc.double({ min: 1.5, max: 40, noNaN: true }), { nil: undefined }),
    tolerance: fc.integer({ min: 0, max: 10 }),
  })
  .map((r) => ({
    kind: 'relay',
    ct: { primary: r.primary, secondary: 5 },
    timeOvercurrent: timeOvercurrentOf(r),
    instantaneous: r.instantaneous === undefined ? undefined : { pickup: r.instantaneous },
    tolerance: { pickup: r.tolerance, time: r.tolerance },
  }));

export const tripUnit = fc
  .record({
    sensor: fc.integer({ min: 100, max: 5000 }),
    pickup: fc.double({ min: 0.4, max: 1, noNaN: true }),
    delay: fc.double({ min: 0.5, max: 30, noNaN: true }),
    shortTime: fc.option(
      fc.record({
        pickup: fc.double({ min: 1.5, max: 12, noNaN: true }),
        delay: fc.double({ min: 0.05, max: 0.5, noNaN: true }),
        i2t: fc.boolean(),
      }),
      { nil: undefined },
    ),
    instantaneous: fc.option(fc.double({ min: 2, max: 15, noNaN: true }), { nil: undefined }),
    longTimeRamp: fc.constantFrom('independent', 'ends-at-short-time-pickup'),
    ground: fc.option(
      fc.record({
        pickup: fc.double({ min: 0.2, max: 1, noNaN: true }),
        delay: fc.double({ min: 0.1, max: 0.5, noNaN: true }),
        i2t: fc.boolean(),
      }),
      { nil: undefined },
    ),
  })
  .map((t) => ({
    kind: 'trip-unit',
    sensor: t.sensor,
    longTime: { pickup: t.pickup, delay: t.delay },
    shortTime: t.shortTime,
    instantaneous: t.instantaneous === undefined ? undefined : { pickup: t.instantaneous },
    longTimeRamp: t.longTimeRamp,
    ground: t.ground,
  }));

/** Each family's arbitrary characteristic, by its `kind`. */
export const characteristicArbitraries = { fuse, 'thermal-magnetic': thermalMagnetic, relay, 'trip-unit': tripUnit };
