import { describe, expect, it } from 'vitest';
import { studyStrip, studyStripDefaults } from '../../../src/plot/marks/studyStrip.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const fields = {
  title: 'Service path at 480 V',
  study: 'Harrowmere Cold Store',
  view: 'service',
  site: 'invented site',
  revision: 'B',
  date: '2026-12-01',
  preparedBy: 'A. Engineer',
  checkedBy: 'B. Checker',
  caution: 'For review by a qualified engineer. '.repeat(6),
};

describe('studyStrip', () => {
  it('has the expected defaults', () => {
    expect(studyStripDefaults).toEqual({
      titleScale: 1.3,
      detailScale: 0.88,
      lineHeight: 1.3,
      barWidth: 5,
      indent: 10,
      noteLines: 2,
      titleLines: 2,
      detailLines: 2,
    });
  });

  it('keeps the date whole and shortens a long revision mark; keeps two lines of a long title and details', () => {
    const long = 'Wmmmmmm '.repeat(25).trim();
    const { items, height } = studyStrip(
      {
        ...fields,
        title: long,
        study: long,
        site: long,
        preparedBy: long,
        revision: 'B (issued for construction, supersedes A)',
      },
      { x: 0, y: 0, width: 480, fontSize: 11 },
    );
    const text = (role: string) => items.flatMap((p) => (p.type === 'text' && p.role === role ? [p.text] : []));
    expect(text('strip-stamp')[0]).toMatch(/^Rev B \(issued[^·]*… {2}· {2}2026-12-01$/);
    expect(text('sheet-title')).toHaveLength(2);
    expect(text('sheet-title')[1]).toMatch(/ …$/);
    expect(text('strip-details')).toHaveLength(2);
    expect(text('strip-details')[1]).toMatch(/ …$/);
    expect(height).toBeLessThan(200);
  });

  it('studyStrip prints title, revision and date, details and the whole caution across the width', () => {
    const { items, height } = studyStrip(fields, { x: 16, y: 16, width: 928, fontSize: 11 });
    const text = (role: string) => items.flatMap((p) => (p.type === 'text' && p.role === role ? [p.text] : []));
    expect(text('sheet-title')).toEqual(['Service path at 480 V']);
    expect(text('strip-stamp')).toEqual(['Rev B  ·  2026-12-01']);
    expect(text('strip-details').join(' ')).toContain('checked by B. Checker');
    expect(text('caution').join(' ').replace(/\s+/g, ' ').trim()).toBe(fields.caution.trim());
    expect(height).toBeGreaterThan(40);
    for (const p of items)
      if (p.type === 'text' && p.anchor === 'start')
        expect(p.x + textWidth(p.text, p.size, p.weight)).toBeLessThanOrEqual(16 + 928 + 1e-9);
  });

  it('studyStrip leaves out what the study does not give', () => {
    const { items } = studyStrip(
      { title: 'T', study: 'S', view: 'v', caution: 'C.' },
      { x: 0, y: 0, width: 500, fontSize: 11 },
    );
    expect(items.some((p) => p.role === 'strip-stamp')).toBe(false);
    expect(items.filter((p) => p.role === 'strip-details').map((p) => (p.type === 'text' ? p.text : ''))).toEqual([
      'S · sheet v',
    ]);
  });
});
