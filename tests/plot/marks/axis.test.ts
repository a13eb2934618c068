import { describe, expect, it } from 'vitest';
import { axisDefaults, axisX, axisY, plotFrame } from '../../../src/plot/marks/axis.ts';
import { scalesOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });

describe('axisX and axisY', () => {
  it('has the expected defaults', () => {
    expect(axisDefaults).toMatchObject({ majorTick: 6, minorTick: 3, labelGap: 3 });
    expect(plotFrame(scales)).toMatchObject({ x: 100, y: 50, width: 600, height: 600 });
  });

  it('axisX labels each decade under its line and titles the axis with the voltage base', () => {
    const items = axisX(scales, { title: 'Current in amperes at 480 V', fontSize: 11 });
    const labels = items.filter((p) => p.type === 'text' && p.role === 'tick-label-x');
    expect(labels.map((p) => (p.type === 'text' ? [p.text, Number(p.x.toFixed(9))] : null))).toEqual([
      ['10', 100],
      ['100', 250],
      ['1000', 400],
      ['10 000', 550],
      ['100 000', 700],
    ]);
    expect(items.at(-1)).toMatchObject({ role: 'axis-title-x', text: 'Current in amperes at 480 V', anchor: 'middle' });
  });

  it('axisY labels 0.01 to 1000 s and turns its title upward', () => {
    const items = axisY(scales, { title: 'Time in seconds', fontSize: 11 });
    const labels = items
      .filter((p) => p.type === 'text' && p.role === 'tick-label-y')
      .map((p) => (p.type === 'text' ? p.text : ''));
    expect(labels).toEqual(['0.01', '0.1', '1', '10', '100', '1000']);
    expect(items.at(-1)).toMatchObject({ role: 'axis-title-y', text: 'Time in seconds', rotate: -90 });
  });
});
