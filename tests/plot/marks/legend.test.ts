import { describe, expect, it } from 'vitest';
import { legend, legendDefaults, legendHeight, type LegendEntry } from '../../../src/plot/marks/legend.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const entry = (text: string, group = 'Devices'): LegendEntry => ({
  group,
  text,
  swatch: { kind: 'band', colour: '#000000', coincident: false, dash: '10 3' },
  dataId: text,
});

describe('legend', () => {
  it('has the expected defaults', () => {
    expect(legendDefaults).toEqual({ swatchWidth: 26, swatchGap: 8, lineHeight: 1.25, entryGap: 4 });
    expect(legend([], { box: { x: 0, y: 0, width: 500 }, fontSize: 11 })).toEqual({ items: [], shown: 0, height: 0 });
  });

  it('legend sets the unlabelled entries left to right in rows, each whole and inside the width', () => {
    const box = { x: 16, y: 650, width: 500 };
    const names = ['MAIN', 'FDR-MCC 600 A with a long name that runs on', 'Compressor 1 starting', 'SWBD'];
    const g = legend(
      names.map((n) => entry(n)),
      { box, fontSize: 11 },
    );
    expect(g.shown).toBe(4);
    const texts = g.items.flatMap((p) => (p.type === 'text' && p.role === 'legend-text' ? [p.text] : []));
    expect(texts).toEqual(names);
    for (const p of g.items)
      if (p.type === 'text')
        expect(p.x + textWidth(p.text, p.size, p.weight)).toBeLessThanOrEqual(box.x + box.width + 1e-9);
    expect(g.items.some((p) => p.type === 'path' && p.dash === '10 3')).toBe(true);
    expect(
      legendHeight(
        names.map((n) => entry(n)),
        500,
        11,
      ),
    ).toBeCloseTo(g.height, 9);
  });

  it('legend counts the entries that do not fit and says where they are named', () => {
    const g = legend(
      Array.from({ length: 40 }, (_, i) => entry(`Device ${i}`)),
      { box: { x: 0, y: 0, width: 200 }, maxHeight: 60, fontSize: 11 },
    );
    expect(g.shown).toBeLessThan(40);
    expect(g.items.at(-1)).toMatchObject({ role: 'legend-more' });
    expect((g.items.at(-1) as { text: string }).text).toMatch(new RegExp(`^\\+ ${40 - g.shown} more, named in`));
  });
});
