import { describe, expect, it } from 'vitest';
import type { Band } from '../../../src/engine/band.ts';
import { bandArea, bandAreaDefaults } from '../../../src/plot/marks/bandArea.ts';
import { pixelOf, scalesOf, valueOf } from '../../../src/plot/scales.ts';
import { bandOf } from '../../../src/engine/band.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { breakerBand, relayBand, singleLineBand, veryInverse } from '../fixtures.ts';
import { assertInDelta } from '../../asserts.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
const sheetBand = (band: Band, id = 'B') => ({ id, label: id, band, ownVolts: 480 });

/** Points of an SVG path of M/L/Z commands. */
function pathPoints(d: string): [number, number][] {
  return [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
}

/** Even-odd point-in-polygon test. */
function inside([x, y]: [number, number], polygon: [number, number][]): boolean {
  let hit = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const [xi, yi] = polygon[i];
    const [xj, yj] = polygon[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) hit = !hit;
  }
  return hit;
}

/** The edge's time at a current, read back from its drawn path through the inverse scales (log interpolation between points). */
function timeFromPath(d: string, amps: number): number {
  const points = pathPoints(d);
  const x = pixelOf(scales.x, amps);
  for (let i = 1; i < points.length; i++) {
    const [x0, y0] = points[i - 1];
    const [x1, y1] = points[i];
    if (x >= x0 && x <= x1 && x1 > x0) return valueOf(scales.y, y0 + ((x - x0) / (x1 - x0)) * (y1 - y0));
  }
  return NaN;
}

