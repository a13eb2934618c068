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
