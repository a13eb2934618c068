import { describe, it, expect } from 'vitest';
import { offsetsOf, windowRangeOf } from '../../../src/app/lib/windowRange.ts';

describe('windowRange', () => {
  it('has the expected defaults: 8 rows of overscan, nothing for an empty list', () => {
    const offsets = offsetsOf(Array(100).fill(10));
    expect(windowRangeOf(offsets, { top: 500, height: 100 })).toEqual({ start: 42, end: 69, before: 420, after: 310 });
    expect(windowRangeOf(offsetsOf([]), { top: 0, height: 100 })).toEqual({ start: 0, end: 0, before: 0, after: 0 });
  });

  it('offsetsOf() sums the heights into each row top and the list height last', () => {
    expect([...offsetsOf([20, 30, 20])]).toEqual([0, 20, 50, 70]);
  });

  it('windowRangeOf() draws the rows the visible part overlaps, and the spacers keep the whole height', () => {
    const heights = [10, 40, 10, 10, 30, 10, 10, 10];
    const offsets = offsetsOf(heights);
    const range = windowRangeOf(offsets, { top: 25, height: 30, overscan: 0 });
    // Pixels 25 to 55 cross rows 1 (10–50) and 2 (50–60).
    expect(range).toEqual({ start: 1, end: 3, before: 10, after: 70 });
    expect(range.before + heights.slice(range.start, range.end).reduce((a, b) => a + b) + range.after).toBe(130);
  });

  it('windowRangeOf() clamps at both ends: a list above or below its scroller draws its edge rows', () => {
    const offsets = offsetsOf(Array(1000).fill(20));
    expect(windowRangeOf(offsets, { top: -300, height: 200, overscan: 2 })).toMatchObject({ start: 0, before: 0 });
    expect(windowRangeOf(offsets, { top: 2000, height: 200, overscan: 2 })).toEqual({
      start: 98,
      end: 113,
      before: 1960,
      after: 17740,
    });
    expect(windowRangeOf(offsets, { top: 50_000, height: 200, overscan: 2 })).toMatchObject({ end: 1000, after: 0 });
  });
});
