import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { boxesOverlap, boxInside } from '../../src/plot/geometry.ts';
import { DEFAULT_TIME_RANGE, sheetOf } from '../../src/plot/sheet.ts';
import { textWidth } from '../../src/plot/textWidth.ts';
import { viewInputOf } from '../../src/plot/viewInput.ts';
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
      ['CB1', 'M1', 'R1', 'R2', 'TX1', 'TX1:inrush:0', 'coordination:R1/CB1:1'].sort(),
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
    // A fault beyond the axis is still named, in the band above the plot, pointing off the sheet.
    const faultLabels = sheet.layers.flatMap((l) => l.items).filter((p) => p.role === 'fault-label');
    expect(faultLabels.map((p) => (p.type === 'text' ? p.text : ''))).toContain('SWBD 28.4 kA @ 480 V →');
  });

  it('sheetOf titles the current axis with the reference voltage', () => {
    const sheet = sheetOf(fixtureInput({ referenceVolts: 12_470 }));
    const titles = sheet.layers.flatMap((l) => l.items).filter((p) => p.role === 'axis-title-x');
    expect(titles).toMatchObject([{ text: 'Current in amperes at 12.47 kV' }]);
  });

  it('sheetOf labels every curve whole on the plot or names it in the key, at the workbench sizes and in large type', () => {
    const base = fixtureInput();
    const bands = Array.from({ length: 10 }, (_, i) => ({
      ...base.bands[i % 3],
      id: `B${i}`,
      label: `Feeder breaker number ${i} with a long descriptive name`,
    }));
    for (const [width, height, fontSize] of [
      [700, 460, 11],
      [860, 560, 11],
      [1300, 780, 11],
      [700, 460, 14],
    ]) {
      const sheet = sheetOf({ ...base, bands }, { width, height, fontSize });
      const items = sheet.layers.flatMap((l) => l.items);
      const keyed = new Set(items.filter((p) => p.role === 'legend-text').map((p) => p.dataId));
      const labelled = new Set(sheet.labels.map((l) => l.dataId));
      const more = items.some((p) => p.role === 'legend-more');
      for (const c of sheet.curves)
        expect(labelled.has(c.id) || keyed.has(c.id) || more, `${c.label} at ${width}`).toBe(true);
      for (const l of sheet.labels) expect(l.text).not.toMatch(/…$/);
      const plot = {
        x: sheet.frame.left,
        y: sheet.frame.top,
        width: sheet.frame.right - sheet.frame.left,
        height: sheet.frame.bottom - sheet.frame.top,
      };
      for (const l of sheet.labels) expect(boxInside(l.box, plot)).toBe(true);
      for (let i = 0; i < sheet.labels.length; i++)
        for (let j = i + 1; j < sheet.labels.length; j++)
          expect(boxesOverlap(sheet.labels[i].box, sheet.labels[j].box)).toBe(false);
      // Every text of the sheet stays on the sheet.
      for (const p of items)
        if (p.type === 'text' && !p.rotate) {
          const w = textWidth(p.text, p.size, p.weight);
          const left = p.anchor === 'end' ? p.x - w : p.anchor === 'middle' ? p.x - w / 2 : p.x;
          expect(left, p.text).toBeGreaterThanOrEqual(-1e-6);
          expect(left + w, p.text).toBeLessThanOrEqual(width + 1e-6);
        }
    }
  });

  it('sheetOf gives every curve its own colour and every band its own edge pattern', () => {
    const base = fixtureInput();
    const bands = Array.from({ length: 6 }, (_, i) => ({ ...base.bands[i % 3], id: `B${i}`, label: `B${i}` }));
    const sheet = sheetOf({ ...base, bands });
    const colours = sheet.curves.map((c) => c.colour);
    expect(new Set(colours).size).toBe(colours.length);
    const dashes = sheet.curves.filter((c) => c.kind === 'band').map((c) => c.dash);
    expect(new Set(dashes).size).toBe(dashes.length);
    for (const p of sheet.patterns) expect(colours).not.toContain(p.colour);
  });

  it('sheetOf with brief study details leaves the caution to the page and gives the plot the room', () => {
    const full = sheetOf(fixtureInput());
    const brief = sheetOf(fixtureInput(), { studyDetails: 'brief' });
    const roles = (sheet: typeof full) => sheet.layers.flatMap((l) => l.items).map((p) => p.role);
    expect(roles(full)).toContain('caution');
    expect(roles(brief)).not.toContain('caution');
    expect(roles(brief)).toContain('sheet-title');
    expect(brief.frame.top).toBeLessThan(full.frame.top);
  });

  it('sheetOf at the smallest size keeps a readable plot, and keeps the caution while it drops the notes', () => {
    // The demo's service sheet at 480 × 360: its strip and key left the plot 6.7 px tall.
    const analysis = analyseStudy(parseStudy(readFileSync('demo/harrowmere-overlap.json', 'utf8')));
    const sheet = sheetOf(viewInputOf(analysis, 'service'), { width: 480, height: 360 });
    expect(sheet.frame.bottom - sheet.frame.top).toBeGreaterThan(80);
    const roles = sheet.layers.flatMap((l) => l.items).map((p) => p.role);
    expect(roles).toContain('caution');
    expect(sheet.diagnostics).toContain(
      'The study strip leaves out its notes to keep the plot readable; enlarge the sheet to show them',
    );
    // At the default size nothing is left out.
    expect(sheetOf(viewInputOf(analysis, 'service')).diagnostics.some((d) => d.startsWith('The study strip'))).toBe(
      false,
    );
  });
});
