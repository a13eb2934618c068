import { describe, expect, it } from 'vitest';
import { resolveSheetOptions, sheetDefaults } from '../../src/plot/sheetOptions.ts';

describe('resolveSheetOptions', () => {
  it('has the expected defaults', () => {
    expect(resolveSheetOptions()).toEqual(sheetDefaults);
    expect(sheetDefaults).toEqual({
      width: 960,
      height: 720,
      margin: 16,
      fontSize: 11,
      idPrefix: 'tcc',
      studyDetails: 'full',
      fontFamily: 'DejaVu Sans, Arial, Helvetica, sans-serif',
    });
    expect(resolveSheetOptions({ width: 1200, height: undefined }).height).toBe(720);
  });

  it('resolveSheetOptions names each bad option with its value', () => {
    const cases: [Parameters<typeof resolveSheetOptions>[0], RegExp][] = [
      [{ width: 100 }, /^options\.width: expected a width in px of at least 480, got "100"$/],
      [{ height: NaN }, /^options\.height: expected a height in px of at least 360, got "NaN"$/],
      [{ margin: -1 }, /^options\.margin: expected a margin in px from 0 to 100, got "-1"$/],
      [{ fontSize: 40 }, /^options\.fontSize: expected a font size in px from 7 to 24, got "40"$/],
      [{ studyDetails: 'some' as 'full' }, /^options\.studyDetails: expected "full" or "brief", got "some"$/],
      [
        { idPrefix: '1 bad' },
        /^options\.idPrefix: expected a letter followed by letters, digits, "_" or "-", got "1 bad"$/,
      ],
      [
        { fontFamily: 'x"><script>' },
        /^options\.fontFamily: expected a CSS font list without <, >, " or &, got "x\\"><script>"$/,
      ],
    ];
    for (const [options, message] of cases) expect(() => resolveSheetOptions(options)).toThrow(message);
  });
});
