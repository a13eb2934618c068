import { describe, expect, it } from 'vitest';
import { legend, legendDefaults, type LegendEntry } from '../../../src/plot/marks/legend.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const entry = (text: string, group = 'Devices'): LegendEntry => ({
  group,
  text,
  swatch: { kind: 'band', colour: '#000000', coincident: false },
  dataId: text,
});

describe('legend', () => {
  it('has the expected defaults', () => {
    expect(legendDefaults).toEqual({ swatchWidth: 26, swatchGap: 8, lineHeight: 1.25, entryGap: 4 });
  });

  it('legend writes a heading, group headings and one swatch per entry, text inside its box', () => {
    const box = { x: 700, y: 50, width: 240, height: 400 };
    const g = legend(
      [
        entry('MAIN'),
        entry('FDR-MCC 600 A with a long name that wraps over two lines'),
        entry('SWBD', 'Fault current'),
      ],
      { box, fontSize: 11 },
    );
    expect(g.shown).toBe(3);
    const texts = g.items.filter((p) => p.type === 'text').map((p) => (p.type === 'text' ? p.text : ''));
    expect(texts.slice(0, 3)).toEqual(['Legend', 'Devices', 'MAIN']);
    expect(texts).toContain('Fault current');
    for (const p of g.items)
      if (p.type === 'text')
        expect(p.x + textWidth(p.text, p.size, p.weight)).toBeLessThanOrEqual(box.x + box.width + 1e-9);
  });

  it('legend counts the entries that do not fit', () => {
    const g = legend(
      Array.from({ length: 40 }, (_, i) => entry(`Device ${i}`)),
      { box: { x: 0, y: 0, width: 200, height: 150 }, fontSize: 11 },
    );
    expect(g.shown).toBeLessThan(40);
    expect(g.items.at(-1)).toMatchObject({
      role: 'legend-more',
      text: `+ ${40 - g.shown} more not shown (enlarge the sheet)`,
    });
  });
});
