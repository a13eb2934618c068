import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { simplifyPolyline } from '../../src/plot/simplify.ts';

describe('simplifyPolyline', () => {
  it('has the expected defaults', () => {
    expect([...simplifyPolyline(new Float64Array([0, 0, 1, 1, 2, 2, 3, 0]))]).toEqual([0, 0, 2, 2, 3, 0]);
  });

  it('simplifyPolyline keeps a vertical pickup edge and both ends', () => {
    const line = new Float64Array([100, 0, 100.0000001, 50, 100.0000002, 100, 150, 140, 200, 160]);
    const kept = [...simplifyPolyline(line, 0.1)];
    expect(kept.slice(0, 2)).toEqual([100, 0]);
    expect(kept.slice(-2)).toEqual([200, 160]);
    expect(kept).toContain(150);
  });

  it('simplifyPolyline leaves every dropped point within the tolerance of the result (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { minLength: 6, maxLength: 60 }), (ys) => {
        const line = new Float64Array(ys.flatMap((y, i) => [i * 5, y]));
        const kept = simplifyPolyline(line, 0.5);
        // Each original x lies on a kept segment; its y is within 0.5 px of that segment (the segments are never vertical here).
        for (let i = 0; i < ys.length; i++) {
          const x = i * 5;
          let j = 0;
          while (j + 2 < kept.length / 2 && kept[2 * (j + 1)] < x) j++;
          const [x0, y0, x1, y1] = [kept[2 * j], kept[2 * j + 1], kept[2 * j + 2], kept[2 * j + 3]];
          const y = y0 + ((x - x0) / (x1 - x0)) * (y1 - y0);
          expect(Math.abs(y - ys[i])).toBeLessThanOrEqual(0.5 * Math.hypot(1, (y1 - y0) / (x1 - x0)) + 1e-9);
        }
      }),
      { numRuns: 200 },
    );
  });
});
