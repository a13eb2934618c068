import { describe, expect, it } from 'vitest';
import { ALL_CURVE_COLOURS, CURVE_COLOURS, OKABE_ITO, REGION_COLOURS, curveColour } from '../../src/plot/palette.ts';

describe('palette', () => {
  it('has the expected defaults', () => {
    // Okabe & Ito, "Color Universal Design" (2008), in its published order.
    expect(Object.values(OKABE_ITO)).toEqual([
      '#000000',
      '#E69F00',
      '#56B4E9',
      '#009E73',
      '#F0E442',
      '#0072B2',
      '#D55E00',
      '#CC79A7',
    ]);
  });

  it('curveColour takes the published order without yellow and vermillion, then darker shades, and cycles', () => {
    expect(CURVE_COLOURS).not.toContain(OKABE_ITO.yellow);
    expect(CURVE_COLOURS).not.toContain(OKABE_ITO.vermillion);
    expect([0, 1, 2, 3, 4, 5].map(curveColour)).toEqual([
      '#000000',
      '#E69F00',
      '#56B4E9',
      '#009E73',
      '#0072B2',
      '#CC79A7',
    ]);
    // Eleven curves, eleven colours; the twelfth starts again.
    const eleven = Array.from({ length: 11 }, (_, i) => curveColour(i));
    expect(new Set(eleven).size).toBe(11);
    expect(curveColour(11)).toBe(curveColour(0));
  });

  it('no region colour is a curve colour, and no two regions share one', () => {
    const regions = Object.values(REGION_COLOURS);
    expect(new Set(regions).size).toBe(regions.length);
    for (const c of regions) expect(ALL_CURVE_COLOURS).not.toContain(c);
    expect(REGION_COLOURS.overlap).toBe(OKABE_ITO.vermillion);
  });
});
