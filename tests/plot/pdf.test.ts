import { describe, expect, it } from 'vitest';
import { PAPER_POINTS, pdfOf, pdfOfPages } from '../../src/plot/pdf.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import { svgOf } from '../../src/plot/svg.ts';
import { fixtureInput } from './fixtures.ts';

const svg = svgOf(sheetOf(fixtureInput({ notes: 'Impedance in Ω, currents in µs-rated steps, margin ≥ 0.2 s' })));
const text = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1');

describe('pdfOf', () => {
  it('has the expected defaults', async () => {
    expect(PAPER_POINTS.letter).toEqual([792, 612]);
    const pdf = text(await pdfOf(svg));
    expect(pdf.startsWith('%PDF')).toBe(true);
    // Landscape letter.
    expect(pdf).toMatch(/\/MediaBox \[0 0 792\.?\d* 612\.?\d*\]/);
  });

  it('pdfOf prints one landscape A4 page with DejaVu Sans embedded for Ω, µ and ≥', async () => {
    const pdf = text(await pdfOf(svg, { paper: 'a4' }));
    expect(pdf.startsWith('%PDF')).toBe(true);
    expect(pdf.match(/\/Type \/Page\b(?!s)/g)).toHaveLength(1);
    expect(pdf).toMatch(/\/MediaBox \[0 0 841\.8\d* 595\.2\d*\]/);
    expect(pdf).toContain('/FontFile2');
    expect(pdf).toMatch(/\/BaseFont \/[A-Z+]*DejaVu/);
    // The Node path leaves no DOM behind.
    expect(typeof (globalThis as { document?: unknown }).document).toBe('undefined');
  });

  it('pdfOf rejects an unknown paper and a bad margin', async () => {
    await expect(pdfOf(svg, { paper: 'legal' as 'a4' })).rejects.toThrow(
      /^options\.paper: expected "letter", "a4", "tabloid" or "a3", got "legal"$/,
    );
    await expect(pdfOf(svg, { margin: -1 })).rejects.toThrow(
      /^options\.margin: expected points from 0 to 200, got "-1"$/,
    );
  });

  it('pdfOf prints tabloid portrait when asked, and the same figure twice gives the same bytes', async () => {
    const pdf = text(await pdfOf(svg, { paper: 'tabloid', orientation: 'portrait' }));
    expect(pdf).toMatch(/\/MediaBox \[0 0 792\.?\d* 1224\.?\d*\]/);
    expect(pdf).toContain('/CreationDate (D:20000101');
    expect(Buffer.from(await pdfOf(svg, { paper: 'a3' })).equals(Buffer.from(await pdfOf(svg, { paper: 'a3' })))).toBe(
      true,
    );
  });

  it('pdfOfPages prints one page per entry, each with its placements', async () => {
    const page = [{ svg, x: 36, y: 36, width: 480, height: 360 }];
    const pdf = text(
      await pdfOfPages([page, page, page], { paper: 'a4', orientation: 'portrait', date: '2026-12-02' }),
    );
    expect(pdf.match(/\/Type \/Page\b(?!s)/g)).toHaveLength(3);
    expect(pdf).toContain('/CreationDate (D:20261202');
  });
});