describe('bandArea', () => {
  it('has the expected defaults', () => {
    expect(bandAreaDefaults).toEqual({ strokeWidth: 1.6, fillOpacity: 0.13, tolerance: 0.1 });
    const g = bandArea(sheetBand(relayBand()), scales, { colour: '#E69F00' });
    expect(g.items.map((p) => p.role)).toEqual(['band-fill', 'band-max', 'band-min']);
    expect(g.items[0]).toMatchObject({ fill: '#E69F00', fillOpacity: 0.13, stroke: 'none' });
  });

  it('bandArea(relay) encloses its own midpoint curve (geometric mean of the edges) at sampled currents', () => {
    const band = relayBand();
    const fill = bandArea(sheetBand(band), scales, { colour: '#000000' }).items[0];
    const polygon = pathPoints(fill.d);
    for (const amps of [450, 600, 1000, 2000, 5000, 7000, 9000, 20_000, 60_000]) {
      const mid = Math.sqrt(band.minTime(amps) * band.maxTime(amps));
      expect(inside([pixelOf(scales.x, amps), pixelOf(scales.y, mid)], polygon), `at ${amps} A`).toBe(true);
    }
    // And not a point clearly outside it: ten times the clearing time at 2000 A.
    expect(inside([pixelOf(scales.x, 2000), pixelOf(scales.y, band.maxTime(2000) * 3)], polygon)).toBe(false);
  });

  it('bandArea(relay) paths read back through the inverse scales give the IEEE VI times to 1 %', () => {
    // IEEE C37.112 VI, TD 1 (IEEE C37.112): M = 2 → 7.02767 s, M = 5 → 1.30808 s, M = 10 → 0.68908 s.
    const g = bandArea(sheetBand(relayBand()), scales, { colour: '#000000' });
    const min = g.items.find((p) => p.role === 'band-min')!.d;
    const max = g.items.find((p) => p.role === 'band-max')!.d;
    assertInDelta(timeFromPath(min, 760), 7.02767, 0.01);
    assertInDelta(timeFromPath(min, 1900), 1.30808, 0.01);
    assertInDelta(timeFromPath(min, 3800), 0.68908, 0.01);
    for (const amps of [500, 800, 1500, 3000, 6000])
      assertInDelta(timeFromPath(max, amps), veryInverse(amps / 420, 1) + 0.0833, 0.01);
  });

  it('bandArea draws the pickup as an exact vertical at the breakpoint', () => {
    // The breaker's clearing edge starts at its 1100 A pickup at 12 · (6000 / 1100)² = 357.02 s (computed).
    const g = bandArea(sheetBand(breakerBand()), scales, { colour: '#000000' });
    const [first, second] = pathPoints(g.items.find((p) => p.role === 'band-max')!.d);
    const x = pixelOf(scales.x, 1100);
    // Rounded to 3 decimals in one place: within 0.0005 px.
    expect(Math.abs(first[0] - x)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(second[0] - x)).toBeLessThanOrEqual(0.0005);
    expect(first[1]).toBe(50);
    assertInDelta(valueOf(scales.y, second[1]), 12 * (6000 / 1100) ** 2, 1e-4);
  });

  it('bandArea(relay) leaves the top of the sheet where IEEE VI reaches 1000 s, not at the pickup', () => {
    // VI has no vertical within the sheet: the clearing edge reaches 1000 s at M = √(1 + 19.61 / (1000 − 0.4910 − 0.0833)) (computed).
    const g = bandArea(sheetBand(relayBand()), scales, { colour: '#000000' });
    const [first] = pathPoints(g.items.find((p) => p.role === 'band-max')!.d);
    assertInDelta(valueOf(scales.x, first[0]), 420 * Math.sqrt(1 + 19.61 / (1000 - 0.491 - 0.0833)), 1e-5);
  });

  it('bandArea stops every edge at the 0.01 s line and the top of the sheet', () => {
    const g = bandArea(sheetBand(breakerBand()), scales, { colour: '#000000' });
    for (const item of g.items) for (const [, y] of pathPoints(item.d)) expect(y >= 50 && y <= 650).toBe(true);
    const min = pathPoints(g.items.find((p) => p.role === 'band-min')!.d);
    // The minimum edge drops to 0.005 s at 9000 A: its line ends on the half-cycle line at 9000 A.
    expect(min.at(-1)![1]).toBe(650);
    expect(Math.abs(min.at(-1)![0] - pixelOf(scales.x, 9000))).toBeLessThan(0.001);
    // The band ends at its interrupting rating, 65 kA.
    const fill = pathPoints(g.items[0].d);
    expect(Math.max(...fill.map(([x]) => x))).toBeCloseTo(pixelOf(scales.x, 65_000), 2);
  });

  it('bandArea draws a band whose edges coincide as one line and no fill', () => {
    const g = bandArea(sheetBand(singleLineBand()), scales, { colour: '#009E73' });
    expect(g.items.map((p) => p.role)).toEqual(['band-line']);
    // IEEE VI TD 2 at M = 5 (750 A): 2 × 1.30808 = 2.61616 s (IEEE C37.112, computed).
    assertInDelta(timeFromPath(g.items[0].d, 750), 2.61616, 0.01);
  });

  it('bandArea ends a band at toAmps, the fault current at its location', () => {
    const g = bandArea({ ...sheetBand(relayBand()), toAmps: 20_000 }, scales, { colour: '#000000' });
    const xs = pathPoints(g.items[0].d).map(([x]) => x);
    expect(Math.max(...xs)).toBeCloseTo(pixelOf(scales.x, 20_000), 2);
  });

  it('bandArea draws nothing for a band off the sheet', () => {
    const off = scalesOf({ current: [10, 300], time: [0.01, 1000] }, { left: 0, top: 0, right: 500, bottom: 500 });
    expect(bandArea(sheetBand(relayBand()), off, { colour: '#000000' })).toEqual({ items: [], strokes: [] });
  });

  it('bandArea(bandOf(relay)) reads back the hand-worked IEEE C37.112 relay times relay time through the drawn path', () => {
    // CT 600:5, tap 5 A (600 A), IEEE VI, TD 2, fault 6000 A (M 10): 2 · (19.61/99 + 0.491) = 1.37816 s (computed),
    // plus 5 cycles (0.08333 s) of breaker time on the clearing edge.
    const relay = readCharacteristic({
      kind: 'relay',
      label: 'Relay, CT 600:5',
      ct: '600:5',
      timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 },
      breakerTime: '5 cycles',
    });
    const g = bandArea(sheetBand(bandOf(relay)), scales, { colour: '#000000' });
    assertInDelta(timeFromPath(g.items.find((p) => p.role === 'band-min')!.d, 6000), 1.37816, 0.01);
    assertInDelta(timeFromPath(g.items.find((p) => p.role === 'band-max')!.d, 6000), 1.37816 + 5 / 60, 0.01);
  });

  it('draws a band met again with the same look on the same axes as it was, and anew when any of them changes', () => {
    const band = relayBand();
    const first = bandArea(sheetBand(band), scales, { colour: '#0072B2' });
    // A later sheet (after an edit of another device) meets the same band object: the same drawing.
    expect(bandArea(sheetBand(band), scales, { colour: '#0072B2' })).toBe(first);
    // Another colour, other axes or another end current is drawn again, and reads as drawn fresh.
    const recoloured = bandArea(sheetBand(band), scales, { colour: '#D55E00' });
    expect(recoloured).not.toBe(first);
    expect(recoloured.items.map((p) => p.d)).toEqual(first.items.map((p) => p.d));
    const wider = scalesOf({ current: [1, 1e6], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
    expect(bandArea(sheetBand(band), wider, { colour: '#0072B2' }).items[0].d).not.toBe(first.items[0].d);
    const shorter = bandArea({ ...sheetBand(band), toAmps: 2000 }, scales, { colour: '#0072B2' });
    expect(shorter.items[0].d).not.toBe(first.items[0].d);
  });
});
