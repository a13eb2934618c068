import { readFileSync } from 'node:fs';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Primitive } from '../../src/plot/geometry.ts';
import { PAPER_POINTS, pagePoints, pdfOf, pdfOfPages } from '../../src/plot/pdf.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import type { Drawing } from '../../src/plot/svg.ts';
import { textWidth } from '../../src/plot/textWidth.ts';
import { fixtureInput } from './fixtures.ts';
import { entry, pagesOf, readPdf, resolve, toUnicodeMapOf, widthsOf, type PdfFile } from './pdf/pdfReader.ts';

const sheet = sheetOf(fixtureInput({ notes: 'Impedance in Ω, currents in µs-rated steps, margin ≥ 0.2 s' }));
const text = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1');
const REGULAR = readFileSync('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');

// A small drawing whose every primitive is known: 4 shapes, 3 text runs, a hatch.
const drawing: Drawing = {
  width: 200,
  height: 100,
  fontFamily: 'DejaVu Sans',
  title: 'Test drawing, R in Ω',
  description: 'Shapes and labels of every kind the sheet writes.',
  patterns: [{ id: 'h1', colour: '#D55E00', angle: 45, spacing: 6, strokeWidth: 1, cross: false }],
  layers: [
    {
      name: 'shapes',
      items: [
        {
          type: 'path',
          role: 'curve',
          d: 'M10,10L190,10',
          stroke: '#000000',
          strokeWidth: 1.5,
          fill: 'none',
          dash: '7 4',
        },
        { type: 'path', role: 'band', d: 'M10,20L50,20L50,60Z', fill: '#E69F00', fillOpacity: 0.13, stroke: 'none' },
        {
          type: 'path',
          role: 'region',
          d: 'M60,20L100,20L100,60L60,60Z',
          patternId: 'h1',
          fillOpacity: 0.85,
          stroke: '#D55E00',
          strokeWidth: 0.8,
          strokeOpacity: 0.85,
        },
        {
          type: 'rect',
          role: 'frame',
          x: 0,
          y: 0,
          width: 200,
          height: 100,
          fill: 'none',
          stroke: '#333',
          strokeWidth: 1,
        },
      ],
    },
    {
      name: 'labels',
      items: [
        { type: 'text', role: 'label', x: 100, y: 90, text: 'R = 1.2 Ω', size: 10, anchor: 'middle', fill: '#1a1a1a' },
        {
          type: 'text',
          role: 'axis-title-y',
          x: 20,
          y: 50,
          text: 'Time',
          size: 11,
          anchor: 'middle',
          fill: '#1a1a1a',
          rotate: -90,
        },
        {
          type: 'text',
          role: 'label',
          x: 190,
          y: 80,
          text: 'µs ≥ 0.3',
          size: 9,
          anchor: 'end',
          fill: '#4d4d4d',
          weight: 'bold',
        },
      ],
    },
  ],
};

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('pdfOf', () => {
  it('has the expected defaults', async () => {
    expect(PAPER_POINTS.letter).toEqual([792, 612]);
    const pdf = text(await pdfOf(sheet));
    expect(pdf.startsWith('%PDF-1.7')).toBe(true);
    // Landscape letter.
    expect(pdf).toMatch(/\/MediaBox \[0 0 792 612\]/);
    expect(pdf).toContain('/CreationDate (D:20000101000000Z)');
  });

  it('pdfOf prints one landscape A4 page with DejaVu Sans embedded for Ω, µ and ≥', async () => {
    const pdf = text(await pdfOf(sheet, { paper: 'a4' }));
    expect(pdf.match(/\/Type \/Page\b(?!s)/g)).toHaveLength(1);
    expect(pdf).toMatch(/\/MediaBox \[0 0 841\.89 595\.28\]/);
    expect(pdf).toContain('/FontFile2');
    expect(pdf).toMatch(/\/BaseFont \/[A-Z]{6}\+DejaVuSans\b/);
    expect(pdf).toMatch(/\/BaseFont \/[A-Z]{6}\+DejaVuSans-Bold\b/);
  });

  it('pdfOf rejects an unknown paper, orientation, margin or date with one line naming the option', async () => {
    await expect(pdfOf(sheet, { paper: 'legal' as 'a4' })).rejects.toThrow(
      /^options\.paper: expected "letter", "a4", "tabloid" or "a3", got "legal"$/,
    );
    await expect(pdfOf(sheet, { orientation: 'up' as 'portrait' })).rejects.toThrow(
      /^options\.orientation: expected "landscape" or "portrait", got "up"$/,
    );
    await expect(pdfOf(sheet, { margin: -1 })).rejects.toThrow(
      /^options\.margin: expected points from 0 to 200, got "-1"$/,
    );
    await expect(pdfOf({ ...drawing, height: 0 })).rejects.toThrow(
      /^drawing\.height: expected a size in px greater than 0, got "0"$/,
    );
    await expect(pdfOf(sheet, { date: 'soon' })).rejects.toThrow(/^options\.date: expected an ISO date, got "soon"$/);
    await expect(pdfOf(sheet, { fonts: { regular: new Uint8Array(40) } })).rejects.toThrow(
      /^options\.fonts: expected TrueType font bytes, got 40 bytes of something else$/,
    );
  });

  it('pdfOf prints tabloid portrait when asked, and the same figure twice gives the same bytes', async () => {
    const pdf = text(await pdfOf(sheet, { paper: 'tabloid', orientation: 'portrait' }));
    expect(pdf).toMatch(/\/MediaBox \[0 0 792 1224\]/);
    const [first, second] = [await pdfOf(sheet, { paper: 'a3' }), await pdfOf(sheet, { paper: 'a3' })];
    expect(Buffer.from(first).equals(Buffer.from(second))).toBe(true);
    // The file identifier follows the content: another paper, another identifier.
    const id = (bytes: Uint8Array) => /\/ID \[<([0-9A-F]{32})>/.exec(text(bytes))?.[1];
    expect(id(first)).toMatch(/^[0-9A-F]{32}$/);
    expect(id(first)).not.toBe(id(await pdfOf(sheet, { paper: 'a4' })));
  });

  it('pdfOf titles the document with the drawing’s title, in UTF-16 so Ω survives', async () => {
    const info = text(await pdfOf(drawing));
    const title = /\/Title <FEFF([0-9A-F]*)>/.exec(info)![1];
    const units = title.match(/.{4}/g)!.map((unit) => Number.parseInt(unit, 16));
    expect(String.fromCharCode(...units)).toBe('Test drawing, R in Ω');
    expect(text(await pdfOf(drawing, { title: 'Sheet V1' }))).toContain(
      `/Title <FEFF${[...'Sheet V1'].map((c) => c.charCodeAt(0).toString(16).padStart(4, '0').toUpperCase()).join('')}>`,
    );
  });

  it('pdfOf writes a cross-reference table whose every offset points at its object', async () => {
    const file = readPdf(await pdfOf(sheet));
    expect(file.objects.size).toBeGreaterThan(8);
    expect([...file.objects.keys()]).toEqual([...Array(file.objects.size).keys()].map((i) => i + 1));
    expect(file.trailer).toMatch(new RegExp(`/Size ${file.objects.size + 1} `));
    expect(resolve(file, /\/Info (\d+ 0 R)/.exec(file.trailer)![1]).body).toContain('/Producer (discern)');
  });

  it('pdfOf fits the drawing inside the margins, centred, and draws each primitive once over a white background', async () => {
    const file = readPdf(await pdfOf(drawing, { margin: 36 }));
    const [{ content }] = pagesOf(file);
    // 200 × 100 px into 720 × 540 pt: width limits, 3.6 pt per px, 360 pt tall, centred at 126 pt from the top.
    expect(content).toMatch(/^q\n3\.6 0 0 -3\.6 36 486 cm\n0 0 200 100 re W n\n1 1 1 rg\n0 0 200 100 re f\n/);
    const operators = content.split(/\s+/);
    const count = (op: string) => operators.filter((token) => token === op).length;
    // Background and band filled; curve and frame stroked; the hatched region filled and stroked.
    expect([count('f'), count('S'), count('B')]).toEqual([2, 2, 1]);
    expect(count('BT')).toBe(3);
    expect(count('Tj')).toBe(3);
    expect(content).toContain('[7 4] 0 d');
    expect(content).toContain('0.902 0.624 0 rg');
    // "#333" is #333333.
    expect(content).toContain('0.2 0.2 0.2 RG');
    expect(content).toContain('10 10 m 190 10 l');
  });

  it('pdfOf sets fill and stroke opacity through graphics states', async () => {
    const file = readPdf(await pdfOf(drawing));
    const [page] = pagesOf(file);
    expect(page.body).toMatch(/\/ExtGState << \/G1 << \/ca 0\.13 \/CA 1 >> \/G2 << \/ca 0\.85 \/CA 0\.85 >> >>/);
    expect(page.content).toMatch(/\/G1 gs\n0\.902 0\.624 0 rg\n10 20 m 50 20 l 50 60 l h\nf/);
  });

  it('pdfOf fills a hatched region with a tiling pattern turned as the SVG pattern is', async () => {
    const file = readPdf(await pdfOf(drawing));
    const [page] = pagesOf(file);
    expect(page.content).toContain('/Pattern cs /P1 scn');
    const pattern = entry(file, /\/Pattern << ([^>]*) >>/.exec(page.body)![1], 'P1');
    expect(pattern.body).toMatch(/\/PatternType 1 \/PaintType 1 \/TilingType 1 \/BBox \[0 0 6 6\] \/XStep 6 \/YStep 6/);
    // One vertical line through the tile's middle in vermillion, 1 px wide (svg.ts's pattern element).
    expect(pattern.stream!.toString('latin1')).toBe('0.835 0.369 0 RG 1 w 3 0 m 3 6 l S');
    // rotate(45°) in y-down pixels, then 3.6 pt per px flipped onto the page: [3.6c 3.6s·(-1) …].
    const [a, b, c, d, e, f] = /\/Matrix \[([^\]]+)\]/.exec(pattern.body)![1].split(' ').map(Number);
    const k = 3.6 * Math.SQRT1_2;
    for (const [got, want] of [
      [a, k],
      [b, -k],
      [c, -k],
      [d, -k],
      [e, 36],
      [f, 486],
    ])
      expect(got).toBeCloseTo(want, 5);
  });

  it('pdfOf paints as SVG does when paint is left out: fill black, no stroke, a missing hatch unfilled', async () => {
    const items: Primitive[] = [
      { type: 'path', role: 'marker', d: 'M1,1L9,1L5,9Z' },
      { type: 'path', role: 'region', d: 'M1,1L9,1L5,9Z', patternId: 'nowhere', stroke: '#0072B2' },
      { type: 'rect', role: 'legend-swatch', x: 2, y: 2, width: 6, height: 4, patternId: 'h1', stroke: '#D55E00' },
      { type: 'rect', role: 'empty', x: 2, y: 2, width: 0, height: 4, fill: '#000000' },
      { type: 'path', role: 'unpainted', d: 'M0,0L5,5', fill: 'none', stroke: 'none' },
    ];
    const small: Drawing = { ...drawing, width: 10, height: 10, layers: [{ name: 'x', items }] };
    const [{ content }] = pagesOf(readPdf(await pdfOf(small)));
    const shapes = content.split('\nq\n').slice(1);
    expect(shapes).toEqual([
      '0 0 0 rg\n1 1 m 9 1 l 5 9 l h\nf\nQ',
      '0 0.447 0.698 RG 1 w\n1 1 m 9 1 l 5 9 l h\nS\nQ',
      // The last one closes the placement too.
      '/Pattern cs /P1 scn\n0.835 0.369 0 RG 1 w\n2 2 6 4 re\nB\nQ\nQ',
    ]);
  });

  it('pdfOf anchors text by the face’s advance widths and turns a rotated label about its anchor', async () => {
    const file = readPdf(await pdfOf(drawing));
    const [{ content }] = pagesOf(file);
    const runs = [...content.matchAll(/BT \/(F\d) ([\d.]+) Tf [\d. ]+ rg ([-\d. ]+) Tm <([0-9A-F]+)> Tj ET/g)];
    expect(runs).toHaveLength(3);
    const widths = widthsOfFont(file, content, 'F1');
    const advance = (hex: string, size: number) =>
      (hex.match(/.{4}/g)!.reduce((sum, glyph) => sum + widths.get(Number.parseInt(glyph, 16))!, 0) / 1000) * size;
    // Middle: the anchor minus half the advance; the text matrix flips glyphs upright in y-down pixels.
    const [, , , middle, middleHex] = runs[0];
    const shift = advance(middleHex, 10) / 2;
    expect(middle.split(' ').map(Number)).toEqual([1, 0, 0, -1, Number((100 - shift).toFixed(3)), 90]);
    // Turned −90° (the y axis title): cos 0, sin −1, so the run starts half its advance below the anchor.
    const [, , , turned, turnedHex] = runs[1];
    const lift = advance(turnedHex, 11) / 2;
    expect(turned.split(' ').map(Number)).toEqual([0, -1, -1, 0, 20, Number((50 + lift).toFixed(3))]);
    // The bold run uses the bold face.
    expect(runs[2][1]).toBe('F2');
  });

  it('pdfOf maps the glyphs of Ω, µ and ≥ back to their characters, with the widths of the TrueType file', async () => {
    const file = readPdf(await pdfOf(drawing));
    const [{ content, body }] = pagesOf(file);
    const font = entry(file, body, 'F1');
    const unicode = toUnicodeMapOf(entry(file, font.body, 'ToUnicode').stream!.toString('latin1'));
    const hex = /<([0-9A-F]+)> Tj/.exec(content)![1];
    const glyphs = hex.match(/.{4}/g)!.map((g) => Number.parseInt(g, 16));
    expect(glyphs.map((g) => unicode.get(g)).join('')).toBe('R = 1.2 Ω');
    // Widths: the face's hmtx advance in thousandths of an em, as read straight from the file.
    const widths = widthsOfFont(file, content, 'F1');
    const omega = glyphs[glyphs.length - 1];
    expect(widths.get(omega)).toBeCloseTo((advanceOf(REGULAR, omega) * 1000) / 2048, 2);
    // The same widths the sheet lays labels out with (textWidth.ts, DejaVu Sans 2.37).
    for (const [i, char] of [...'R = 1.2 Ω'].entries())
      expect((widths.get(glyphs[i])! / 1000) * 10, char).toBeCloseTo(textWidth(char, 10), 3);
    const bold = entry(file, body, 'F2');
    const boldMap = toUnicodeMapOf(entry(file, bold.body, 'ToUnicode').stream!.toString('latin1'));
    expect(new Set(boldMap.values())).toEqual(new Set([...'µs ≥0.3']));
  });

  it('pdfOf with the regular face alone draws bold text as that face filled and stroked, embedding one face', async () => {
    const file = readPdf(await pdfOf(drawing, { fonts: { regular: REGULAR } }));
    const [{ content }] = pagesOf(file);
    expect(text(await pdfOf(drawing, { fonts: { regular: REGULAR } }))).not.toContain('DejaVuSans-Bold');
    // The 9 px bold run: render mode 2 (fill, then stroke) at 0.065 em in its own colour, inside q … Q.
    expect(content).toMatch(
      /q 0\.302 0\.302 0\.302 RG 0\.585 w 1 j 2 Tr\nBT \/F1 9 Tf 0\.302 0\.302 0\.302 rg [-\d. ]+ Tm <[0-9A-F]+> Tj ET\nQ/,
    );
    // The regular runs are filled only.
    expect(content.match(/ Tr\b/g)).toHaveLength(1);
    expect(content.match(/BT \/F1 /g)).toHaveLength(3);
  });

  it('pdfOf falls back to Helvetica in WinAnsi, symbols spelled out, when no face can be embedded', async () => {
    // In a browser with no faces passed, Node's font folder is not read.
    vi.stubGlobal('window', {});
    const pdf = text(await pdfOf(drawing));
    expect(pdf).not.toContain('/FontFile2');
    expect(pdf).toContain('/BaseFont /Helvetica /Encoding /WinAnsiEncoding');
    expect(pdf).toContain('/BaseFont /Helvetica-Bold /Encoding /WinAnsiEncoding');
    const [{ content }] = pagesOf(readPdf(await pdfOf(drawing)));
    expect(content).toContain('(R = 1.2 Ohm) Tj');
    expect(content).toContain('(\\265s >= 0.3) Tj');
  });
});

