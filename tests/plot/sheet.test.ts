import { describe, expect, it } from 'vitest';
import { boxesOverlap, boxInside } from '../../src/plot/geometry.ts';
import { DEFAULT_TIME_RANGE, sheetOf } from '../../src/plot/sheet.ts';
import { fixtureInput } from './fixtures.ts';

describe('sheetOf', () => {
  it('has the expected defaults', () => {
    const sheet = sheetOf(fixtureInput());
    expect([sheet.width, sheet.height]).toEqual([960, 720]);
    expect(sheet.scales.y.domain).toEqual(DEFAULT_TIME_RANGE);
    expect(sheet.fontFamily).toBe('DejaVu Sans, Arial, Helvetica, sans-serif');
    expect(sheet.diagnostics).toEqual([]);
  });

  it('sheetOf colours curves in Okabe–Ito order without yellow: bands, then withstand, then starting', () => {
    const sheet = sheetOf(fixtureInput());
    expect(sheet.curves.map((c) => [c.id, c.colour])).toEqual([
      ['R1', '#000000'],
      ['CB1', '#E69F00'],
      ['R2', '#56B4E9'],
      ['TX1', '#009E73'],
      ['M1', '#0072B2'],
    ]);
  });

  it('sheetOf places every curve label inside the plot with no two boxes overlapping', () => {
    const sheet = sheetOf(fixtureInput());
    const plot = {
      x: sheet.frame.left,
      y: sheet.frame.top,
      width: sheet.frame.right - sheet.frame.left,
      height: sheet.frame.bottom - sheet.frame.top,
    };
    expect(sheet.labels.map((l) => l.dataId).sort()).toEqual(
      ['CB1', 'M1', 'R1', 'R2', 'SWBD:max', 'SWBD:min', 'TX1', 'TX1:inrush:0', 'coordination:R1/CB1:1'].sort(),
    );
    for (const label of sheet.labels) expect(boxInside(label.box, plot), label.text).toBe(true);
    for (let i = 0; i < sheet.labels.length; i++)
      for (let j = i + 1; j < sheet.labels.length; j++)
        expect(
          boxesOverlap(sheet.labels[i].box, sheet.labels[j].box),
          `${sheet.labels[i].text} / ${sheet.labels[j].text}`,
        ).toBe(false);
  });

  it('sheetOf keeps labels apart when many bands crowd one sheet', () => {
    const base = fixtureInput();
    const bands = Array.from({ length: 12 }, (_, i) => ({
      ...base.bands[i % 3],
      id: `B${i}`,
      label: `Feeder breaker number ${i}`,
    }));
    const sheet = sheetOf({ ...base, bands });
    for (let i = 0; i < sheet.labels.length; i++)
      for (let j = i + 1; j < sheet.labels.length; j++)
        expect(boxesOverlap(sheet.labels[i].box, sheet.labels[j].box)).toBe(false);
  });

  it('sheetOf uses given ranges and reports what falls outside them', () => {
    const sheet = sheetOf(fixtureInput({ currentRange: [10, 300], timeRange: [0.001, 100] }));
    expect(sheet.scales.x.domain).toEqual([10, 300]);
    expect(sheet.window.seconds).toEqual([0.01, 100]);
    expect(sheet.diagnostics).toContain("Breaker CB1 is outside the sheet's current or time range and is not drawn");
    expect(sheet.diagnostics).toContain("fault line SWBD (max) is outside the sheet's current range");
  });

  it('sheetOf titles the current axis with the reference voltage', () => {
    const sheet = sheetOf(fixtureInput({ referenceVolts: 12_470 }));
    const titles = sheet.layers.flatMap((l) => l.items).filter((p) => p.role === 'axis-title-x');
    expect(titles).toMatchObject([{ text: 'Current in amperes at 12.47 kV' }]);
  });
});
