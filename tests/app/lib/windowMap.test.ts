import { describe, expect, it } from 'vitest';
import {
  EDGE_LABEL_SIZE,
  MAP_PADDING,
  edgeLabelPlacement,
  keepsEveryConstraint,
  windowMapGeometry,
  type EdgeLabelPlacement,
  type PlotBox,
} from '../../../src/app/lib/windowMap.ts';
import type { FeasibleMap } from '../../../src/engine/window/index.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const binding = (id: string) => ({ id, kind: 'coordinate-below' as const, label: id, source: 'common practice' });
const map: FeasibleMap = {
  label: 'pickup × time dial',
  x: { key: 'timeOvercurrent.pickup', label: 'pickup', unit: 'A', min: 1, max: 10, current: 5 },
  y: {
    key: 'timeOvercurrent.timeDial',
    label: 'time dial',
    unit: '',
    min: 0.5,
    max: 15,
    values: [0.5, 1, 2, 5, 10, 15],
    current: 2,
  },
  columns: [
    { x: 1, intervals: [], blocked: [binding('load')] },
    { x: 2, intervals: [{ from: 2, to: 10, lower: binding('below:A'), upper: binding('withstand:T1') }], blocked: [] },
    { x: 5, intervals: [{ from: 1, to: 10, lower: binding('below:A'), upper: binding('withstand:T1') }], blocked: [] },
    { x: 10, intervals: [{ from: 1, to: 5, lower: binding('below:B'), upper: binding('withstand:T1') }], blocked: [] },
  ],
  current: { x: 5, y: 2, inside: true },
};

describe('windowMapGeometry', () => {
  it('has the expected defaults: one cell per open interval, edges split into runs by binding constraint', () => {
    const g = windowMapGeometry(map, 400, 200);
    expect(g.cells.length).toBe(3);
    expect(g.edges.filter((e) => e.side === 'lower').map((e) => e.label)).toEqual(['below:A', 'below:B']);
    expect(g.edges.filter((e) => e.side === 'upper').map((e) => e.label)).toEqual(['withstand:T1']);
    expect(g.yTicks.map((t) => t.value)).toEqual([0.5, 1, 2, 5, 10, 15]);
  });

  it('maps the range ends to the plot box and a click back to the nearest step', () => {
    const g = windowMapGeometry(map, 400, 200);
    expect(g.toPixels(1, 0.5)).toEqual([MAP_PADDING.left, 200 - MAP_PADDING.bottom]);
    expect(g.toPixels(10, 15)).toEqual([400 - MAP_PADDING.right, MAP_PADDING.top]);
    const [px, py] = g.toPixels(3.3, 4.4);
    expect(g.fromPixels(px, py)).toEqual({ x: 3.3, y: 5 });
  });
});

// The plot box of the Window panel's 440 × 250 map.
const box: PlotBox = { left: 44, right: 430, top: 10, bottom: 220 };

/** The horizontal extent of a placed label's text. */
function extentOf({ at: [x], anchor, shown }: EdgeLabelPlacement): [number, number] {
  const w = textWidth(shown, EDGE_LABEL_SIZE);
  const start = anchor === 'start' ? x : anchor === 'end' ? x - w : x - w / 2;
  return [start, start + w];
}

describe('keepsEveryConstraint', () => {
  it('judges a pair of settings by the interval of the nearest column, in setting units, edges included', () => {
    expect(keepsEveryConstraint(map, 5, 2)).toBe(true);
    expect(keepsEveryConstraint(map, 2, 2)).toBe(true);
    expect(keepsEveryConstraint(map, 2, 1)).toBe(false);
    expect(keepsEveryConstraint(map, 1, 2)).toBe(false);
    // A column with a single value open: only that value, though its cell is drawn 2 px tall.
    const one = {
      columns: [{ x: 3, intervals: [{ ...map.columns[1].intervals[0], from: 0.2344, to: 0.2344 }], blocked: [] }],
    };
    expect(keepsEveryConstraint(one, 3, 0.2344)).toBe(true);
    expect(keepsEveryConstraint(one, 3, 0.233)).toBe(false);
  });
});

