import { describe, expect, it } from 'vitest';
import { inkBoundsOf } from '../../src/plot/inkBounds.ts';

// Every figure here is worked by hand from the primitive's own numbers.
describe('inkBoundsOf', () => {
  it('has the expected defaults: a rectangle widened by twice its stroke (1 px unless given)', () => {
    expect(inkBoundsOf({ type: 'rect', role: 'box', x: 0, y: 0, width: 10, height: 5, fill: '#fff' }, () => 0)).toEqual(
      [-2, -2, 12, 7],
    );
    expect(
      inkBoundsOf(
        { type: 'rect', role: 'box', x: 0, y: 0, width: 10, height: 5, fill: '#fff', strokeWidth: 3 },
        () => 0,
      ),
    ).toEqual([-6, -6, 16, 11]);
  });

  it('takes a path through its points, an arc through its control points', () => {
    // A line from (10, 20) to (30, 400): a run of a one-line diagram.
    expect(inkBoundsOf({ type: 'path', role: 'line', d: 'M10,20L30,400', stroke: '#000' }, () => 0)).toEqual([
      8, 18, 32, 402,
    ]);
    // A half circle of radius 10 over (0, 0)–(20, 0): its top at y = −10, reached within the control points' hull.
    const [left, top, right, bottom] = inkBoundsOf(
      { type: 'path', role: 'line', d: 'M0,0A10,10 0 0,1 20,0', stroke: '#000' },
      () => 0,
    );
    // (The arc's split into Béziers puts its ends within a rounding of the given points.)
    for (const [got, want] of [
      [left, -2],
      [right, 22],
      [bottom, 2],
    ])
      expect(got).toBeCloseTo(want, 12);
    expect(top).toBeLessThanOrEqual(-12);
  });

  it('takes text as a circle of its advance plus 1.5 em about its anchor', () => {
    // 11-px text 4 em wide: (4 + 1.5) × 11 = 60.5 px every way from its anchor.
    const text = {
      type: 'text',
      role: 'label',
      x: 100,
      y: 50,
      text: 'MAIN',
      size: 11,
      anchor: 'start',
      fill: '#000',
    } as const;
    expect(inkBoundsOf(text, (t) => (t.text === 'MAIN' ? 4 : 0))).toEqual([39.5, -10.5, 160.5, 110.5]);
  });
});
