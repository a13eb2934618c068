import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readTrueType } from '../../../src/plot/pdf/trueType.ts';
import { subsetTrueType } from '../../../src/plot/pdf/trueTypeSubset.ts';

const FULL = readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');

// Accepts TrueType bytes and a glyph id; the glyph's outline bytes by loca (long or short offsets).
function outlineOf(bytes: Uint8Array, glyph: number): Buffer {
  const view = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const offsetOf = (tag: string) => {
    for (let i = 0; i < view.readUInt16BE(4); i++)
      if (view.toString('latin1', 12 + 16 * i, 16 + 16 * i) === tag) return view.readUInt32BE(20 + 16 * i);
    throw new Error(`no ${tag} table`);
  };
  const [head, loca, glyf] = ['head', 'loca', 'glyf'].map(offsetOf);
  const long = view.readInt16BE(head + 50) === 1;
  const at = (g: number) => (long ? view.readUInt32BE(loca + 4 * g) : 2 * view.readUInt16BE(loca + 2 * g));
  return view.subarray(glyf + at(glyph), glyf + at(glyph + 1));
}

describe('subsetTrueType', () => {
  it('has the expected defaults: the glyphs asked for and .notdef keep their outlines and ids, the rest are emptied', () => {
    const font = readTrueType(FULL);
    const [a, omega, cyrillic] = [0x41, 0x3a9, 0x416].map((code) => font.glyphIdOf(code));
    const subset = subsetTrueType(font, new Set([a, omega]));
    expect(subset.length).toBeLessThan(FULL.length / 4);
    for (const glyph of [0, a, omega]) expect(outlineOf(subset, glyph).equals(outlineOf(FULL, glyph))).toBe(true);
    expect(outlineOf(subset, cyrillic).length).toBe(0);
    // Same glyph count (maxp) and the same hmtx, so ids and widths are those of the full face.
    const table = (bytes: Uint8Array, tag: string) => {
      const font = Buffer.from(bytes);
      for (let i = 0; i < font.readUInt16BE(4); i++)
        if (font.toString('latin1', 12 + 16 * i, 16 + 16 * i) === tag)
          return font.subarray(
            font.readUInt32BE(20 + 16 * i),
            font.readUInt32BE(20 + 16 * i) + font.readUInt32BE(24 + 16 * i),
          );
      throw new Error(`no ${tag} table`);
    };
    for (const tag of ['maxp', 'hmtx', 'hhea']) expect(table(subset, tag).equals(table(FULL, tag)), tag).toBe(true);
  });

  it('subsetTrueType keeps the parts of a composite glyph ("é" is built from "e" and an accent)', () => {
    const font = readTrueType(FULL);
    const eAcute = font.glyphIdOf(0xe9);
    expect(outlineOf(FULL, eAcute).readInt16BE(0)).toBeLessThan(0);
    const subset = subsetTrueType(font, new Set([eAcute]));
    const e = font.glyphIdOf(0x65);
    expect(outlineOf(subset, e).equals(outlineOf(FULL, e))).toBe(true);
  });

  it('subsetTrueType writes a valid table directory: checksums, and the whole-font adjustment in head (OpenType "head")', () => {
    const subset = Buffer.from(subsetTrueType(readTrueType(FULL), new Set([36])));
    const sum = (from: number, length: number) => {
      let total = 0;
      for (let i = from; i < from + length; i += 4) total = (total + subset.readUInt32BE(i)) >>> 0;
      return total;
    };
    const tables = subset.readUInt16BE(4);
    const tags: string[] = [];
    for (let i = 0; i < tables; i++) {
      const record = 12 + 16 * i;
      const tag = subset.toString('latin1', record, record + 4);
      tags.push(tag);
      const [offset, length] = [subset.readUInt32BE(record + 8), subset.readUInt32BE(record + 12)];
      // head's checksum is taken with its adjustment field at zero.
      const adjustment = tag === 'head' ? subset.readUInt32BE(offset + 8) : 0;
      expect((sum(offset, (length + 3) & ~3) - adjustment) >>> 0, tag).toBe(subset.readUInt32BE(record + 4));
    }
    expect(tags).toEqual(['OS/2', 'cvt ', 'fpgm', 'glyf', 'head', 'hhea', 'hmtx', 'loca', 'maxp', 'prep']);
    expect(sum(0, subset.length)).toBe(0xb1b0afba);
    // The caller's bytes are left as they were.
    expect(readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf').equals(FULL)).toBe(true);
  });
});
