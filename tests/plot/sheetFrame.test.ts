import { describe, expect, it } from 'vitest';
import { frameOf } from '../../src/plot/sheetFrame.ts';
import { sheetDefaults } from '../../src/plot/sheetOptions.ts';

const ranges = { current: [10, 1e5] as [number, number], time: [0.01, 1000] as [number, number] };

describe('frameOf', () => {
  it('has the expected defaults: the plot takes the width, below the strip and above the axis', () => {
    const frame = frameOf(ranges, { strip: 60, faults: 0, key: 0 }, sheetDefaults);
    expect(frame.stripTop).toBe(16);
    expect(frame.plot.top).toBe(16 + 60 + 10);
    expect(frame.plot.left).toBeGreaterThan(16);
    expect(frame.plot.right).toBeGreaterThan(960 - 16 - 40);
    expect(frame.keyTop).toBe(720 - 16);
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
});
