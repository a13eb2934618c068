import { describe, expect, it } from 'vitest';
import type { Band } from '../../../src/engine/band.ts';
import { formatRange, overlapHatch, overlapHatchDefaults } from '../../../src/plot/marks/overlapHatch.ts';
import { CURVE_COLOURS } from '../../../src/plot/palette.ts';
import { pixelOf, scalesOf, valueOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
const region = { fromAmps: 3200, toAmps: 12_000, status: 'overlap' as const, label: 'R1 over CB1', findingId: 'f1' };

// Two invented edges crossing: the upstream device may operate in 1000/I s, the downstream one clears by 4000/I s.
const edge = (k: number, pickup = 0): Band => ({
  minTime: (a) => (a > pickup ? k / a : Infinity),
  maxTime: (a) => (a > pickup ? k / a : Infinity),
  breakpoints: Float64Array.from(pickup ? [pickup] : []),
  minAmps: pickup,
  maxAmps: Infinity,
  currentLimitingFrom: Infinity,
  diagnostics: [],
});

describe('overlapHatch', () => {
  it('has the expected defaults', () => {
    expect(overlapHatchDefaults.overlap).toEqual({
      colour: '#D55E00',
      angle: 45,
      spacing: 6,
      strokeWidth: 1,
      cross: false,
    });
    // Each status differs in angle or crossing as well as colour, and no hatch wears a curve's colour.
    const shapes = Object.values(overlapHatchDefaults).map((p) => `${p.angle}/${p.cross}`);
    expect(new Set(shapes).size).toBe(3);
    for (const p of Object.values(overlapHatchDefaults)) expect(CURVE_COLOURS).not.toContain(p.colour);
  });

  it('overlapHatch without edges fills the current interval over the draw window', () => {
    const g = overlapHatch(region, 0, scales, { patternId: 'tcc-hatch-1', fontSize: 11 });
    expect(g.items[0]).toMatchObject({ type: 'path', role: 'region-overlap', patternId: 'tcc-hatch-1', dataId: 'f1' });
    const xs = [...g.outline!].filter((_, i) => i % 2 === 0);
    const ys = [...g.outline!].filter((_, i) => i % 2 === 1);
    expect(Math.min(...xs)).toBeCloseTo(pixelOf(scales.x, 3200), 9);
    expect(Math.max(...xs)).toBeCloseTo(pixelOf(scales.x, 12_000), 9);
    expect([Math.min(...ys), Math.max(...ys)]).toEqual([50, 650]);
    expect(g.label?.text).toBe('overlap 3.2–12 kA');
  });

  it('overlapHatch with edges lies between the upstream earliest operation and the downstream latest clearing', () => {
    const edges = { upstream: edge(1000), downstream: edge(4000) };
    const g = overlapHatch({ ...region, edges }, 0, scales, { patternId: 'p', fontSize: 11 });
    const o = g.outline!;
    const n = o.length / 4;
    for (let i = 0; i < 2 * n; i++) {
      const amps = valueOf(scales.x, o[2 * i]);
      const seconds = valueOf(scales.y, o[2 * i + 1]);
      const [low, high] = [1000 / amps, 4000 / amps];
      expect(seconds).toBeGreaterThanOrEqual(low * (1 - 1e-9));
      expect(seconds).toBeLessThanOrEqual(high * (1 + 1e-9));
    }
    // Far from the full height it would take without edges.
    const ys = [...o].filter((_, i) => i % 2 === 1);
    expect(Math.max(...ys) - Math.min(...ys)).toBeLessThan(300);
  });

  it('overlapHatch holds a clearing time that never comes at the top of the sheet', () => {
    const edges = { upstream: edge(1000), downstream: edge(4000, 20_000) };
    const g = overlapHatch({ ...region, edges }, 0, scales, { patternId: 'p', fontSize: 11 });
    const ys = [...g.outline!].filter((_, i) => i % 2 === 1);
    expect(Math.min(...ys)).toBe(50);
  });

  it('overlapHatch asks for its label beside the polygon, at the crossing end first', () => {
    const edges = { upstream: edge(1000), downstream: edge(4000) };
    const g = overlapHatch({ ...region, edges }, 0, scales, { patternId: 'p', fontSize: 11 });
    const [x, y] = g.label!.anchor;
    expect(x).toBeCloseTo(pixelOf(scales.x, 3200), 6);
    expect(valueOf(scales.y, y)).toBeCloseTo(Math.sqrt((1000 / 3200) * (4000 / 3200)), 6);
    const first = g.label!.candidates[0].box;
    expect(Math.hypot(first.x - x, first.y + first.height - y)).toBeLessThan(10);
  });

  it('formatRange writes both ends in one unit', () => {
    expect(formatRange(150, 800)).toBe('150–800 A');
    expect(formatRange(3200, 12_000)).toBe('3.2–12 kA');
    expect(formatRange(800, 1200)).toBe('0.8–1.2 kA');
  });

  it('overlapHatch skips a region off the current axis', () => {
    expect(
      overlapHatch({ ...region, fromAmps: 2e5, toAmps: 3e5 }, 0, scales, { patternId: 'p', fontSize: 11 }),
    ).toEqual({ items: [], outline: null, label: null });
  });
});