describe('pdfOfPages', () => {
  it('pdfOfPages prints one page per entry, each with its placements and text items', async () => {
    const items: Primitive[] = [
      { type: 'text', role: 'page-text', x: 48, y: 60, text: 'Contents', size: 15, anchor: 'start', fill: '#1a1a1a' },
      { type: 'path', role: 'page-rule', d: 'M48,700L564,700', stroke: '#9a9a9a', strokeWidth: 0.5, fill: 'none' },
    ];
    const page = [{ items }, { drawing, x: 36, y: 100, width: 480, height: 240 }];
    const bytes = await pdfOfPages([page, page, page], { paper: 'a4', orientation: 'portrait', date: '2026-12-02' });
    const pdf = text(bytes);
    expect(pdf.match(/\/Type \/Page\b(?!s)/g)).toHaveLength(3);
    expect(pdf).toContain('/CreationDate (D:20261202000000Z)');
    expect(pdf).not.toContain('/Title');
    const pages = pagesOf(readPdf(bytes));
    expect(pages).toHaveLength(3);
    const [, height] = pagePoints('a4', 'portrait');
    // Text items in points from the top-left corner; the drawing scaled 2.4 into its box.
    expect(pages[0].content.startsWith(`q\n1 0 0 -1 0 ${height} cm\n4 M\nBT /F1 15 Tf`)).toBe(true);
    expect(pages[0].content).toContain(`2.4 0 0 -2.4 36 ${Number((height - 100).toFixed(3))} cm`);
  });
});

