import { describe, expect, it } from 'vitest';
import { boxInside, boxesOverlap } from '../../src/plot/geometry.ts';

describe('boxesOverlap', () => {
  it('has the expected defaults', () => {
    const a = { x: 0, y: 0, width: 10, height: 10 };
    expect(boxesOverlap(a, a)).toBe(true);
    expect(boxInside(a, a)).toBe(true);
  });

  it('boxesOverlap treats touching edges as apart', () => {
    expect(boxesOverlap({ x: 0, y: 0, width: 10, height: 10 }, { x: 10, y: 0, width: 5, height: 5 })).toBe(false);
    expect(boxesOverlap({ x: 0, y: 0, width: 10, height: 10 }, { x: 9, y: 9, width: 5, height: 5 })).toBe(true);
    expect(boxInside({ x: 5, y: 5, width: 10, height: 1 }, { x: 0, y: 0, width: 10, height: 10 })).toBe(false);
  });
});
