/** The rows of a long list drawn for the part of it on screen, and the room left above and below them. */
export interface WindowRange {
  /** Index of the first row drawn. */
  start: number;
  /** Index after the last row drawn. */
  end: number;
  /** Pixels of rows not drawn above `start` (a spacer keeps the scroll height). */
  before: number;
  /** Pixels of rows not drawn from `end` on. */
  after: number;
}

/** Options of {@link windowRangeOf}. */
export interface WindowRangeOptions {
  /** Pixels of the list scrolled above the top of its scroller (may be negative while the list starts lower down). */
  top: number;
  /** Height (px) of the scroller's visible part. */
  height: number;
  /**
   * Rows drawn beyond each edge of the visible part, so a short scroll or an arrow key finds its row drawn.
   * @default 8
   */
  overscan?: number;
}

/**
 * Every row's top as a prefix sum: `offsets[i]` is the top (px) of row `i` and `offsets[n]` the list's height.
 * @example offsetsOf([20, 30, 20]) // Float64Array [0, 20, 50, 70]
 */
export function offsetsOf(heights: ArrayLike<number>): Float64Array {
  const offsets = new Float64Array(heights.length + 1);
  for (let i = 0; i < heights.length; i++) offsets[i + 1] = offsets[i] + heights[i];
  return offsets;
}

/**
 * The rows to draw for a visible part of a list, from the rows' offsets (see {@link offsetsOf}): those
 * the part overlaps, plus `overscan` on each side, found by bisection (a list of any length costs the same).
 *
 * @example windowRangeOf(offsetsOf(Array(1000).fill(20)), { top: 2000, height: 200, overscan: 2 })
 * // { start: 98, end: 113, before: 1960, after: 17740 }
 */
export function windowRangeOf(offsets: Float64Array, options: WindowRangeOptions): WindowRange {
  const { top, height, overscan = 8 } = options;
  const count = offsets.length - 1;
  if (count <= 0) return { start: 0, end: 0, before: 0, after: 0 };
  const first = Math.max(0, rowAt(offsets, top) - overscan);
  const last = Math.min(count, rowAt(offsets, top + Math.max(0, height)) + 1 + overscan);
  return { start: first, end: last, before: offsets[first], after: offsets[count] - offsets[last] };
}

// The row holding pixel `y` (clamped to the first and last rows): the last row whose top is at or above it.
function rowAt(offsets: Float64Array, y: number): number {
  let low = 0;
  let high = offsets.length - 2;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if (offsets[mid] <= y) low = mid;
    else high = mid - 1;
  }
  return low;
}
