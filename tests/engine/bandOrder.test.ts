import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bandOf, type Band } from '../../src/engine/band.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';
import { RELAY_CURVES } from '../../src/engine/devices/relaySchema.ts';

/** How far apart two times may be and still count as ordered: a relative 1e-12 (rounding where formulas meet). */
const RELATIVE = 1e-12;

/** Every ordering problem of a band at the given currents and around its breakpoints, as text (empty when none). */
function orderProblems(band: Band, currents: readonly number[]): string[] {
  const around = [...band.breakpoints].flatMap((b) => [b * (1 - 1e-9), b, b * (1 + 1e-9)]);
  const probe = [...currents, ...around].filter((a) => a >= 0).sort((a, b) => a - b);
  const problems: string[] = [];
  let previous = { min: Infinity, max: Infinity };
  for (const amps of probe) {
    const min = band.minTime(amps);
    const max = band.maxTime(amps);
    if (Number.isNaN(min) || Number.isNaN(max)) problems.push(`NaN at ${amps} A`);
    if (min > max * (1 + RELATIVE)) problems.push(`minTime ${min} > maxTime ${max} at ${amps} A`);
    if (min > previous.min * (1 + RELATIVE)) problems.push(`minTime rises to ${min} at ${amps} A`);
    if (max > previous.max * (1 + RELATIVE)) problems.push(`maxTime rises to ${max} at ${amps} A`);
    previous = { min, max };
  }
  return problems;
}

/** Log-spaced currents from 1 A to 1 MA plus arbitrary ones. */
const currents = fc.array(fc.double({ min: 1e-3, max: 1e7, noNaN: true }), { maxLength: 60 });

/** A digitised curve: ascending currents, strictly falling times, from positive log steps. */
const pointTable = (startAmps: number) =>
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
const slower = fc.oneof(
  fc.integer({ min: 0, max: 8 }).map((ulps) => 1 + ulps * Number.EPSILON),
  fc.double({ min: 1, max: 3, noNaN: true }),
);

const fuse = fc.tuple(pointTable(50), slower).map(([mm, factor]) => ({
  kind: 'fuse',
  minimumMelting: mm,
  totalClearing: mm.map(([amps, seconds]) => [amps, seconds * factor]),
}));

const thermalMagnetic = fc
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

const relay = fc
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
    timeOvercurrent:
      r.curve === 'definite-time'
        ? { curve: r.curve, pickup: r.pickup, delay: r.dial / 10 }
        : {
            curve: r.curve,
            pickup: r.pickup,
            [r.curve.startsWith('ieee') ? 'timeDial' : 'timeMultiplier']: r.curve.startsWith('ieee')
              ? r.dial
              : r.dial / 15,
            definiteTimeFrom: r.cap,
          },
    instantaneous: r.instantaneous === undefined ? undefined : { pickup: r.instantaneous },
    tolerance: { pickup: r.tolerance, time: r.tolerance },
  }));

const tripUnit = fc
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
  })
  .map((t) => ({
    kind: 'trip-unit',
    sensor: t.sensor,
    longTime: { pickup: t.pickup, delay: t.delay },
    shortTime: t.shortTime,
    instantaneous: t.instantaneous === undefined ? undefined : { pickup: t.instantaneous },
    longTimeRamp: t.longTimeRamp,
  }));

describe('every family keeps its band ordered', () => {
  const families = { fuse, 'thermal-magnetic': thermalMagnetic, relay, 'trip-unit': tripUnit };
  for (const [family, characteristic] of Object.entries(families)) {
    it(`${family}: minTime ≤ maxTime and both edges non-increasing, within a relative 1e-12`, () => {
      fc.assert(
        fc.property(characteristic, currents, (input, amps) => {
          const band = bandOf(characteristicSchema.parse(input));
          expect(orderProblems(band, amps)).toEqual([]);
        }),
        { numRuns: 300 },
      );
    });
  }

  it('a fuse whose total clearing is one ulp slower than melting never clears before it melts', () => {
    // Between points the two log-log interpolations used to cross by rounding (25.8966026521816 s against
    // 25.89660265218164 s at 383.425 A).
    const mm: Array<[number, number]> = [
      [103.55088365184075, 494.3615540691857],
      [202.4588525902761, 316.5753179089813],
      [252.55216181689082, 123.91990070097906],
      [272.1657489136657, 54.14307342550412],
      [398.73897170263496, 23.803630792282593],
    ];
    const tc = mm.map(([amps, seconds]) => [amps, seconds * (1 + Number.EPSILON)]);
    const band = bandOf(characteristicSchema.parse({ kind: 'fuse', minimumMelting: mm, totalClearing: tc }));
    expect(band.minTime(383.42502423924634)).toBeLessThanOrEqual(band.maxTime(383.42502423924634));
    expect(orderProblems(band, [383.42502423924634])).toEqual([]);
  });
});
