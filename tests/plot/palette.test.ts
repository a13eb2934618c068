import { describe, expect, it } from 'vitest';
import { CURVE_COLOURS, OKABE_ITO, curveColour } from '../../src/plot/palette.ts';

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

  it('curveColour takes the published order without yellow and cycles', () => {
    expect(CURVE_COLOURS).not.toContain(OKABE_ITO.yellow);
    expect([0, 1, 2, 3, 4].map(curveColour)).toEqual(['#000000', '#E69F00', '#56B4E9', '#009E73', '#0072B2']);
    expect(curveColour(7)).toBe(curveColour(0));
  });
});