describe('edgeLabelPlacement', () => {
  it('centres a short label under the middle of a lower edge', () => {
    const edge = { side: 'lower' as const, label: 'load', points: [[200, 100] as [number, number]] };
    const placed = edgeLabelPlacement(edge, { box });
    expect(placed).toEqual({ at: [200, 100 + 4 + 0.76 * 8], anchor: 'middle', shown: 'load' });
  });

  it('ends a label that would cross the right side at the right side, inside the box', () => {
    // "coordinate with T1 primary relay" is about 133 px at 8 px; centred at 400 it would end near 466.
    const edge = {
      side: 'upper' as const,
      label: 'coordinate with T1 primary relay',
      points: [[380, 60] as [number, number], [420, 60] as [number, number]],
    };
    const placed = edgeLabelPlacement(edge, { box });
    expect(placed.anchor).toBe('end');
    expect(placed.at[0]).toBe(428);
    expect(placed.shown).toBe(edge.label);
    const [start, end] = extentOf(placed);
    expect(start).toBeGreaterThan(box.left);
    expect(end).toBeLessThanOrEqual(box.right);
  });

  it('starts a label that would cross the left side at the left side, clear of the tick labels left of it', () => {
    const edge = { side: 'lower' as const, label: 'lowest long-time delay', points: [[50, 100] as [number, number]] };
    const placed = edgeLabelPlacement(edge, { box });
    expect(placed.anchor).toBe('start');
    expect(placed.at[0]).toBe(46);
  });

  it('shortens a label wider than the box to its start and an ellipsis that fit', () => {
    const label = 'coordinate with MCC feeder 600 A below (0 s at 10 kA, 0.1 s above the band, per the study)'.repeat(
      2,
    );
    const placed = edgeLabelPlacement({ side: 'lower', label, points: [[230, 100]] }, { box });
    expect(placed.shown).toMatch(/^coordinate with MCC feeder 600 A below .*…$/);
    expect(label.startsWith(placed.shown.slice(0, -1))).toBe(true);
    const [start, end] = extentOf(placed);
    expect(start).toBeGreaterThanOrEqual(box.left);
    expect(end).toBeLessThanOrEqual(box.right);
    expect(end - start).toBeGreaterThan(box.right - box.left - 20);
  });

  it('puts a lower edge’s label above the line when the edge lies on the bottom, off the x tick labels', () => {
    const placed = edgeLabelPlacement({ side: 'lower', label: 'load', points: [[200, 220]] }, { box });
    expect(placed.at[1]).toBe(220 - 4 - 0.24 * 8);
  });

  it('puts an upper edge’s label below the line when the edge lies on the top', () => {
    const placed = edgeLabelPlacement({ side: 'upper', label: 'withstand', points: [[200, 10]] }, { box });
    expect(placed.at[1]).toBe(10 + 4 + 0.76 * 8);
  });
});

describe('windowMapGeometry edge labels', () => {
  it('keeps every label, long or short, inside the plot box with its full text', () => {
    const long = (id: string) => binding(`coordinate with ${id} below (0 s margin up to 109 kA)`);
    const wide: FeasibleMap = {
      ...map,
      columns: map.columns.map((c) => ({
        ...c,
        intervals: c.intervals.map((i) => ({ ...i, lower: long(i.lower.id), upper: long('T1 primary relay') })),
      })),
    };
    const g = windowMapGeometry(wide, 440, 250);
    expect(g.edges.map((e) => e.label)).toEqual([
      'coordinate with below:A below (0 s margin up to 109 kA)',
      'coordinate with below:B below (0 s margin up to 109 kA)',
      'coordinate with T1 primary relay below (0 s margin up to 109 kA)',
    ]);
    for (const edge of g.edges) {
      const [start, end] = extentOf(edge);
      expect(start).toBeGreaterThanOrEqual(MAP_PADDING.left);
      expect(end).toBeLessThanOrEqual(440 - MAP_PADDING.right);
      expect(edge.at[1]).toBeGreaterThan(MAP_PADDING.top);
      expect(edge.at[1]).toBeLessThan(250 - MAP_PADDING.bottom);
    }
  });
});
