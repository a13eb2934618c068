import { describe, expect, it } from 'vitest';
import { frameOf } from '../../src/plot/sheetFrame.ts';
import { sheetDefaults } from '../../src/plot/sheetOptions.ts';

const ranges = { current: [10, 1e5] as [number, number], time: [0.01, 1000] as [number, number] };

describe('frameOf', () => {
  it('has the expected defaults', () => {
    const frame = frameOf(ranges, 'For review by a qualified engineer.', sheetDefaults);
    expect(frame.panel).toMatchObject({ x: 960 - 16 - 250, width: 250 });
    expect(frame.plot.right).toBeLessThan(frame.panel.x);
    expect(frame.plot.left).toBeGreaterThan(16);
    expect(frame.plot.bottom).toBeLessThan(frame.cautionTop);
  });

  it('frameOf gives a longer caution more room at the foot', () => {
    const short = frameOf(ranges, 'Short.', sheetDefaults);
    const long = frameOf(ranges, 'word '.repeat(300), sheetDefaults);
    expect(long.cautionTop).toBeLessThan(short.cautionTop);
    expect(long.plot.bottom).toBeLessThan(short.plot.bottom);
  });
});
