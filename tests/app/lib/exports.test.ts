import { readFileSync } from 'node:fs';
import { describe, it, expect, vi } from 'vitest';
import { downloadBlob } from '../../../src/app/lib/download.ts';
import { downloadPdf, EXPORT_PAPERS, exportPageOf, sizeOfSvg } from '../../../src/app/lib/exports.ts';
import { PAPER_POINTS, pagePoints } from '../../../src/plot/pdf.ts';
import { sheetOf } from '../../../src/plot/sheet.ts';
import { fixtureInput } from '../../plot/fixtures.ts';
import { pagesOf, readPdf, textRunsOf } from '../../plot/pdf/pdfReader.ts';

// The face the workbench ships, in place of fetching it; the download caught instead of clicked.
const FONTS = new URL('../../../src/app/assets/fonts/', import.meta.url);
vi.mock('../../../src/app/lib/pdfFonts.ts', () => ({
  loadPdfFonts: async () => ({ regular: readFileSync(new URL('DejaVuSans.ttf', FONTS)) }),
}));
vi.mock('../../../src/app/lib/download.ts', () => ({ downloadBlob: vi.fn() }));

describe('exports', () => {
  it('has the expected defaults', () => {
    // Width and height win over a viewBox when both are given.
    expect(sizeOfSvg('<svg width="960" height="720" viewBox="0 0 10 10">')).toEqual({ width: 960, height: 720 });
  });

  it('sizeOfSvg() reads the size an SVG declares, or refuses naming what it got', () => {
    expect(sizeOfSvg('<svg xmlns="http://www.w3.org/2000/svg" width="960" height="720">')).toEqual({
      width: 960,
      height: 720,
    });
    expect(sizeOfSvg('<svg viewBox="0 0 800 600">')).toEqual({ width: 800, height: 600 });
    expect(() => sizeOfSvg('<svg>')).toThrow(/^svg: expected a width and height or a viewBox, got "<svg>"$/);
  });

  it("exportPageOf() gives the command line's default page when no paper is chosen: Letter, a sheet landscape, the report portrait", () => {
    // `discern plot --out x.pdf` prints Letter landscape; `discern report` Letter portrait.
    expect(exportPageOf('pdf')).toEqual({ paper: 'letter', orientation: 'landscape' });
    expect(exportPageOf('report-pdf')).toEqual({ paper: 'letter', orientation: 'portrait' });
    expect(exportPageOf('report-html')).toEqual({ paper: 'letter', orientation: 'portrait' });
  });

  it('exportPageOf() keeps the chosen paper, and the usual orientation unless one is chosen', () => {
    expect(exportPageOf({ kind: 'pdf', paper: 'a3' })).toEqual({ paper: 'a3', orientation: 'landscape' });
    expect(exportPageOf({ kind: 'report-pdf', paper: 'tabloid' })).toEqual({
      paper: 'tabloid',
      orientation: 'portrait',
    });
    expect(exportPageOf({ kind: 'pdf', paper: 'a4', orientation: 'portrait' })).toEqual({
      paper: 'a4',
      orientation: 'portrait',
    });
    // The menu offers every paper the PDF writer prints on, once each.
    expect(EXPORT_PAPERS.map((choice) => choice.paper).sort()).toEqual(Object.keys(PAPER_POINTS).sort());
  });

  it('downloadPdf() prints the sheet it is given on the chosen page, with the shipped faces, as application/pdf', async () => {
    const sheet = sheetOf(fixtureInput({ notes: 'Earth fault path 1.2 Ω' }));
    await downloadPdf('sheet.pdf', sheet, { paper: 'a3', orientation: 'portrait' });
    const [name, blob] = vi.mocked(downloadBlob).mock.calls[0];
    expect(name).toBe('sheet.pdf');
    expect(blob.type).toBe('application/pdf');
    const file = readPdf(new Uint8Array(await blob.arrayBuffer()));
    const [page] = pagesOf(file);
    const [width, height] = pagePoints('a3', 'portrait');
    expect(page.body).toContain(`/MediaBox [0 0 ${width} ${height}]`);
    expect(textRunsOf(file, page).join(' ')).toContain('Earth fault path 1.2 Ω');
  });
});
