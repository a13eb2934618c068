import { describe, expect, it } from 'vitest';
import type { Primitive } from '../../src/plot/geometry.ts';
import { pagePoints } from '../../src/plot/pdf.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import type { Drawing } from '../../src/plot/svg.ts';
import { figureTileDefaults, figureTilingOf, smallestTextSize } from '../../src/report/figureTiles.ts';
import { pageDefaults } from '../../src/report/reportPages.ts';
import { fixtureInput } from '../plot/fixtures.ts';

// Accepts a size and text sizes; a blank drawing of that size holding one label of each text size.
function drawingOf(width: number, height: number, sizes: number[]): Drawing {
  const items: Primitive[] = sizes.map((size, i) => ({
    type: 'text',
    role: 'label',
    x: 10,
    y: 20 * (i + 1),
    text: `label ${i + 1}`,
    size,
    anchor: 'start',
    fill: '#1a1a1a',
  }));
  const [title, description] = ['Labels', 'One label of each size.'];
  return {
    width,
    height,
    fontFamily: 'DejaVu Sans',
    title,
    description,
    patterns: [],
    layers: [{ name: 'labels', items }],
  };
}

describe('figureTilingOf', () => {
  it('has the expected defaults: tiles print text at 6 pt or more, neighbours share half an inch, eight or more are indexed', () => {
    expect(figureTileDefaults).toEqual({ legibleText: 6, overlap: 36, minGain: 1.25, indexedFrom: 8 });
  });

  it('smallestTextSize reads the smallest text a drawing holds, and Infinity where it holds none', () => {
    expect(smallestTextSize(drawingOf(100, 100, [11, 8, 15]))).toBe(8);
    expect(smallestTextSize(drawingOf(100, 100, []))).toBe(Infinity);
  });

  it('leaves a figure whole where fitting it prints its smallest text at 6 pt or more, or where it has no text', () => {
    const room = { width: 516, height: 600 };
    expect(figureTilingOf(drawingOf(400, 300, [8]), 516 / 400, room)).toBeNull();
    expect(figureTilingOf(drawingOf(4000, 3000, []), 0.1, room)).toBeNull();
  });

  it('leaves a time-current sheet whole on Letter portrait, where tiles would print it only 1.15 times larger', () => {
    const sheet = sheetOf(fixtureInput());
    const [pageWidth] = pagePoints('letter', 'portrait');
    const room = { width: pageWidth - 2 * pageDefaults.margin, height: 600 };
    const fit = Math.min(room.width / sheet.width, room.height / sheet.height);
    expect(smallestTextSize(sheet) * fit).toBeLessThan(6);
    expect(figureTilingOf(sheet, fit, room)).toBeNull();
  });

  it('covers a drawing too large for one page row by row with tiles at 6 pt, spread evenly, neighbours sharing 36 pt or more', () => {
    const drawing = drawingOf(2000, 3000, [8, 11]);
    const room = { width: 516, height: 600 };
    const tiling = figureTilingOf(drawing, Math.min(516 / 2000, 600 / 3000), room)!;
    // 8-px text at 6 pt: 0.75 pt per px, so a tile shows 688 × 800 px of the drawing.
    expect(tiling.scale).toBe(0.75);
    expect(tiling.tiles).toHaveLength(tiling.rows * tiling.columns);
    expect(tiling.tiles.map((t) => [t.row, t.column])).toEqual(
      Array.from({ length: tiling.rows * tiling.columns }, (_, i) => [
        Math.floor(i / tiling.columns) + 1,
        (i % tiling.columns) + 1,
      ]),
    );
    const shared = figureTileDefaults.overlap / tiling.scale;
    for (const [start, size, shows, length, count] of [
      ['x', 'width', 688, 2000, tiling.columns],
      ['y', 'height', 800, 3000, tiling.rows],
    ] as const) {
      const spans = [...new Set(tiling.tiles.map((t) => t.window[start]))].map(
        (at) => tiling.tiles.find((t) => t.window[start] === at)!.window,
      );
      expect(spans).toHaveLength(count);
      expect(spans[0][start]).toBe(0);
      expect(spans.at(-1)![start] + spans.at(-1)![size]).toBeCloseTo(length, 9);
      for (const span of spans) expect(span[size]).toBeCloseTo(shows, 9);
      const steps = spans.slice(1).map((span, i) => span[start] - spans[i][start]);
      for (const step of steps) {
        expect(step).toBeCloseTo(steps[0], 9);
        expect(shows - step).toBeGreaterThanOrEqual(shared);
      }
    }
  });

  it('shows a drawing narrower than a tile whole across, in one column', () => {
    const tiling = figureTilingOf(drawingOf(500, 3000, [8]), 600 / 3000, { width: 516, height: 600 })!;
    expect(tiling.columns).toBe(1);
    for (const tile of tiling.tiles) expect([tile.window.x, tile.window.width]).toEqual([0, 500]);
  });
});
