import { afterEach, describe, expect, it, vi } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { loadPdfFonts } from '../../../src/app/lib/pdfFonts.ts';
import { pagePoints, pdfOf } from '../../../src/plot/pdf.ts';
import { sheetOf } from '../../../src/plot/sheet.ts';
import { fixtureInput } from '../../plot/fixtures.ts';
import { mediaBoxesOf, pdfStreamsOf, toUnicodeOf } from '../../pdfBytes.ts';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const FONT_DIR = `${ROOT}src/app/assets/fonts/`;
const faces = { regular: readFileSync(`${FONT_DIR}DejaVuSans.ttf`) };

// The symbols the sheets and the report are known to print, beside printable ASCII and Latin-1.
const REQUIRED = 'Ω≥≤×−√°Δµ²³½';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('pdfFonts', () => {
  it('has the expected defaults: one small DejaVu Sans face, its licence beside it, and no bold face to download', () => {
    for (const [face, bytes] of Object.entries(faces)) {
      // Fetched on the first PDF export, so kept small (the full face is 740 kB).
      expect(bytes.length, face).toBeLessThan(60_000);
      expect(bytes.readUInt32BE(0), `${face}: a TrueType file`).toBe(0x00010000);
    }
    expect(readFileSync(`${FONT_DIR}LICENSE.txt`, 'utf8')).toMatch(/Bitstream Vera Fonts Copyright[\s\S]*Arev Fonts/);
    // Bold text is the regular face stroked (src/plot/pdf/pageContent.ts).
    expect(readdirSync(FONT_DIR).filter((name) => name.endsWith('.ttf'))).toEqual(['DejaVuSans.ttf']);
  });

  it('the subset face holds a glyph for ASCII, Latin-1 and every character the plot, report and engine code writes', () => {
    const wanted = new Set<string>(REQUIRED);
    for (let code = 0x20; code <= 0x7e; code++) wanted.add(String.fromCodePoint(code));
    for (let code = 0xa0; code <= 0xff; code++) wanted.add(String.fromCodePoint(code));
    // Every literal character beyond printable ASCII in the code that builds sheets and reports.
    for (const folder of ['src/plot', 'src/report', 'src/engine']) {
      for (const file of sourceFilesUnder(`${ROOT}${folder}`))
        for (const char of readFileSync(file, 'utf8').match(/[^ -~\t\n\r]/gu) ?? []) wanted.add(char);
    }
    for (const [face, bytes] of Object.entries(faces)) {
      const mapped = codePointsOf(bytes);
      const missing = [...wanted].filter((char) => !mapped.has(char.codePointAt(0)!));
      expect(missing, `${face} lacks ${missing.map((c) => `U+${c.codePointAt(0)!.toString(16)}`).join(' ')}`).toEqual(
        [],
      );
    }
  });

  it('codePointsOf reads a cmap: the full face maps more than the subset, and no subset lacks what it is asked to hold', () => {
    const full = codePointsOf(readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf'));
    const subset = codePointsOf(faces.regular);
    // Cyrillic is in DejaVu Sans but left out of the subset.
    expect(full.has(0x0416)).toBe(true);
    expect(subset.has(0x0416)).toBe(false);
    expect([...subset].every((code) => full.has(code))).toBe(true);
  });

  it('pdfOf embeds the shipped face so Ω, ≥ and µ print, on the page asked for', async () => {
    const sheet = sheetOf(fixtureInput({ notes: 'Earth fault path 1.2 Ω; margin ≥ 0.3 s; 50 µs' }));
    const pdf = await pdfOf(sheet, { paper: 'a3', orientation: 'portrait', fonts: faces });
    const text = Buffer.from(pdf).toString('latin1');
    expect(text).toContain('/FontFile2');
    expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+DejaVuSans\b/);
    const mapped = toUnicodeOf(pdf);
    for (const char of 'Ω≥µ') expect(mapped.has(char.codePointAt(0)!), char).toBe(true);
    expect(mediaBoxesOf(pdf)).toEqual([pagePoints('a3', 'portrait').map((n) => Math.round(n * 100) / 100)]);
    expect(pdfStreamsOf(pdf).length).toBeGreaterThan(2);
  });

  it('loadPdfFonts fetches the face once, and tries again after a failed fetch', async () => {
    const fetched: string[] = [];
    let answer = 404;
    vi.stubGlobal('fetch', async (url: string) => {
      fetched.push(url);
      if (answer !== 200) return new Response(null, { status: answer });
      return new Response(readFileSync(`${ROOT}${url.replace(/^\//, '').replace(/\?.*$/, '')}`));
    });
    await expect(loadPdfFonts()).rejects.toThrow(/^PDF font \S*DejaVuSans\.ttf: expected the file, got HTTP 404$/);
    answer = 200;
    const fonts = await loadPdfFonts();
    expect(Buffer.from(fonts.regular).equals(faces.regular)).toBe(true);
    expect(Object.keys(fonts)).toEqual(['regular']);
    const count = fetched.length;
    expect(await loadPdfFonts()).toBe(fonts);
    expect(fetched.length).toBe(count);
  });
});

// Accepts a folder; every .ts and .svelte file under it.
function sourceFilesUnder(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = `${folder}/${name}`;
    if (statSync(path).isDirectory()) return sourceFilesUnder(path);
    return /\.(ts|svelte)$/.test(name) ? [path] : [];
  });
}

// Accepts TrueType bytes; the code points its Windows Unicode BMP cmap (platform 3, encoding 1,
// format 4, as the OpenType spec's cmap chapter lays out) maps to a glyph other than .notdef.
function codePointsOf(ttf: Buffer): Set<number> {
  const tableCount = ttf.readUInt16BE(4);
  let cmap = -1;
  for (let i = 0; i < tableCount; i++) {
    const record = 12 + 16 * i;
    if (ttf.toString('latin1', record, record + 4) === 'cmap') cmap = ttf.readUInt32BE(record + 8);
  }
  if (cmap < 0) throw new Error('font: expected a cmap table, got none');
  let table = -1;
  for (let i = 0; i < ttf.readUInt16BE(cmap + 2); i++) {
    const record = cmap + 4 + 8 * i;
    if (ttf.readUInt16BE(record) === 3 && ttf.readUInt16BE(record + 2) === 1)
      table = cmap + ttf.readUInt32BE(record + 4);
  }
  if (table < 0 || ttf.readUInt16BE(table) !== 4) throw new Error('font: expected a format 4 Unicode cmap, got none');
  const segments = ttf.readUInt16BE(table + 6) / 2;
  const ends = table + 14;
  const starts = ends + 2 * segments + 2;
  const deltas = starts + 2 * segments;
  const rangeOffsets = deltas + 2 * segments;
  const points = new Set<number>();
  for (let s = 0; s < segments; s++) {
    const [start, end] = [ttf.readUInt16BE(starts + 2 * s), ttf.readUInt16BE(ends + 2 * s)];
    const [delta, rangeOffset] = [ttf.readUInt16BE(deltas + 2 * s), ttf.readUInt16BE(rangeOffsets + 2 * s)];
    for (let code = start; code <= end && code !== 0xffff; code++) {
      let glyph = 0;
      if (rangeOffset === 0) glyph = (code + delta) & 0xffff;
      else {
        const raw = ttf.readUInt16BE(rangeOffsets + 2 * s + rangeOffset + 2 * (code - start));
        if (raw !== 0) glyph = (raw + delta) & 0xffff;
      }
      if (glyph !== 0) points.add(code);
    }
  }
  return points;
}
