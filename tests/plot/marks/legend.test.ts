import { describe, expect, it } from 'vitest';
import { legend, legendDefaults, legendHeight, type LegendEntry } from '../../../src/plot/marks/legend.ts';
import type { Primitive } from '../../../src/plot/geometry.ts';
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

  it('legend counts the curves that do not fit as not named in this key, pointing at no notes an exported figure lacks', () => {
    const g = legend(
      Array.from({ length: 40 }, (_, i) => entry(`Device ${i}`)),
      { box: { x: 0, y: 0, width: 400 }, maxHeight: 60, fontSize: 11 },
    );
    expect(g.shown).toBeLessThan(40);
    expect(g.items.at(-1)).toMatchObject({ role: 'legend-more' });
    const more = moreText(g.items);
    expect(more).toBe(`+ ${40 - g.shown} more curves not named in this key; enlarge the sheet to name them here`);
    expect(more).not.toMatch(/notes/);
  });

  it('legend shortens its closing line to fit the key: 24 px type on a 200 px key keeps only the count', () => {
    const entries = Array.from({ length: 40 }, (_, i) => entry(`D${i}`));
    for (const [width, fontSize] of [
      [448, 11],
      [300, 11],
      [200, 24],
    ]) {
      const g = legend(entries, { box: { x: 0, y: 0, width }, maxHeight: fontSize * 4, fontSize });
      const line = g.items.at(-1)!;
      expect(line.type === 'text' && line.role === 'legend-more').toBe(true);
      if (line.type !== 'text') continue;
      expect(line.text, `${width} px at ${fontSize} px`).toMatch(new RegExp(`^\\+ ${40 - g.shown} more`));
      expect(textWidth(line.text, line.size), `${width} px at ${fontSize} px`).toBeLessThanOrEqual(width);
    }
    const tight = legend(entries, { box: { x: 0, y: 0, width: 200 }, maxHeight: 96, fontSize: 24 });
    expect(moreText(tight.items)).toBe(`+ ${40 - tight.shown} more`);
  });

  it('legend calls what is left over items when markers or findings are among it, and one curve "curve"', () => {
    const symbol = (text: string): LegendEntry => ({
      group: 'Markers',
      text,
      swatch: { kind: 'symbol', colour: '#000000', symbol: 'fault' },
      dataId: text,
    });
    const box = { x: 0, y: 0, width: 600 };
    // Two rows at 11 px: the first holds the heading and the first entry, the second the closing line.
    const long = 'x'.repeat(60);
    const mixed = legend([entry(long), entry(long), symbol(long)], { box, maxHeight: 30, fontSize: 11 });
    expect(mixed.shown).toBe(1);
    expect(moreText(mixed.items)).toBe('+ 2 more items not named in this key; enlarge the sheet to name them here');
    // The last entry needs no row kept for the closing line, so it is left over only when it wraps.
    const wrapping = 'a long name '.repeat(12);
    const single = legend([entry(long), entry(wrapping)], { box, maxHeight: 30, fontSize: 11 });
    expect(single.shown).toBe(1);
    expect(moreText(single.items)).toBe('+ 1 more curve not named in this key; enlarge the sheet to name it here');
  });
});

// Accepts a legend's drawing; the text of its closing "+ n more" line.
function moreText(items: Primitive[]): string | undefined {
  const line = items.find((p) => p.role === 'legend-more');
  return line?.type === 'text' ? line.text : undefined;
}