// Accepts a file, a page's content and a font's resource name; the widths its CIDFont's /W array gives.
function widthsOfFont(file: PdfFile, content: string, name: string): Map<number, number> {
  expect(content).toContain(`/${name} `);
  const page = pagesOf(file)[0].body;
  const type0 = entry(file, page, name);
  const cidFont = resolve(file, /\/DescendantFonts \[(\d+ 0 R)\]/.exec(type0.body)![1]);
  return widthsOf(/\/W (\[.*\])\s*>>/.exec(cidFont.body)![1]);
}

// Accepts TrueType bytes and a glyph id; its advance width in font units, read from hhea and hmtx
// (OpenType spec, "hmtx": glyphs past numberOfHMetrics repeat the last advance).
function advanceOf(ttf: Buffer, glyph: number): number {
  const table = (tag: string) => {
    for (let i = 0; i < ttf.readUInt16BE(4); i++)
      if (ttf.toString('latin1', 12 + 16 * i, 16 + 16 * i) === tag) return ttf.readUInt32BE(20 + 16 * i);
    throw new Error(`no ${tag} table`);
  };
  const metrics = ttf.readUInt16BE(table('hhea') + 34);
  return ttf.readUInt16BE(table('hmtx') + 4 * Math.min(glyph, metrics - 1));
}
