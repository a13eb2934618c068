import { describe, expect, it } from 'vitest';
import { gridDefaults, gridX, gridY, halfCycleRule } from '../../../src/plot/marks/grid.ts';
import { scalesOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
const segments = (d: string) => d.split('M').length - 1;

describe('gridX and gridY', () => {
  it('has the expected defaults', () => {
    expect(gridDefaults).toEqual({ majorStroke: '#9a9a9a', minorStroke: '#d9d9d9', majorWidth: 0.9, minorWidth: 0.6 });
    expect(gridX(scales, {}).map((p) => p.role)).toEqual(['grid-x-minor', 'grid-x-major']);
  });

  it('gridX draws every 1–9 line per decade, decades heavier', () => {
    const [minor, major] = gridX(scales, {});
    // 10 A – 100 kA: four decades of 2–9 (32 lines) and five decade lines.
    expect(segments(minor.d)).toBe(32);
    expect(segments(major.d)).toBe(5);
    expect(major.strokeWidth!).toBeGreaterThan(minor.strokeWidth!);
    expect(major.d.startsWith('M100,650L100,50')).toBe(true);
  });

  it('gridY draws the time lines from 0.01 s to 1000 s', () => {
    const [minor, major] = gridY(scales, {});
    expect(segments(minor.d)).toBe(40);
    expect(segments(major.d)).toBe(6);
    expect(major.d).toContain('M100,410L700,410');
  });
});

describe('halfCycleRule', () => {
  it('halfCycleRule marks 0.01 s only when the axis reaches below it', () => {
    expect(halfCycleRule(scales, 11)).toEqual([]);
    const low = scalesOf({ current: [10, 1e5], time: [0.001, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
    const [line, note] = halfCycleRule(low, 11);
    expect(line).toMatchObject({ role: 'half-cycle', dash: '6 3' });
    expect(note).toMatchObject({ role: 'half-cycle-note', text: 'curves stop at ½ cycle (0.01 s)' });
  });
});
