import { describe, it, expect } from 'vitest';
import { sizeOfSvg } from '../../../src/app/lib/exports.ts';

describe('exports', () => {
  it('has the expected defaults', () => {
    // Width and height win over a viewBox when both are given.
    expect(sizeOfSvg('<svg width="960" height="720" viewBox="0 0 10 10">')).toEqual({ width: 960, height: 720 });
  });

  it('sizeOfSvg() reads the size an SVG declares, or refuses naming what it got', () => {
    expect(sizeOfSvg('<svg xmlns="http://www.w3.org/2000/svg" width="960" height="720">')).toEqual({
      width: 960,
      height: 720,
    });
    expect(sizeOfSvg('<svg viewBox="0 0 800 600">')).toEqual({ width: 800, height: 600 });
    expect(() => sizeOfSvg('<svg>')).toThrow(/^svg: expected a width and height or a viewBox, got "<svg>"$/);
  });
});
