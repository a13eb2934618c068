import { describe, it, expect } from 'vitest';
import { EXPORT_PAPERS, exportPageOf, sizeOfSvg } from '../../../src/app/lib/exports.ts';
import { PAPER_POINTS } from '../../../src/plot/pdf.ts';

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
});
