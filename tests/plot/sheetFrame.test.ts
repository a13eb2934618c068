import { describe, expect, it } from 'vitest';
import { frameOf, minimumPlotSize, plotMinimum } from '../../src/plot/sheetFrame.ts';
import { sheetDefaults } from '../../src/plot/sheetOptions.ts';

const ranges = { current: [10, 1e5] as [number, number], time: [0.01, 1000] as [number, number] };
// The smallest sheet the command line accepts.
const smallest = { ...sheetDefaults, width: 480, height: 360 };
// At 11 px type: margins 2 × 16, the strip's gap 10, faults 18, the current axis 6 + 3 + 26.4 + 4.4 = 39.8.
const fixedHeight = 32 + 10 + 18 + 39.8;

describe('frameOf', () => {
  it('has the expected defaults: the plot takes the width, below the strip and above the axis', () => {
    const frame = frameOf(ranges, { strip: 60, faults: 0, key: 0 }, sheetDefaults);
    expect(frame.stripTop).toBe(16);
    expect(frame.plot.top).toBe(16 + 60 + 10);
    expect(frame.plot.left).toBeGreaterThan(16);
    expect(frame.plot.right).toBeGreaterThan(960 - 16 - 40);
    expect(frame.keyTop).toBe(720 - 16);
    expect(plotMinimum).toEqual({ share: 0.4, px: 200 });
    expect(minimumPlotSize(sheetDefaults)).toEqual({ width: 200, height: 200 });
  });

  it('frameOf makes room for the fault-label band above the plot and the key below the axis', () => {
    const bare = frameOf(ranges, { strip: 60, faults: 0, key: 0 }, sheetDefaults);
    const full = frameOf(ranges, { strip: 60, faults: 30, key: 40 }, sheetDefaults);
    expect(full.plot.top).toBe(bare.plot.top + 30);
    expect(full.keyTop).toBe(bare.keyTop - 40);
    expect(full.plot.bottom).toBeLessThan(bare.plot.bottom - 40);
    // The left and right edges do not depend on the heights, so fault labels can be laid out first.
    expect([full.plot.left, full.plot.right]).toEqual([bare.plot.left, bare.plot.right]);
  });

  it('minimumPlotSize keeps 40 % of a 480 × 360 px sheet: 192 × 144 px', () => {
    expect(minimumPlotSize(smallest)).toEqual({ width: 192, height: 144 });
  });

  it('frameOf at 480 × 360 cuts a 90 px key to 50.2 px so the plot keeps its 144 px minimum', () => {
    // Uncut, the plot would have 360 − 99.8 − 60 − (90 + 6) = 104.2 px: it lacks 39.8 px, which the key gives.
    const frame = frameOf(ranges, { strip: 60, faults: 18, key: 90, keyLeast: 30 }, smallest);
    expect(frame.keyHeight).toBeCloseTo(90 - 39.8, 9);
    expect(frame.plot.bottom - frame.plot.top).toBeCloseTo(144, 9);
    expect(frame.keyTop).toBeCloseTo(360 - 16 - frame.keyHeight, 9);
    expect(frame.stripBrief).toBe(false);
  });

  it('frameOf at 480 × 360 draws the strip brief (157 → 70 px) when the key at its least still leaves the plot short', () => {
    // With the full strip and a 30 px key: 360 − 99.8 − 157 − 36 = 67.2 px. Brief, the plot lacks
    // 144 − (360 − 99.8 − 70 − 96) = 49.8 px with the whole key, so the key is cut to 40.2 px.
    const frame = frameOf(ranges, { strip: 157, stripBrief: 70, faults: 18, key: 90, keyLeast: 30 }, smallest);
    expect(frame.stripBrief).toBe(true);
    expect(frame.plot.top).toBe(16 + 70 + 10 + 18);
    expect(frame.keyHeight).toBeCloseTo(40.2, 9);
    expect(frame.plot.bottom - frame.plot.top).toBeCloseTo(144, 9);
  });

  it('frameOf gives back the key whole and keeps the full strip where the sheet has room for them and the minimum', () => {
    const frame = frameOf(ranges, { strip: 120, stripBrief: 60, faults: 18, key: 90, keyLeast: 30 }, sheetDefaults);
    expect([frame.keyHeight, frame.stripBrief, frame.plot.top]).toEqual([90, false, 16 + 120 + 10 + 18]);
    expect(frame.plot.bottom - frame.plot.top).toBeCloseTo(720 - fixedHeight - 120 - 96, 9);
  });

  it('frameOf keeps the key at its least, and the plot takes what is left, when even the brief strip is too tall', () => {
    const frame = frameOf(ranges, { strip: 157, stripBrief: 140, faults: 18, key: 90, keyLeast: 30 }, smallest);
    expect([frame.keyHeight, frame.stripBrief]).toEqual([30, true]);
    expect(frame.plot.bottom - frame.plot.top).toBeCloseTo(360 - fixedHeight - 140 - 36, 9);
  });

  it('frameOf narrows the side margins of a 480 px sheet with 100 px margins and 24 px type so the plot keeps 192 px', () => {
    const wide = { ...smallest, margin: 100, fontSize: 24 };
    const frame = frameOf(ranges, { strip: 60, faults: 0, key: 0 }, wide);
    expect(frame.plot.right - frame.plot.left).toBeCloseTo(192, 9);
    expect(frame.plot.left).toBeGreaterThan(0);
    expect(frame.plot.right).toBeLessThan(480);
  });
});
