import { describe, expect, it } from 'vitest';
import { sheetTitle, titleBlock, titleBlockDefaults } from '../../../src/plot/marks/titleBlock.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

describe('titleBlock', () => {
  it('has the expected defaults', () => {
    expect(titleBlockDefaults).toEqual({ nameWidth: 74, padding: 6, lineHeight: 1.3, noteLines: 4 });
  });

  it('titleBlock lists study, view, date, prepared by and notes, anchored at its bottom', () => {
    const g = titleBlock(
      {
        study: 'Harrowmere',
        view: 'service',
        date: '2026-12-01',
        preparedBy: 'A. Engineer',
        notes: 'Illustrative curves.',
      },
      { x: 700, bottom: 690, width: 240, fontSize: 11 },
    );
    const names = g.items.filter((p) => p.role === 'title-block-name').map((p) => (p.type === 'text' ? p.text : ''));
    expect(names).toEqual(['Study', 'View', 'Date', 'Prepared by', 'Notes']);
    expect(g.items[0]).toMatchObject({ type: 'rect', y: g.top });
    expect(g.top).toBeLessThan(690);
  });

  it('titleBlock leaves out empty fields and cuts long notes to four lines', () => {
    const g = titleBlock(
      { study: 'S', view: 'V', notes: 'note '.repeat(200) },
      { x: 0, bottom: 500, width: 240, fontSize: 11 },
    );
    const names = g.items.filter((p) => p.role === 'title-block-name').map((p) => (p.type === 'text' ? p.text : ''));
    expect(names).toEqual(['Study', 'View', 'Notes']);
    const notes = g.items.filter((p) => p.role === 'title-block-notes');
    expect(notes).toHaveLength(4);
    expect(notes.at(-1)).toMatchObject({ text: expect.stringMatching(/…$/) });
  });

  it('sheetTitle is bold and cut to its width', () => {
    const title = sheetTitle('A very long title '.repeat(20), { x: 70, y: 24, width: 400, fontSize: 11 });
    expect(title.weight).toBe('bold');
    expect(textWidth(title.text, title.size, 'bold')).toBeLessThanOrEqual(400);
  });
});
