import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { boxesOverlap, boxInside } from '../../src/plot/geometry.ts';
import { candidatesAround, placeLabels, pointsAlong, type LabelRequest } from '../../src/plot/layout.ts';

const bounds = { x: 0, y: 0, width: 600, height: 400 };

describe('placeLabels', () => {
  it('has the expected defaults', () => {
    const request: LabelRequest = {
      id: 'A',
      width: 40,
      height: 12,
      anchor: [100, 100],
      candidates: candidatesAround([100, 100], 40, 12, 3),
    };
    const { placed, unplaced } = placeLabels([request], { bounds });
    expect(unplaced).toEqual([]);
    // Above right of the anchor is the first choice.
    expect(placed[0]).toEqual({ id: 'A', box: { x: 103, y: 85, width: 40, height: 12 }, leader: null });
  });

  it('placeLabels moves a label off a curve it would cover', () => {
    const request: LabelRequest = {
      id: 'A',
      width: 40,
      height: 12,
      anchor: [100, 100],
      candidates: candidatesAround([100, 100], 40, 12, 3),
    };
    // A diagonal through the above-right place.
    const line = new Float64Array([100, 100, 160, 40]);
    const { placed } = placeLabels([request], { bounds, lines: [line] });
    expect(placed[0].box).not.toEqual({ x: 103, y: 85, width: 40, height: 12 });
  });

  it('placeLabels keeps a label off the near side of another curve, so it reads as its own', () => {
    // Two equal places; the first lies 3 px from another curve's line.
    const request: LabelRequest = {
      id: 'A',
      width: 40,
      height: 12,
      anchor: [100, 100],
      candidates: [
        { box: { x: 103, y: 85, width: 40, height: 12 }, cost: 0 },
        { box: { x: 103, y: 103, width: 40, height: 12 }, cost: 0.1 },
      ],
    };
    const foreign = new Float64Array([100, 82, 200, 82]);
    const { placed } = placeLabels([request], { bounds, lines: [foreign], lineOwners: ['B'] });
    expect(placed[0].box.y).toBe(103);
    // The same line as the label's own curve does not push it away.
    expect(placeLabels([request], { bounds, lines: [foreign], lineOwners: ['A'] }).placed[0].box.y).toBe(85);
  });

  it('placeLabels gives a crowded label a free spot and a leader back to its anchor', () => {
    const make = (id: string): LabelRequest => ({
      id,
      width: 60,
      height: 14,
      anchor: [300, 200],
      candidates: [{ box: { x: 300, y: 200, width: 60, height: 14 }, cost: 0 }],
    });
    const { placed } = placeLabels([make('A'), make('B')], { bounds });
    expect(placed).toHaveLength(2);
    expect(placed[0].leader).toBeNull();
    expect(placed[1].leader).not.toBeNull();
    expect(boxesOverlap(placed[0].box, placed[1].box)).toBe(false);
  });

  it('placeLabels never overlaps two boxes and keeps every box inside the bounds (property)', () => {
    const request = fc.record({
      x: fc.double({ min: 0, max: 600, noNaN: true }),
      y: fc.double({ min: 0, max: 400, noNaN: true }),
      width: fc.double({ min: 10, max: 150, noNaN: true }),
      height: fc.double({ min: 8, max: 20, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(request, { minLength: 1, maxLength: 25 }), (specs) => {
        const requests = specs.map((s, i) => ({
          id: String(i),
          width: s.width,
          height: s.height,
          anchor: [s.x, s.y] as [number, number],
          candidates: candidatesAround([s.x, s.y], s.width, s.height, 3),
        }));
        const { placed, unplaced } = placeLabels(requests, { bounds, searchStep: 10 });
        expect(placed.length + unplaced.length).toBe(specs.length);
        for (const p of placed) expect(boxInside(p.box, bounds)).toBe(true);
        for (let i = 0; i < placed.length; i++)
          for (let j = i + 1; j < placed.length; j++) expect(boxesOverlap(placed[i].box, placed[j].box)).toBe(false);
      }),
      { numRuns: 60 },
    );
  });
});

describe('pointsAlong', () => {
  it('pointsAlong spreads anchors evenly by length', () => {
    expect(pointsAlong(new Float64Array([0, 0, 100, 0]), 2)).toEqual([
      [25, 0],
      [75, 0],
    ]);
    expect(pointsAlong(new Float64Array([0, 0, 0, 30, 30, 30]), 3)).toEqual([
      [0, 10],
      [0, 30],
      [20, 30],
    ]);
  });
});
