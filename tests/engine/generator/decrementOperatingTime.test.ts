import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decrementOperatingTime, generatorDecrement } from '../../../src/engine/generator/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { generatorOf } from './fixtures.ts';

/** IEEE C37.112 very inverse (A 19.61, p 2, B 0.491) at `pickup` amps and time dial `dial`; Infinity at or below pickup. */
function veryInverse(pickup: number, dial: number) {
  return (amps: number) => {
    const m = amps / pickup;
    return m <= 1 ? Infinity : dial * (19.61 / (m * m - 1) + 0.491);
  };
}

describe('decrementOperatingTime', () => {
  it('has the expected defaults', () => {
    // Horizon 1000 s: a device slower than that on a constant current is taken never to operate.
    expect(
      decrementOperatingTime(
        () => 999,
        () => 1,
      ),
    ).toBeGreaterThan(998);
    expect(
      decrementOperatingTime(
        () => 1001,
        () => 1,
      ),
    ).toBe(Infinity);
    expect(
      decrementOperatingTime(
        () => 1001,
        () => 1,
        { horizonSeconds: 2000 },
      ),
    ).toBeGreaterThan(1000);
  });

  describe('constant current: the integral gives the constant-current time (IEEE C37.112 integral operating equation)', () => {
    it('a flat source at 1000 A operates a 2.5 s device in 2.5 s', () => {
      assertInDelta(
        decrementOperatingTime(
          () => 2.5,
          () => 1000,
        ),
        2.5,
        1e-9,
      );
    });

    it('a generator with X″d = X′d = Xd has a flat decrement; the VI relay time equals its constant-current time', () => {
      const flat = generatorDecrement(generatorOf({ xdSubtransient: 0.5, xdTransient: 0.5, xd: 0.5 }));
      const relay = veryInverse(600, 1);
      assertInDelta(flat.ampsAt(0), flat.ampsAt(10), 1e-12);
      assertInDelta(decrementOperatingTime(relay, flat), relay(flat.ampsAt(0)), 1e-8);
    });

    it('a current in two steps: 2000 A for 0.5 s then 1000 A, device 1 s above 1500 A and 4 s below: T = 0.5 + 4 × (1 − 0.5/1) = 2.5 s', () => {
      const step = (t: number) => (t < 0.5 ? 2000 : 1000);
      assertInDelta(
        decrementOperatingTime((i) => (i > 1500 ? 1 : 4), step),
        2.5,
        1e-8,
      );
    });
  });

  describe('decaying current, closed form for an I²t device (computed by hand)', () => {
    // I = I0·e^(−t/τ), t_op = K/I²: ∫ I²/K dt = I0²τ/(2K)·(1 − e^(−2T/τ)) = 1 → T = −(τ/2)·ln(1 − 2K/(I0²τ)).
    it('I0 = 10 A, τ = 1 s, K = 20 A²s: T = −0.5·ln 0.6 = 0.255413 s', () => {
      const t = decrementOperatingTime(
        (i) => 20 / (i * i),
        (s) => 10 * Math.exp(-s),
      );
      assertInDelta(t, -0.5 * Math.log(0.6), 1e-8);
      assertInDelta(t, 0.255413, 1e-5);
    });

    it('I0 = 6 A: I0²τ/2 = 18 < K, the device never operates (Infinity)', () => {
      expect(
        decrementOperatingTime(
          (i) => 20 / (i * i),
          (s) => 6 * Math.exp(-s),
        ),
      ).toBe(Infinity);
    });
  });

  describe('500 kVA 480 V generator, VI relay pickup 600 A, time dial 1 (IEEE C37.112 very inverse)', () => {
    const relay = veryInverse(600, 1);

    it('with 3 × rated support the relay operates later than its time at the subtransient current', () => {
      const decrement = generatorDecrement(generatorOf({ sustained: 3 }));
      const atSubtransient = relay(decrement.initialAmps);
      assertInDelta(atSubtransient, 0.776152, 1e-5);
      const t = decrementOperatingTime(relay, decrement);
      expect(t).toBeGreaterThan(atSubtransient);
      // Never later than its time at the sustained current, which the decrement never falls below.
      expect(t).toBeLessThan(relay(decrement.sustainedAmps));
      assertInDelta(t, 2.76883, 1e-4);
    });

    it('without support the current falls to E/Xd = 300.7 A, below pickup, before the relay operates: Infinity', () => {
      expect(decrementOperatingTime(relay, generatorDecrement(generatorOf()))).toBe(Infinity);
    });

    it('a larger support never makes the relay slower (property)', () => {
      fc.assert(
        fc.property(
          fc.double({ min: 0, max: 6, noNaN: true }),
          fc.double({ min: 0, max: 6, noNaN: true }),
          fc.double({ min: 300, max: 3000, noNaN: true }),
          fc.double({ min: 0.1, max: 10, noNaN: true }),
          (a, b, pickup, dial) => {
            const [low, high] = a <= b ? [a, b] : [b, a];
            const device = veryInverse(pickup, dial);
            const slow = decrementOperatingTime(
              device,
              generatorDecrement(generatorOf({ sustained: low || undefined })),
            );
            const fast = decrementOperatingTime(
              device,
              generatorDecrement(generatorOf({ sustained: high || undefined })),
            );
            return fast <= slow * (1 + 1e-7);
          },
        ),
        { numRuns: 60, seed: 551 },
      );
    });
  });

  it('keeps the order of two devices that is kept at every constant current (property: why the code-selectivity check reads the constant-current pairs alone)', () => {
    // Upstream: at least as slow as downstream at every current (a factor ≥ 1 that varies with current),
    // its pickup no lower; any generator decrement then opens it no earlier than downstream clears.
    fc.assert(
      fc.property(
        fc.double({ min: 300, max: 3000, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: 1, max: 1.5, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 6, noNaN: true }),
        (pickup, dial, pickupRatio, sway, sustained) => {
          const down = veryInverse(pickup, dial);
          const up = (amps: number) => down(amps / pickupRatio) * (1 + sway * (1 + Math.sin(Math.log(amps))));
          const decrement = generatorDecrement(generatorOf({ sustained: sustained || undefined }));
          const clears = decrementOperatingTime(down, decrement);
          const opens = decrementOperatingTime(up, decrement);
          return opens >= clears * (1 - 1e-7);
        },
      ),
      { numRuns: 60, seed: 70032 },
    );
  });

  it('an instantaneous (zero-time) device operates at once', () => {
    expect(
      decrementOperatingTime(
        () => 0,
        () => 1000,
      ),
    ).toBe(0);
  });

  it('bad input names the argument', () => {
    // @ts-expect-error: not a current against time
    expect(() => decrementOperatingTime(() => 1, 42)).toThrow(
      /^decrement: expected a function of time or a decrement with ampsAt, got "42"$/,
    );
    expect(() =>
      decrementOperatingTime(
        () => 1,
        () => 1,
        { horizonSeconds: 0 },
      ),
    ).toThrow(/^options\.horizonSeconds: /);
    expect(() =>
      decrementOperatingTime(
        () => Number.NaN,
        () => 1,
      ),
    ).toThrow(/^timeAtCurrent: expected a time or Infinity/);
  });
});
