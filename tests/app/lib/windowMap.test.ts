import { describe, expect, it } from 'vitest';
import { MAP_PADDING, windowMapGeometry } from '../../../src/app/lib/windowMap.ts';
import type { FeasibleMap } from '../../../src/engine/window/index.ts';

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
