import { describe, expect, it } from 'vitest';
import { textWidth, truncateText, wrapText } from '../../src/plot/textWidth.ts';
import { assertInDelta } from '../asserts.ts';

describe('textWidth', () => {
  it('has the expected defaults', () => {
    // DejaVu Sans digits advance 1303 of 2048 units; bold 1425.
    assertInDelta(textWidth('0', 2048), 1303, 1e-12);
    assertInDelta(textWidth('0', 2048, 'bold'), 1425, 1e-12);
    expect(textWidth('', 11)).toBe(0);
  });

  it('textWidth adds the advances of each character, symbols included', () => {
    // '4','8','0',' ','V' = 1303·3 + 651 + 1401 units; 'Ω' 1565 units.
    assertInDelta(textWidth('480 V', 11), ((1303 * 3 + 651 + 1401) / 2048) * 11, 1e-12);
    assertInDelta(textWidth('Ω', 2048), 1565, 1e-12);
  });

  it('measures text composed (Unicode NFC), as the PDF fonts place it: an accent after its letter, the ohm sign as Ω', () => {
    expect(textWidth('Jose\u0301', 11)).toBe(textWidth('José', 11));
    expect(textWidth('R = 5 \u2126', 11)).toBe(textWidth('R = 5 Ω', 11));
  });

  it('truncateText keeps a letter with its accent, and cuts decomposed text where it cuts the composed', () => {
    const decomposed = 'Jose\u0301 Dvor\u030ca\u0301k';
    const composed = 'José Dvořák';
    const width = textWidth('José Dvoř…', 11) + 0.01;
    expect(truncateText(decomposed, width, 11)).toBe(truncateText(composed, width, 11));
    expect(truncateText(decomposed, textWidth('José…', 11) + 0.01, 11)).toBe('José…');
  });
});

describe('wrapText', () => {
  it('wrapText keeps every line within the width and loses no word', () => {
    const text = 'For review by a qualified engineer. Local codes and the authority having jurisdiction govern.';
    const lines = wrapText(text, 150, 11);
    expect(lines.length).toBeGreaterThan(2);
    for (const line of lines) expect(textWidth(line, 11)).toBeLessThanOrEqual(150);
    expect(lines.join(' ')).toBe(text);
  });

  it('wrapText breaks a word wider than the line across lines, losing no character', () => {
    const id = 'BLDG-C-SWBD-MSB-1-FEEDER-TO-COMPRESSOR-MCC';
    const lines = wrapText(`feeds ${id} now`, 60, 11);
    expect(lines.length).toBeGreaterThan(3);
    for (const line of lines) expect(textWidth(line, 11)).toBeLessThanOrEqual(60);
    expect(lines.join('').replaceAll(' ', '')).toBe(`feeds${id}now`);
  });

  it('wrapText breaks a long word between whole characters, never inside one', () => {
    // "é" written as e and a combining acute accent (U+0301) stays one character.
    const word = 'Cafe\u0301'.repeat(12);
    for (let width = 12; width <= 60; width += 0.5) {
      const lines = wrapText(word, width, 10);
      expect(lines.length).toBeGreaterThan(1);
      for (const line of lines) expect(line.startsWith('\u0301'), `${width}`).toBe(false);
      expect(lines.join('')).toBe(word);
    }
  });

  it('truncateText cuts a long word with an ellipsis that fits', () => {
    const cut = truncateText('FEEDER-TO-COMPRESSOR-MCC', 60, 11);
    expect(cut.endsWith('…')).toBe(true);
    expect(textWidth(cut, 11)).toBeLessThanOrEqual(60);
    expect(truncateText('MAIN', 60, 11)).toBe('MAIN');
  });
});
