import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Band } from '../../src/engine/band.ts';
import { scaleBand } from '../../src/engine/band.ts';
import { findOverlaps, type OverlapInterval } from '../../src/engine/overlap.ts';
import { assertInDelta } from '../asserts.ts';

/** An I²t ramp `t = k / I²` above `pickup`, as an LV long-time element draws (IEEE 1015 trip-unit practice); one edge. */
function ramp(k: number, pickup: number, spread = 1): Band {
  const time = (amps: number, scale: number) => (amps < pickup ? Infinity : (scale * k) / (amps * amps));
  return {
    minTime: (amps) => time(amps, 1),
    maxTime: (amps) => time(amps, spread),
    breakpoints: new Float64Array([pickup]),
    minAmps: pickup,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/** A definite-time element: nothing below `pickup`, then flat at `delay` (IEEE C37.112 definite-time practice). */
function definite(pickup: number, delay: number, clearing = 0): Band {
  return {
    minTime: (amps) => (amps < pickup ? Infinity : delay),
    maxTime: (amps) => (amps < pickup ? Infinity : delay + clearing),
    breakpoints: new Float64Array([pickup]),
    minAmps: pickup,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/** IEEE C37.112 very inverse (A 19.61, p 2, B 0.491) at `pickup` primary amps and time dial `dial`. */
function veryInverse(pickup: number, dial: number, breaker = 0): Band {
  const time = (amps: number) => {
    const m = amps / pickup;
    return m <= 1 ? Infinity : dial * (19.61 / (m * m - 1) + 0.491);
  };
  return {
    minTime: time,
    maxTime: (amps) => time(amps) + breaker,
    breakpoints: new Float64Array([pickup]),
    minAmps: pickup,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/** IEEE C37.112 extremely inverse (A 28.2, p 2, B 0.1217) at `pickup` primary amps and time dial `dial`. */
function extremelyInverse(pickup: number, dial: number): Band {
  const time = (amps: number) => {
    const m = amps / pickup;
    return m <= 1 ? Infinity : dial * (28.2 / (m * m - 1) + 0.1217);
  };
  return { ...veryInverse(pickup, dial), minTime: time, maxTime: time };
}

function statuses(intervals: OverlapInterval[]): string[] {
  return intervals.map((interval) => interval.status);
}

describe('findOverlaps', () => {
  it('where two I²t ramps keep one time ratio, the worst point is their closest approach in seconds', () => {
    // t_up = 2.9e6 / I², t_down = 1.3e6 / I² above 200 A: the ratio is 2.9 / 1.3 everywhere (to rounding, which
    // alone used to pick among the points), the slack 1.6e6 / I² least at the top, 1.6e6 / 3000² = 0.178 s.
    const intervals = findOverlaps(ramp(2.9e6, 200), ramp(1.3e6, 200), { toAmps: 3000 });
    expect(statuses(intervals)).toEqual(['selective']);
    expect(intervals[0].worst.amps).toBe(3000);
    assertInDelta(intervals[0].worst.marginSeconds, 1.6e6 / 3000 ** 2, 1e-12);
  });

  it('has the expected defaults: no margin, ratio 1, thin below 0.1 s, range from the lowest pickup', () => {
    const intervals = findOverlaps(definite(500, 1), ramp(1e6, 100), { toAmps: 10_000 });
    expect(intervals[0].fromAmps).toBe(100);
    expect(intervals.at(-1)!.toAmps).toBe(10_000);
    // Edges solved by hand: overlap while 1e6/I² > 1 (I < 1000 A); thin while 1 − 1e6/I² < 0.1 (I < 1054.09 A).
    expect(statuses(intervals)).toEqual(['selective', 'overlap', 'thin margin', 'selective']);
    assertInDelta(intervals[1].fromAmps, 500, 1e-6);
    assertInDelta(intervals[2].fromAmps, 1000, 1e-6);
    assertInDelta(intervals[3].fromAmps, Math.sqrt(1e6 / 0.9), 1e-6);
  });

  it('finds the edges of a flat delay over an I²t ramp to 1e-6, solved by hand', () => {
    // Upstream 0.5 s above 500 A; downstream t = 1e6/I² above 100 A; margin 0.1 s.
    // overlap: 1e6/I² + 0.1 > 0.5 → I < √(1e6/0.4) = 1581.139 A; thin: slack < 0.1 → I < √(1e6/0.3) = 1825.742 A.
    const intervals = findOverlaps(definite(500, 0.5), ramp(1e6, 100), { toAmps: 20_000, margin: 0.1 });
    expect(statuses(intervals)).toEqual(['selective', 'overlap', 'thin margin', 'selective']);
    assertInDelta(intervals[1].fromAmps, 500, 1e-6);
    assertInDelta(intervals[1].toAmps, Math.sqrt(1e6 / 0.4), 1e-6);
    assertInDelta(intervals[2].toAmps, Math.sqrt(1e6 / 0.3), 1e-6);
  });

  it('reports the worst point of an overlap where the downstream device never clears', () => {
    // Upstream pickup 150 A below the downstream's 200 A: it operates on current the downstream carries indefinitely.
    const intervals = findOverlaps(definite(150, 2), definite(200, 0.5), { toAmps: 5000 });
    expect(statuses(intervals)).toEqual(['overlap', 'selective']);
    assertInDelta(intervals[0].toAmps, 200, 1e-6);
    expect(intervals[0].worst.downTime).toBe(Infinity);
    expect(intervals[0].worst.marginSeconds).toBe(-Infinity);
    expect(intervals[0].worst.ratio).toBe(0);
  });

  it('calls an upstream pickup below the downstream one an overlap however slow the upstream device is there', () => {
    // Very inverse, 96 A upstream at dial 15 over 100 A downstream at dial 1: at 99 A the upstream takes
    // 15 · (19.61 / (1.03125² − 1) + 0.491) = 4641 s (IEEE C37.112 Table 1), beyond the 1000 s sheet,
    // yet the downstream relay never operates there. The overlap runs to the downstream pickup, and its
    // worst point is where the upstream relay operates soonest.
    // (At 96 A itself the upstream relay never operates: a selective sliver of the tolerance's width.)
    const intervals = findOverlaps(veryInverse(96, 15), veryInverse(100, 1), { toAmps: 5000 });
    expect(statuses(intervals)).toEqual(['selective', 'overlap', 'selective']);
    const [, overlap, above] = intervals;
    assertInDelta(overlap.fromAmps, 96, 1e-5);
    assertInDelta(overlap.toAmps, 100, 1e-6);
    assertInDelta(overlap.worst.amps, 100, 1e-6);
    assertInDelta(overlap.worst.upTime, 15 * (19.61 / ((100 / 96) ** 2 - 1) + 0.491), 1e-5);
    // Where the downstream relay does operate, beyond the horizon both count as never.
    assertInDelta(above.fromAmps, 100, 1e-6);
  });

  it('matches the hand-solved overlap edge of two IEEE very-inverse relays', () => {
    // Downstream VI 400 A TD 1; upstream VI 600 A TD 1.05; required 0.3 s (hand-worked IEEE C37.112 relay times pair, computed).
    // At 4000 A the least dial for 0.30 s is 1.04956, so TD 1.04 overlaps just above 4000 A somewhere and TD 1.05 does not at 4000 A.
    const up = veryInverse(600, 1.04956);
    const down = veryInverse(400, 1);
    const [at4000] = findOverlaps(up, down, { fromAmps: 3999, toAmps: 4001, margin: 0.3, thinMargin: 0 }).map(
      (interval) => interval.worst,
    );
    assertInDelta(at4000.marginSeconds, 0, 1e-3);
  });

  it('calls the region below the half-cycle on both bands not provable from curves', () => {
    const up = definite(1000, 0.008);
    const down = definite(500, 0.005);
    const intervals = findOverlaps(up, down, { toAmps: 10_000 });
    expect(statuses(intervals)).toEqual(['selective', 'not provable from curves']);
    assertInDelta(intervals[1].fromAmps, 1000, 1e-6);
  });

  it('calls a current-limiting region not provable while the upstream device is instantaneous, decided by curves once it is delayed', () => {
    const fuse: Band = { ...ramp(50, 100), currentLimitingFrom: 2000 };
    expect(statuses(findOverlaps(definite(3000, 0.02), fuse, { toAmps: 10_000 }))).toEqual([
      'selective',
      'not provable from curves',
    ]);
    expect(statuses(findOverlaps(definite(3000, 0.3), fuse, { toAmps: 10_000 }))).toEqual(['selective']);
  });

  it('calls an upstream current-limiting fuse over a downstream short-time delay an overlap: the delay cuts no current', () => {
    // A fuse melting at 4e6/I² s, current-limiting from 8 kA (0.0625 s there, 0.01 s at 20 kA), over a
    // short-time band of 0.05–0.07 s from 1 kA: the breaker waits on purpose, so the fuse sees the whole
    // current and melts first, and no tested selectivity table reverses that (the fuse's minimum melting
    // time below the breaker's clearing time: an overlap, IEEE 242-2001 chapter 15, from memory).
    const fuse: Band = { ...ramp(4e6, 1500), currentLimitingFrom: 8000 };
    const shortTime = definite(1000, 0.05, 0.02);
    const intervals = findOverlaps(fuse, shortTime, { toAmps: 20_000 });
    expect(statuses(intervals)).toEqual(['selective', 'thin margin', 'overlap']);
    // The overlap starts where 4e6/I² falls to the breaker's 0.07 s, and runs to the top of the range.
    assertInDelta(intervals[2].fromAmps, Math.sqrt(4e6 / 0.07), 1e-6);
    expect(intervals[2].toAmps).toBe(20_000);
    // The same fuse over a downstream instantaneous trip (0.5 cycle to open) is for tested data to decide.
    const instantaneous = definite(1000, 0.008, 0.017);
    expect(statuses(findOverlaps(fuse, instantaneous, { toAmps: 20_000 })).at(-1)).toBe('not provable from curves');
  });

  it('applies a time ratio (the fuse–fuse 75 % rule) instead of a margin', () => {
    // Upstream t = 4e6/I², downstream t = 3.2e6/I²: 0.75 × 4 = 3 < 3.2 so they overlap everywhere both operate.
    const intervals = findOverlaps(ramp(4e6, 200), ramp(3.2e6, 100), {
      toAmps: 10_000,
      timeRatio: 0.75,
      thinMargin: 0,
    });
    // Below 200 A only the downstream fuse operates: selective; above, 3/I² · 1e6 < 3.2/I² · 1e6 everywhere.
    expect(statuses(intervals)).toEqual(['selective', 'overlap']);
    assertInDelta(intervals[1].fromAmps, 200, 1e-6);
    const fine = findOverlaps(ramp(4e6, 200), ramp(2.9e6, 100), {
      fromAmps: 200,
      toAmps: 10_000,
      timeRatio: 0.75,
      thinMargin: 0,
    });
    expect(statuses(fine)).toEqual(['selective']);
  });

  it('returns nothing for an empty range', () => {
    expect(findOverlaps(definite(100, 1), definite(50, 0.1), { fromAmps: 100, toAmps: 100 })).toEqual([]);
  });

  it('gives ordered, adjacent intervals covering the range, with no NaN (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 2000, noNaN: true }),
        fc.double({ min: 0.05, max: 2, noNaN: true }),
        fc.double({ min: 1e4, max: 1e8, noNaN: true }),
        fc.double({ min: 20, max: 1000, noNaN: true }),
        fc.double({ min: 0, max: 0.4, noNaN: true }),
        (pickup, delay, k, downPickup, margin) => {
          const intervals = findOverlaps(definite(pickup, delay), ramp(k, downPickup), { toAmps: 50_000, margin });
          expect(intervals[0].fromAmps).toBe(Math.min(pickup, downPickup));
          expect(intervals.at(-1)!.toAmps).toBe(50_000);
          for (let i = 0; i < intervals.length; i++) {
            expect(intervals[i].toAmps).toBeGreaterThan(intervals[i].fromAmps);
            if (i > 0) expect(intervals[i].fromAmps).toBe(intervals[i - 1].toAmps);
            if (i > 0) expect(intervals[i].status).not.toBe(intervals[i - 1].status);
            const { worst } = intervals[i];
            expect(Number.isNaN(worst.ratio) || Number.isNaN(worst.marginSeconds)).toBe(false);
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it('never creates an overlap when the upstream time dial rises (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 5, noNaN: true }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        (dial, factor) => {
          const down = veryInverse(400, 1, 0.083);
          const overlapping = (d: number) =>
            findOverlaps(veryInverse(600, d), down, { toAmps: 20_000, margin: 0.2 })
              .filter((interval) => interval.status === 'overlap')
              .reduce((sum, interval) => sum + Math.log(interval.toAmps / interval.fromAmps), 0);
          expect(overlapping(dial * factor)).toBeLessThanOrEqual(overlapping(dial) + 1e-9);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('gives the same edges on any voltage base (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 100, noNaN: true }), (factor) => {
        const up = veryInverse(600, 2);
        const down = ramp(2e7, 300, 1.2);
        const base = findOverlaps(up, down, { toAmps: 20_000, margin: 0.2 });
        const moved = findOverlaps(scaleBand(up, factor), scaleBand(down, factor), {
          toAmps: 20_000 * factor,
          margin: 0.2,
        });
        expect(statuses(moved)).toEqual(statuses(base));
        moved.forEach((interval, i) => assertInDelta(interval.toAmps / factor, base[i].toAmps, 1e-5));
      }),
      { numRuns: 100 },
    );
  });
});

describe('findOverlaps at an infinite bus', () => {
  it('checks by decades past the largest breakpoint until both edges are flat or below the half-cycle', () => {
    // The I²t ramp reads 0.04 s at 5 kA (still falling) and 0.0004 s at 50 kA, below the half-cycle: 50 kA is the top.
    const intervals = findOverlaps(definite(500, 0.5), ramp(1e6, 100), { toAmps: Infinity, margin: 0.1 });
    expect(intervals.at(-1)!.toAmps).toBe(50_000);
    expect(intervals.map((interval) => interval.status)).toEqual(['selective', 'overlap', 'thin margin', 'selective']);
    // Two flat elements settle at once: ten times the largest breakpoint.
    expect(findOverlaps(definite(800, 0.4), definite(200, 0.1), { toAmps: Infinity }).at(-1)!.toAmps).toBe(8000);
  });

  it('finds an extremely inverse relay crossing a very inverse one well past ten times their pickup', () => {
    // IEEE C37.112 EI (A 28.2, p 2, B 0.1217) at dial 2.5 over VI (A 19.61, p 2, B 0.491) at dial 1, both 100 A:
    // selective at 10 × pickup (1.016 s over 0.689 s), then the EI runs below the VI where
    // 2.5·(28.2u + 0.1217) = 19.61u + 0.491 with u = 1/(M² − 1): u = 0.18675 / 50.89, M = 16.54, I = 1654 A.
    const intervals = findOverlaps(extremelyInverse(100, 2.5), veryInverse(100, 1), { toAmps: Infinity });
    expect(statuses(intervals)).toEqual(['selective', 'thin margin', 'overlap']);
    assertInDelta(intervals[2].fromAmps, 100 * Math.sqrt(1 + 50.89 / 0.18675), 1e-6);
    // Inverse curves never flatten: the range ends at 10⁴ × the largest breakpoint.
    expect(intervals[2].toAmps).toBe(1e6);
  });
});
