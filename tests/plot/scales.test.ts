import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decadeRangeOf, drawBoxOf, drawWindowOf, pixelOf, scaleOf, scalesOf, valueOf } from '../../src/plot/scales.ts';
import { assertInDelta } from '../asserts.ts';

// A 600 × 600 px plot, 10 A – 100 kA (4 decades, 150 px each) by 0.01–1000 s (5 decades, 120 px each).
const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });

describe('scalesOf', () => {
  it('has the expected defaults', () => {
    expect(scales.x).toEqual({ domain: [10, 1e5], range: [100, 700] });
    expect(scales.y).toEqual({ domain: [0.01, 1000], range: [650, 50] });
  });

  it('scalesOf puts a known (current, time) point at the computed pixel on both axes', () => {
    // (computed) x = 100 + 150 · log10(I / 10); y = 650 − 120 · log10(t / 0.01)
    const cases: [number, number, number, number][] = [
      [10, 0.01, 100, 650],
      [1000, 1, 400, 410],
      [28_421.1, 0.1, 100 + 150 * Math.log10(2842.11), 530],
      [1e5, 1000, 700, 50],
      [480, 30, 100 + 150 * Math.log10(48), 650 - 120 * Math.log10(3000)],
    ];
    for (const [amps, seconds, x, y] of cases) {
      assertInDelta(pixelOf(scales.x, amps), x, 1e-12);
      assertInDelta(pixelOf(scales.y, seconds), y, 1e-12);
      assertInDelta(scaleOf(scales.x)(amps), x, 1e-12);
      assertInDelta(scaleOf(scales.y)(seconds), y, 1e-12);
    }
  });

  it('valueOf(pixelOf(v)) is v and pixelOf is monotone over six decades (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
        (a, b) => {
          assertInDelta(valueOf(scales.x, pixelOf(scales.x, a)), a, 1e-9);
          // Strictly apart by more than rounding, so the two pixels differ.
          if (a < b * (1 - 1e-9)) expect(pixelOf(scales.x, a)).toBeLessThan(pixelOf(scales.x, b));
          if (a < b * (1 - 1e-9)) expect(pixelOf(scales.y, a)).toBeGreaterThan(pixelOf(scales.y, b));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('drawWindowOf', () => {
  it('drawWindowOf starts curves at the half-cycle line when the axis reaches below it (IEEE 242; the half-cycle limit, common practice)', () => {
    const low = scalesOf({ current: [10, 1e5], time: [0.001, 1000] }, { left: 0, top: 0, right: 400, bottom: 600 });
    expect(drawWindowOf(low).seconds).toEqual([0.01, 1000]);
    expect(drawWindowOf(scales).seconds).toEqual([0.01, 1000]);
    const box = drawBoxOf(low);
    assertInDelta(box.y + box.height, 600 - 600 / 6, 1e-12);
  });
});

describe('decadeRangeOf', () => {
  it('decadeRangeOf snaps to decades with room at each end', () => {
    expect(decadeRangeOf([110, 28_421])).toEqual([10, 100_000]);
    expect(decadeRangeOf([150, 800])).toEqual([100, 10_000]);
    expect(decadeRangeOf([])).toEqual([1, 10_000]);
    expect(decadeRangeOf([Infinity, NaN, -3, 0])).toEqual([1, 10_000]);
  });
});
