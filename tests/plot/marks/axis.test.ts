import { describe, expect, it } from 'vitest';
import type { TextItem } from '../../../src/plot/geometry.ts';
import { axisDefaults, axisX, axisY, labelSeries, plotFrame } from '../../../src/plot/marks/axis.ts';
import { scalesOf, type PlotFrame } from '../../../src/plot/scales.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';
import { logTicks } from '../../../src/plot/ticks.ts';

const frame: PlotFrame = { left: 100, top: 50, right: 700, bottom: 650 };
const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, frame);

describe('axisX and axisY', () => {
  it('has the expected defaults', () => {
    expect(axisDefaults).toMatchObject({ majorTick: 6, minorTick: 3, labelGap: 3, labelSpacing: 0.4 });
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

  it('axisX labels 2000 and 5000 on a 2000–9000 A view, where no decade falls inside (1-2-5 series)', () => {
    const zoomed = scalesOf({ current: [2000, 9000], time: [0.02, 0.9] }, frame);
    expect(labelTexts(axisX(zoomed, { title: 'A', fontSize: 11 }), 'tick-label-x')).toEqual(['2000', '5000']);
  });

  it('axisY labels 0.02 to 0.5 s in the 1-2-5 series on a 0.02–0.9 s view, where only the 0.1 s decade falls inside', () => {
    const zoomed = scalesOf({ current: [2000, 9000], time: [0.02, 0.9] }, frame);
    expect(labelTexts(axisY(zoomed, { title: 's', fontSize: 11 }), 'tick-label-y')).toEqual([
      '0.02',
      '0.05',
      '0.1',
      '0.2',
      '0.5',
    ]);
  });

  it('axisX adds the 2s and 5s around the single decade of a 150–8000 A view', () => {
    const zoomed = scalesOf({ current: [150, 8000], time: [0.01, 1000] }, frame);
    expect(labelTexts(axisX(zoomed, { title: 'A', fontSize: 11 }), 'tick-label-x')).toEqual([
      '200',
      '500',
      '1000',
      '2000',
      '5000',
    ]);
  });

  it('labelSeries falls back to every 1–9 tick when the 1-2-5 series gives one label or none (3000–4900 A)', () => {
    const values = (domain: [number, number]) => labelSeries(logTicks({ domain, range: [0, 1] })).map((t) => t.value);
    expect(values([3000, 4900])).toEqual([3000, 4000]);
    // Two decades or more: the decades alone, as on the full sheet.
    expect(values([10, 1e5])).toEqual([10, 100, 1000, 10_000, 100_000]);
  });

  it('axisX on a 100 px wide 150–8000 A view keeps the decade and drops the 500 and 2000 that would touch "1000"', () => {
    // At 57.9 px a decade, "1000" (28 px wide) spans 33.7–61.7 px; "500" ends at 40.8 and "2000" starts at 51.1.
    const narrow = scalesOf({ current: [150, 8000], time: [0.01, 1000] }, { left: 0, top: 0, right: 100, bottom: 600 });
    const labels = tickLabels(axisX(narrow, { title: 'A', fontSize: 11 }), 'tick-label-x');
    expect(labels.map((l) => l.text)).toEqual(['200', '1000', '5000']);
    const spans = labels.map((l) => [l.x - textWidth(l.text, 11) / 2, l.x + textWidth(l.text, 11) / 2]);
    for (let i = 1; i < spans.length; i++) expect(spans[i][0] - spans[i - 1][1]).toBeGreaterThanOrEqual(11 * 0.4);
  });

  it('axisY on a 40 px tall 0.02–0.9 s view keeps 0.02, 0.1 and 0.5 s, each a line of type clear of the next', () => {
    // 24.2 px a decade: 0.05 s stands 9.6 px above 0.02 s and 0.2 s 7.3 px above 0.1 s, under the 15.4 px two labels need.
    const short = scalesOf({ current: [2000, 9000], time: [0.02, 0.9] }, { left: 100, top: 0, right: 700, bottom: 40 });
    const labels = tickLabels(axisY(short, { title: 's', fontSize: 11 }), 'tick-label-y');
    expect(labels.map((l) => l.text)).toEqual(['0.02', '0.1', '0.5']);
    for (let i = 1; i < labels.length; i++)
      expect(labels[i - 1].y - labels[i].y).toBeGreaterThanOrEqual(11 * (1 + 0.4));
  });
});

// Accepts an axis's items and a label role; those labels, in axis order.
function tickLabels(items: ReturnType<typeof axisX>, role: string): TextItem[] {
  return items.filter((p): p is TextItem => p.type === 'text' && p.role === role);
}

// Accepts an axis's items and a label role; the labels' texts.
function labelTexts(items: ReturnType<typeof axisX>, role: string): string[] {
  return tickLabels(items, role).map((l) => l.text);
}
