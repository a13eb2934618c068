import { describe, expect, it } from 'vitest';
import { DEJAVU_FONT_FILES, pngOf } from '../../src/plot/png.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import { svgOf } from '../../src/plot/svg.ts';
import { fixtureInput } from './fixtures.ts';
import { darkPixels, decodePng } from './pngPixels.ts';

const sheet = sheetOf(fixtureInput());
const svg = svgOf(sheet);
// The band of current tick labels just under the plot (DEVELOPERS.md: text vanishes silently without fonts).
const underAxis = {
  x: sheet.frame.left,
  y: sheet.frame.bottom + 8,
  width: sheet.frame.right - sheet.frame.left,
  height: 14,
};

describe('pngOf', () => {
  it('has the expected defaults', () => {
    expect(DEJAVU_FONT_FILES[0]).toBe('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');
    const image = decodePng(pngOf(svg));
    // Default zoom 2: 960 × 720 → 1920 × 1440.
    expect([image.width, image.height]).toEqual([1920, 1440]);
  });

  it('pngOf renders the axis labels: dark pixels under the axis, none when no font is given', () => {
    const image = decodePng(pngOf(svg, { scale: 1 }));
    expect([image.width, image.height]).toEqual([960, 720]);
    const twice = { x: underAxis.x * 2, y: underAxis.y * 2, width: underAxis.width * 2, height: underAxis.height * 2 };
    expect(darkPixels(decodePng(pngOf(svg, { scale: 2 })), twice)).toBeGreaterThan(200);
    expect(darkPixels(image, underAxis)).toBeGreaterThan(100);
    const blank = decodePng(pngOf(svg, { scale: 1, fontFiles: [] }));
    expect(darkPixels(blank, underAxis)).toBe(0);
  });

  it('pngOf rejects a zoom outside 0.1–10', () => {
    expect(() => pngOf(svg, { scale: 0 })).toThrow(/^options\.scale: expected a zoom from 0\.1 to 10, got "0"$/);
  });
});
