import { describe, expect, it } from 'vitest';
import { dashArrayOf, rgbOf } from '../../../src/plot/pdf/paintOf.ts';
import { ALL_CURVE_COLOURS, SHEET_COLOURS } from '../../../src/plot/palette.ts';

describe('paintOf', () => {
  it('has the expected defaults: #rrggbb as three components 0–1, none as no paint', () => {
    expect(rgbOf('#E69F00')).toBe('0.902 0.624 0');
    expect(rgbOf('#ffffff')).toBe('1 1 1');
    expect(rgbOf('none')).toBeNull();
  });

  it('rgbOf reads #rgb and the two colour names, and every colour the palette has', () => {
    expect(rgbOf('#333')).toBe(rgbOf('#333333'));
    expect(rgbOf('black')).toBe('0 0 0');
    for (const colour of [...ALL_CURVE_COLOURS, ...Object.values(SHEET_COLOURS)])
      expect(rgbOf(colour), colour).toMatch(/^[\d.]+ [\d.]+ [\d.]+$/);
  });

  it('rgbOf rejects any other colour with one line naming it', () => {
    expect(() => rgbOf('rgb(1,2,3)')).toThrow(/^drawing colour: expected #rrggbb, #rgb or none, got "rgb\(1,2,3\)"$/);
  });

  it('dashArrayOf writes SVG dash arrays for PDF, repeating an odd list as SVG does (SVG 1.1 §11.4)', () => {
    expect(dashArrayOf('7 4')).toBe('[7 4]');
    expect(dashArrayOf('10,3,2.5,3')).toBe('[10 3 2.5 3]');
    expect(dashArrayOf('5')).toBe('[5 5]');
    expect(dashArrayOf('1 2 3')).toBe('[1 2 3 1 2 3]');
    for (const solid of [undefined, '', 'none', '0 0', '3 -1']) expect(dashArrayOf(solid), String(solid)).toBeNull();
  });
});
