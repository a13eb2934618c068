import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clipPolyline, segmentCrossesBox } from '../../src/plot/clip.ts';

const box = { x: 0, y: 0, width: 10, height: 10 };

describe('clipPolyline', () => {
  it('has the expected defaults', () => {
    expect(clipPolyline(new Float64Array([2, 2, 8, 8]), box)).toEqual([new Float64Array([2, 2, 8, 8])]);
  });

  it('clipPolyline enters and leaves exactly on the box edges', () => {
    expect(clipPolyline(new Float64Array([-10, 5, 20, 5]), box)).toEqual([new Float64Array([0, 5, 10, 5])]);
    const [piece] = clipPolyline(new Float64Array([5, -5, 5, 5, 15, 5]), box);
    expect([...piece]).toEqual([5, 0, 5, 5, 10, 5]);
  });

  it('clipPolyline splits a line that leaves and comes back', () => {
    const pieces = clipPolyline(new Float64Array([2, 5, 2, 20, 8, 20, 8, 5]), box);
    expect(pieces.map((p) => [...p])).toEqual([
      [2, 5, 2, 10],
      [8, 10, 8, 5],
    ]);
  });

  it('clipPolyline drops what lies outside and points that are not finite', () => {
    expect(clipPolyline(new Float64Array([20, 20, 30, 30]), box)).toEqual([]);
    expect(clipPolyline(new Float64Array([1, 1, Infinity, 1, 3, 3, 4, 4]), box).map((p) => [...p])).toEqual([
      [3, 3, 4, 4],
    ]);
  });
});

describe('segmentCrossesBox', () => {
  it('segmentCrossesBox sees a diagonal through the box and misses one beside it', () => {
    expect(segmentCrossesBox(-5, -5, 15, 15, box)).toBe(true);
    expect(segmentCrossesBox(-5, 8, 8, 25, { x: 5, y: 0, width: 5, height: 5 })).toBe(false);
  });
});

describe('segmentCrossesBox against clipPolyline', () => {
  it('says a segment touches a box exactly when clipping it keeps a piece, or it is a point within reach', () => {
    const box = { x: 0, y: 0, width: 10, height: 6 };
    // Small whole numbers land on the box's edges and corners often; the others probe the rest.
    const coordinate = fc.oneof(
      fc.integer({ min: -3, max: 13 }),
      fc.double({ min: -20, max: 20, noNaN: true }),
      fc.constantFrom(Infinity, -Infinity, NaN),
    );
    fc.assert(
      fc.property(coordinate, coordinate, coordinate, coordinate, (x0, y0, x1, y1) => {
        const within =
          !(Math.max(x0, x1) < box.x || Math.min(x0, x1) > box.x + box.width) &&
          !(Math.max(y0, y1) < box.y || Math.min(y0, y1) > box.y + box.height);
        const kept = clipPolyline([x0, y0, x1, y1], box).length > 0 || (x0 === x1 && y0 === y1);
        expect(segmentCrossesBox(x0, y0, x1, y1, box)).toBe(within && kept);
      }),
      { numRuns: 5000 },
    );
  });
});
