import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertInDelta } from '../../asserts.ts';
import { assertBandContract } from './bandInvariants.ts';
import { fuseBand } from '../../../src/engine/devices/fuse.ts';
import { fuseSchema } from '../../../src/engine/devices/fuseSchema.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';

/** An invented fuse (illustrative, not a product). */
const fuse = {
  kind: 'fuse',
  label: 'invented 100 A',
  minimumMelting: [
    [200, 100],
    [400, 10],
    [1000, 1],
    [4000, 0.01],
  ],
  totalClearing: [
    [200, 120],
    [400, 12],
    [1000, 1.3],
    [4000, 0.02],
  ],
} as const;

function rejection(input: unknown): string {
  try {
    readCharacteristic(input, { path: 'study.devices[2].characteristic' });
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('fuse', () => {
  it('has the expected defaults', () => {
    const parsed = fuseSchema.parse(fuse);
    expect(parsed.illustrative).toBe(false);
    expect(parsed.currentLimitingFrom).toBeUndefined();
    const band = fuseBand(parsed);
    expect(band.currentLimitingFrom).toBe(Infinity);
    expect(band.diagnostics).toEqual([]);
  });

  it('fuseBand interpolates linearly in log-log space between points (common practice for digitised curves)', () => {
    const band = fuseBand(fuseSchema.parse(fuse));
    // Half way between 200 A and 400 A in log current is √(200·400) = 282.84 A; half way in log time is √(100·10).
    assertInDelta(band.minTime(Math.sqrt(200 * 400)), Math.sqrt(1000), 1e-12);
    assertInDelta(band.maxTime(Math.sqrt(200 * 400)), Math.sqrt(120 * 12), 1e-12);
    // A quarter of the way from 1000 A to 4000 A: log t = log 1 + 0.25 · (log 0.01 − log 1) (computed).
    assertInDelta(band.minTime(1000 * 4 ** 0.25), 0.01 ** 0.25, 1e-12);
    assertInDelta(band.minTime(400), 10, 1e-12); // on a tabulated point
  });

  it('fuseBand is Infinity below minimum melting and holds the last time beyond the last point', () => {
    const band = fuseBand(fuseSchema.parse(fuse));
    expect(band.minTime(199.9)).toBe(Infinity);
    expect(band.maxTime(199.9)).toBe(Infinity);
    expect(band.minTime(0)).toBe(Infinity);
    expect(band.minAmps).toBe(200);
    expect(band.maxAmps).toBe(4000);
    expect(band.minTime(40000)).toBe(0.01);
    expect(band.maxTime(1e12)).toBe(0.02);
    expect([...band.breakpoints]).toEqual([200, 400, 1000, 4000]);
  });

  it('fuseBand does not extend a melting curve that ends above the half-cycle: past it the fuse is not known to wait', () => {
    // Melting digitised only down to 0.1 s at 4000 A: beyond, the fuse may melt in any time up to that,
    // so the fast edge is taken at the half-cycle (0.01 s, below which curves prove nothing); the clearing
    // edge holds its last time, which the fuse does not exceed.
    const short = {
      ...fuse,
      minimumMelting: [...fuse.minimumMelting.slice(0, 3), [4000, 0.1]],
      totalClearing: [...fuse.totalClearing.slice(0, 3), [4000, 0.13]],
    };
    const band = fuseBand(fuseSchema.parse(short));
    expect(band.minTime(4000)).toBe(0.1);
    expect(band.minTime(4001)).toBe(0.01);
    expect(band.maxTime(4001)).toBe(0.13);
    const times = new Float64Array(3);
    band.evaluateInto!(new Float64Array([3999, 4000, 4001]), times, undefined);
    expect(times[1]).toBe(0.1);
    expect(times[2]).toBe(0.01);
  });

  it('fuseBand evaluates any number of currents in any order as its edges do, one call after another', () => {
    const band = fuseBand(fuseSchema.parse(fuse));
    // Short, long (past any scratch a shorter call left), then short again, each shuffled and with odd currents.
    for (const length of [3, 5000, 2, 1200]) {
      const amps = Float64Array.from({ length }, (_, i) => 150 * 40 ** (((i * 7919) % length) / length));
      amps[0] = length === 2 ? NaN : 100;
      const minTimes = new Float64Array(length);
      const maxTimes = new Float64Array(length);
      band.evaluateInto!(amps, minTimes, maxTimes);
      amps.forEach((current, i) => {
        expect(Object.is(minTimes[i], band.minTime(current)), `${current} A`).toBe(true);
        expect(Object.is(maxTimes[i], band.maxTime(current)), `${current} A`).toBe(true);
      });
    }
  });

  it('fuseBand carries currentLimitingFrom and notes an illustrative curve', () => {
    const band = fuseBand(fuseSchema.parse({ ...fuse, illustrative: true, currentLimitingFrom: '2 kA' }));
    expect(band.currentLimitingFrom).toBe(2000);
    expect(band.diagnostics[0]).toMatch(/illustrative curve, not a product/);
  });

  it('fuseSchema rejects tables that are short, out of order or crossing', () => {
    expect(rejection({ ...fuse, minimumMelting: [[200, 100]] })).toMatch(
      /^study\.devices\[2\]\.characteristic\.minimumMelting: expected at least 2 points, got 1$/,
    );
    expect(
      rejection({
        ...fuse,
        minimumMelting: [
          [200, 100],
          [150, 10],
        ],
      }),
    ).toMatch(
      /characteristic\.minimumMelting\[1\]\[0\]: expected a current above the previous point's 200 A, got "150"$/,
    );
    expect(
      rejection({
        ...fuse,
        totalClearing: [
          [200, 120],
          [400, 120],
        ],
      }),
    ).toMatch(/characteristic\.totalClearing\[1\]\[1\]: expected a time below the previous point's 120 s, got "120"$/);
    expect(
      rejection({
        ...fuse,
        minimumMelting: [
          [0, 100],
          [400, 10],
        ],
      }),
    ).toMatch(/minimumMelting\[0\]\[0\]: expected a current in amperes greater than 0, got "0"$/);
    expect(
      rejection({
        ...fuse,
        minimumMelting: [
          [200, 'abc'],
          [400, 10],
        ],
      }),
    ).toMatch(/minimumMelting\[0\]\[1\]: expected a number, got "abc"$/);
    expect(
      rejection({
        ...fuse,
        totalClearing: [
          [200, 120],
          [400, 9],
          [4000, 0.02],
        ],
      }),
    ).toMatch(
      /characteristic\.totalClearing: expected total clearing no earlier than minimum melting, got 9 s at 400 A \(minimum melting 10 s\)$/,
    );
    expect(
      rejection({
        ...fuse,
        totalClearing: [
          [150, 300],
          [4000, 0.02],
        ],
      }),
    ).toMatch(
      /characteristic\.totalClearing: expected total clearing to start at or above the first minimum-melting current, got 150 A$/,
    );
    expect(rejection({ ...fuse, melting: [] })).toMatch(/characteristic: expected no field "melting" here, got one$/);
    expect(rejection({ ...fuse, availableRatings: [100, 125, 125] })).toMatch(
      /characteristic\.availableRatings\[2\]: expected a rating above the previous 125 A, got "125"$/,
    );
  });

  it('fuseSchema says what is wrong with what is no fuse at all, and checks the curves beside another problem', () => {
    for (const input of [null, 'fuse', [], 3]) {
      const parsed = fuseSchema.safeParse(input);
      expect(parsed.success).toBe(false);
      expect(parsed.error!.issues[0].path).toEqual([]);
    }
    // A wrong label and crossing curves: both said, neither hiding the other.
    const parsed = fuseSchema.safeParse({
      ...fuse,
      label: 5,
      totalClearing: [
        [200, 120],
        [400, 9],
        [4000, 0.02],
      ],
    });
    expect(parsed.error!.issues.map((issue) => issue.path.join('.'))).toEqual(['label', 'totalClearing']);
  });

  it('fuseBand keeps the band contract over random valid tables', () => {
    const table = fc
      .array(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })), {
        minLength: 2,
        maxLength: 30,
      })
      .map((steps) => {
        // Build ascending currents and descending times from positive log steps.
        let logAmps = Math.log(50);
        let logSeconds = Math.log(1000);
        return steps.map(([da, dt]) => {
          logAmps += da;
          logSeconds -= dt;
          return [Math.exp(logAmps), Math.exp(logSeconds)] as [number, number];
        });
      });
    fc.assert(
      fc.property(
        table,
        fc.double({ min: 1, max: 3, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 1e6, noNaN: true })),
        (mm, slower, currents) => {
          const tc = mm.map(([amps, seconds]) => [amps, seconds * slower] as [number, number]);
          const band = fuseBand(fuseSchema.parse({ kind: 'fuse', minimumMelting: mm, totalClearing: tc }));
          assertBandContract(band, currents);
          for (const [amps, seconds] of mm) assertInDelta(band.minTime(amps), seconds, 1e-9);
        },
      ),
      { numRuns: 200 },
    );
  });
});
