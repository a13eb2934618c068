import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readTrueType } from '../../../src/plot/pdf/trueType.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const FULL = readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');
const SUBSET = readFileSync(new URL('../../../src/app/assets/fonts/DejaVuSans.ttf', import.meta.url));

describe('readTrueType', () => {
  it('has the expected defaults: DejaVu Sans at 2048 units per em, "A" its glyph 36, 1401 units wide', () => {
    const font = readTrueType(FULL);
    expect(font.unitsPerEm).toBe(2048);
    expect(font.glyphIdOf(0x41)).toBe(36);
    expect(font.advanceOf(36)).toBe(1401);
    expect(font.glyphIdOf(0x0416 + 0x10000 * 0x10)).toBe(0);
    expect(font.ascent).toBeGreaterThan(0);
    expect(font.descent).toBeLessThan(0);
  });

  it('readTrueType reads format 12 in the full face (beyond the BMP too) and format 4 in the subset, to the same widths', () => {
    const full = readTrueType(FULL);
    const subset = readTrueType(SUBSET);
    // Old Italic letter A, U+10300: only a format 12 subtable reaches it.
    expect(full.glyphIdOf(0x10300)).toBeGreaterThan(0);
    let compared = 0;
    for (let code = 0x20; code < 0x3000; code++) {
      const glyph = subset.glyphIdOf(code);
      if (glyph === 0) continue;
      expect(subset.advanceOf(glyph), `U+${code.toString(16)}`).toBe(full.advanceOf(full.glyphIdOf(code)));
      compared++;
    }
    expect(compared).toBeGreaterThan(200);
  });

  it('readTrueType gives the widths the sheet lays text out with (textWidth.ts, one source of truth)', () => {
    const faces = [
      ['normal', readTrueType(FULL)],
      ['bold', readTrueType(readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf'))],
    ] as const;
    for (const [weight, font] of faces) {
      for (const char of ' AZaz09.,Ω µ°±×²·–—’≥≤→Δφ√≈é') {
        const units = font.advanceOf(font.glyphIdOf(char.codePointAt(0)!));
        expect(textWidth(char, 2048, weight), `${weight} ${char}`).toBe(units);
      }
    }
  });

  it('readTrueType names options.fonts for bytes that are not a TrueType font', () => {
    expect(() => readTrueType(new TextEncoder().encode('not a font, just some text'))).toThrow(
      /^options\.fonts: expected TrueType font bytes, got 26 bytes of something else$/,
    );
  });
});
