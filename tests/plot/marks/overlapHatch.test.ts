import { describe, expect, it } from 'vitest';
import { formatRange, overlapHatch, overlapHatchDefaults } from '../../../src/plot/marks/overlapHatch.ts';
import { pixelOf, scalesOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
const region = { fromAmps: 3200, toAmps: 12_000, status: 'overlap' as const, label: 'R1 over CB1', findingId: 'f1' };

describe('overlapHatch', () => {
  it('has the expected defaults', () => {
    expect(overlapHatchDefaults.overlap).toEqual({
      colour: '#D55E00',
      angle: 45,
      spacing: 7,
      strokeWidth: 0.9,
      cross: false,
    });
    // Each status differs in angle or crossing as well as colour.
    const shapes = Object.values(overlapHatchDefaults).map((p) => `${p.angle}/${p.cross}`);
    expect(new Set(shapes).size).toBe(3);
  });

  it('overlapHatch fills the current interval over the draw window with the pattern', () => {
    const g = overlapHatch(region, 0, scales, { patternId: 'tcc-hatch-1', fontSize: 11 });
    const rect = g.items[0];
    expect(rect).toMatchObject({
      type: 'rect',
      role: 'region-overlap',
      patternId: 'tcc-hatch-1',
      y: 50,
      height: 600,
      dataId: 'f1',
    });
    if (rect.type !== 'rect') throw new Error('expected a rect');
    expect(rect.x).toBeCloseTo(pixelOf(scales.x, 3200), 9);
    expect(rect.x + rect.width).toBeCloseTo(pixelOf(scales.x, 12_000), 9);
    expect(g.label?.text).toBe('overlap 3.2–12 kA');
  });

  it('formatRange writes both ends in one unit', () => {
    expect(formatRange(150, 800)).toBe('150–800 A');
    expect(formatRange(3200, 12_000)).toBe('3.2–12 kA');
    expect(formatRange(800, 1200)).toBe('0.8–1.2 kA');
  });

  it('overlapHatch skips a region off the current axis', () => {
    expect(
      overlapHatch({ ...region, fromAmps: 2e5, toAmps: 3e5 }, 0, scales, { patternId: 'p', fontSize: 11 }),
    ).toEqual({ items: [], label: null });
  });
});
