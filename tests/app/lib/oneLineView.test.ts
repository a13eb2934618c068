import { describe, expect, it } from 'vitest';
import {
  itemsInView,
  oneLineRowOf,
  openingBox,
  placeAt,
  selectionOfPlace,
  viewBoxAround,
  visibleBox,
  zoomedBox,
} from '../../../src/app/lib/oneLineView.ts';
import type { OneLine, OneLinePlace } from '../../../src/plot/oneLine/index.ts';

const places: OneLinePlace[] = [
  {
    id: 'SWBD',
    type: 'bus',
    symbol: { x: 10, y: 200, width: 400, height: 6 },
    label: { x: 20, y: 180, width: 120, height: 14 },
  },
  {
    id: 'MAIN',
    type: 'device',
    symbol: { x: 40, y: 150, width: 22, height: 22 },
    label: { x: 75, y: 150, width: 90, height: 28 },
  },
];

describe('oneLineView', () => {
  it('has the expected defaults: a place selects its own kind and id', () => {
    expect(selectionOfPlace(places[1])).toEqual({ kind: 'device', id: 'MAIN' });
    expect(selectionOfPlace(places[0])).toEqual({ kind: 'bus', id: 'SWBD' });
  });

  it('placeAt finds a symbol before a bus bar, and a label by its box', () => {
    expect(placeAt(places, { x: 50, y: 160 })?.id).toBe('MAIN');
    expect(placeAt(places, { x: 100, y: 160 })?.id).toBe('MAIN');
    expect(placeAt(places, { x: 300, y: 203 })?.id).toBe('SWBD');
    expect(placeAt(places, { x: 600, y: 600 })).toBeUndefined();
  });

  it('zoomedBox keeps the point under the pointer fixed and stops at 20 ×', () => {
    expect(zoomedBox({ x: 0, y: 0, width: 100, height: 50 }, { x: 50, y: 25 }, 0.5)).toEqual({
      x: 25,
      y: 12.5,
      width: 50,
      height: 25,
    });
    expect(zoomedBox({ x: 0, y: 0, width: 100, height: 50 }, { x: 0, y: 0 }, 1e-9).width).toBe(5);
  });

  it('viewBoxAround centres a target and keeps the size', () => {
    expect(viewBoxAround({ x: 500, y: 300, width: 10, height: 10 }, { x: 0, y: 0, width: 200, height: 100 })).toEqual({
      x: 405,
      y: 255,
      width: 200,
      height: 100,
    });
  });
});

describe('oneLineView with several trees', () => {
  const diagram = (width: number, height: number, id: string): OneLine =>
    ({
      width,
      height,
      layers: [],
      places: [
        {
          id,
          type: 'source',
          symbol: { x: 10, y: 20, width: 30, height: 30 },
          label: { x: 45, y: 20, width: 50, height: 14 },
        },
      ],
      continuations: [],
    }) as unknown as OneLine;

  it('oneLineRowOf() sets diagrams left to right with a gap, moving every place with its diagram', () => {
    const row = oneLineRowOf([diagram(300, 500, 'UTIL'), diagram(200, 700, 'G1')], 40);
    expect(row.diagrams.map((d) => d.x)).toEqual([0, 340]);
    expect([row.width, row.height]).toEqual([540, 700]);
    expect(row.places.map((p) => [p.id, p.symbol.x, p.label.x])).toEqual([
      ['UTIL', 10, 45],
      ['G1', 350, 385],
    ]);
    expect(placeAt(row.places, { x: 360, y: 30 })?.id).toBe('G1');
  });

  it('oneLineRowOf() makes a continuation bar select its bus', () => {
    const wide = {
      ...diagram(300, 500, 'UTIL'),
      continuations: [
        {
          id: 'SWBD',
          type: 'bus',
          symbol: { x: 10, y: 400, width: 280, height: 6 },
          label: { x: 18, y: 380, width: 150, height: 14 },
        },
      ],
    } as OneLine;
    const row = oneLineRowOf([diagram(200, 300, 'G1'), wide], 40);
    const place = placeAt(row.places, { x: 240 + 100, y: 402 });
    expect(place && selectionOfPlace(place)).toEqual({ kind: 'bus', id: 'SWBD' });
  });

  it('openingBox() opens a diagram whole, or one far taller than the panel on its top across its width', () => {
    const panel = { width: 300, height: 200 };
    // A few buses: about as tall as wide, shown whole.
    expect(openingBox({ x: 0, y: 0, width: 1200, height: 1500 }, panel)).toEqual({
      x: 0,
      y: 0,
      width: 1200,
      height: 1500,
    });
    // Up to three times the panel's proportion, still whole; past it, the top.
    expect(openingBox({ x: 0, y: 0, width: 1200, height: 2400 }, panel).height).toBe(2400);
    expect(openingBox({ x: 0, y: 0, width: 1350, height: 109_000 }, panel)).toEqual({
      x: 0,
      y: 0,
      width: 1350,
      height: 900,
    });
    // A panel not laid out yet has no proportion: the whole diagram.
    expect(openingBox({ x: 0, y: 0, width: 1350, height: 109_000 }, { width: 0, height: 0 }).height).toBe(109_000);
  });

  it('itemsInView() keeps the items whose ink reaches the view or the margin around it', () => {
    const edges = [
      [0, 0, 10, 10], // in view
      [0, 140, 10, 149], // below the view, within half its height
      [0, 160, 10, 170], // past the margin
      [-500, 50, 500, 52], // a bus bar across the view, its ends outside
      [0, -2000, 4, 2000], // a long run through the view
    ];
    expect(itemsInView(edges, { x: 0, y: 0, width: 100, height: 100 })).toEqual([0, 1, 3, 4]);
    expect(itemsInView(edges, { x: 0, y: 0, width: 100, height: 100 }, 0)).toEqual([0, 3, 4]);
  });

  it('visibleBox() widens a view box about its centre to what a panel of other proportions shows', () => {
    // A square box in a panel twice as wide as tall: 50 px more of the drawing on either side.
    expect(visibleBox({ x: 0, y: 0, width: 100, height: 100 }, { width: 300, height: 150 })).toEqual({
      x: -50,
      y: 0,
      width: 200,
      height: 100,
    });
    // A wide box in a square panel: taller, about the same centre.
    expect(visibleBox({ x: 10, y: 20, width: 200, height: 100 }, { width: 100, height: 100 })).toEqual({
      x: 10,
      y: -30,
      width: 200,
      height: 200,
    });
    // A panel not laid out yet: the box as it is.
    expect(visibleBox({ x: 1, y: 2, width: 3, height: 4 }, { width: 0, height: 0 })).toEqual({
      x: 1,
      y: 2,
      width: 3,
      height: 4,
    });
  });

  it("selectionOfPlace() reads a source other than the study's own as a generator", () => {
    const [place] = diagram(100, 100, 'G1').places;
    expect(selectionOfPlace(place, 'UTIL')).toEqual({ kind: 'generator', id: 'G1' });
    expect(selectionOfPlace({ ...place, id: 'UTIL' }, 'UTIL')).toEqual({ kind: 'source', id: 'UTIL' });
    expect(selectionOfPlace(place)).toEqual({ kind: 'source', id: 'G1' });
  });
});
