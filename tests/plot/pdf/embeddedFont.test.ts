import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createEmbeddedFont } from '../../../src/plot/pdf/embeddedFont.ts';

// The subset the workbench embeds: Latin-1 and Latin Extended-A, without combining accents.
const SUBSET = new Uint8Array(readFileSync(new URL('../../../src/app/assets/fonts/DejaVuSans.ttf', import.meta.url)));

describe('createEmbeddedFont', () => {
  it('places the accented letter for a base letter followed by a combining accent (Unicode NFC), not a .notdef box', () => {
    const font = createEmbeddedFont(SUBSET, { name: 'F1', postScriptName: 'DejaVuSans' });
    const composed = font.encode('José Dvořák');
    const decomposed = font.encode('Jose\u0301 Dvor\u030ca\u0301k');
    expect(decomposed).toEqual(composed);
    // Glyph 0 is .notdef: none is placed (the operand is a hex string of four digits a glyph).
    expect(composed.operand.slice(1, -1).match(/.{4}/g)).not.toContain('0000');
  });
});
