import { describe, expect, it } from 'vitest';
import { formatTable, tableAmps, wrapText } from '../../src/cli/table.ts';

describe('formatTable', () => {
  it('has the expected defaults: columns padded to the widest cell, two spaces apart, a rule under the header', () => {
    expect(formatTable(['bus', 'kA'], [['SWBD', '29.8']], ['left', 'right'])).toBe(
      ['bus     kA', '----  ----', 'SWBD  29.8'].join('\n'),
    );
    expect(tableAmps(28421.1)).toBe('28 421');
    // A fraction of an ampere keeps three figures rather than rounding to nothing.
    expect(tableAmps(0.001)).toBe('0.001');
    expect(tableAmps(4.987)).toBe('4.99');
  });

  it('wraps one column so no line is wider than maxWidth, other cells blank on continuation lines', () => {
    const table = formatTable(
      ['severity', 'finding', 'range'],
      [['fail', 'Main over feeder: overlap for a ground fault at the far end', '7200 A']],
      [],
      { maxWidth: 40, wrapColumn: 1 },
    );
    // Other columns: 8 + 6 wide plus two gaps of 2 = 18 → 40 − 18 = 22 left for the finding column.
    expect(table.split('\n')).toEqual([
      'severity  finding                 range',
      '--------  ----------------------  ------',
      'fail      Main over feeder:       7200 A',
      '          overlap for a ground',
      '          fault at the far end',
    ]);
    for (const line of table.split('\n')) expect(line.length).toBeLessThanOrEqual(40);
  });

  it('keeps a narrow table as it is, and never narrows the wrap column below minWrapWidth', () => {
    const rows = [['ok', 'short', 'x']];
    expect(formatTable(['a', 'b', 'c'], rows, [], { maxWidth: 120, wrapColumn: 1 })).toBe(
      formatTable(['a', 'b', 'c'], rows),
    );
    const narrow = formatTable(['a', 'b'], [['x'.repeat(30), 'one two three four five six']], [], {
      maxWidth: 20,
      wrapColumn: 1,
      minWrapWidth: 10,
    });
    expect(narrow.split('\n')[2]).toBe(`${'x'.repeat(30)}  one two`);
  });
});

describe('wrapText', () => {
  it('breaks at spaces, cuts a word longer than the width, and returns one empty line for no text', () => {
    expect(wrapText('Main over feeder: thin margin', 12)).toEqual(['Main over', 'feeder: thin', 'margin']);
    expect(wrapText('abcdefghij kl', 4)).toEqual(['abcd', 'efgh', 'ij', 'kl']);
    expect(wrapText('', 10)).toEqual(['']);
    expect(() => wrapText('x', 0)).toThrow(/^expected a width of at least 1, got "0"$/);
  });
});
