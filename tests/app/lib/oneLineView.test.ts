import { describe, expect, it } from 'vitest';
import { oneLineRowOf, placeAt, selectionOfPlace, viewBoxAround, zoomedBox } from '../../../src/app/lib/oneLineView.ts';
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

  it("selectionOfPlace() reads a source other than the study's own as a generator", () => {
    const [place] = diagram(100, 100, 'G1').places;
    expect(selectionOfPlace(place, 'UTIL')).toEqual({ kind: 'generator', id: 'G1' });
    expect(selectionOfPlace({ ...place, id: 'UTIL' }, 'UTIL')).toEqual({ kind: 'source', id: 'UTIL' });
    expect(selectionOfPlace(place)).toEqual({ kind: 'source', id: 'G1' });
  });
});
