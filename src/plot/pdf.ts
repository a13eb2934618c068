import { createEmbeddedFont } from './pdf/embeddedFont.ts';
import { pageContentOf, type PageContent, type PagePlacement } from './pdf/pageContent.ts';
import type { PdfFont } from './pdf/pdfFont.ts';
import { pdfNumber } from './pdf/pdfSyntax.ts';
import { createPdfWriter, infoDictionary } from './pdf/pdfWriter.ts';
import { createStandardFont } from './pdf/standardFont.ts';
import type { Drawing } from './svg.ts';

export type { PageContent, PagePlacement };

/** Paper sizes a figure or report prints on. */
export type Paper = 'letter' | 'a4' | 'tabloid' | 'a3';

/** Options of {@link pdfOf}. */
export interface PdfOptions {
  /** Paper. @default 'letter' */
  paper?: Paper;
  /** @default 'landscape' for a figure */
  orientation?: 'landscape' | 'portrait';
  /** Clear margin on every side, in points (1/72 in). @default 36 */
  margin?: number;
  /**
   * DejaVu Sans regular and bold TTF bytes to embed, so "Ω", "µ" and "≥" print. In Node they are
   * read from `/usr/share/fonts/truetype/dejavu/` when omitted; in the browser pass them (e.g. fetched
   * from the app's assets), or the text falls back to Helvetica, which lacks those glyphs (they are
   * spelled out: "Ohm", ">="). Without a bold face, bold text is the regular face filled and stroked.
   */
  fonts?: { regular: Uint8Array; bold?: Uint8Array };
  /**
   * The document's creation date, written into the PDF so that the same input gives the same bytes.
   * @default '2000-01-01T00:00:00Z' (a fixed date: the writer reads no clock)
   */
  date?: string;
  /** The document's title in its properties. @default the drawing's title for {@link pdfOf}, none for {@link pdfOfPages} */
  title?: string;
}

/** Paper sizes in points, landscape: width × height (ANSI and ISO 216 sizes). */
export const PAPER_POINTS = {
  letter: [792, 612],
  a4: [841.89, 595.28],
  tabloid: [1224, 792],
  a3: [1190.55, 841.89],
} as const;

/** The paper's width and height in points for an orientation. */
export function pagePoints(paper: Paper, orientation: 'landscape' | 'portrait'): [number, number] {
  const [long, short] = PAPER_POINTS[paper];
  return orientation === 'landscape' ? [long, short] : [short, long];
}

/** Where Node reads the embedded faces from when `fonts` is not given. */
const NODE_FONT_DIR = '/usr/share/fonts/truetype/dejavu/';

/**
 * Prints a drawing (a sheet, a one-line diagram) to a one-page PDF, landscape unless asked, scaled to
 * fit inside the margins and centred, with DejaVu Sans embedded. Vector paths and real text, written
 * straight from the drawing's primitives; the same code runs in Node and the browser.
 * @example writeFileSync('sheet.pdf', await pdfOf(sheetOf(input), { paper: 'a4' }))
 */
export async function pdfOf(drawing: Drawing, options: PdfOptions = {}): Promise<Uint8Array> {
  const { paper = 'letter', margin = 36, orientation = 'landscape' } = options;
  checkOptions(paper, margin, orientation);
  for (const side of ['width', 'height'] as const)
    if (!(drawing[side] > 0 && Number.isFinite(drawing[side])))
      throw new RangeError(`drawing.${side}: expected a size in px greater than 0, got "${drawing[side]}"`);
  const [pageWidth, pageHeight] = pagePoints(paper, orientation);
  const fit = Math.min((pageWidth - 2 * margin) / drawing.width, (pageHeight - 2 * margin) / drawing.height);
  const [w, h] = [drawing.width * fit, drawing.height * fit];
  const placement = { drawing, x: (pageWidth - w) / 2, y: (pageHeight - h) / 2, width: w, height: h };
  return pdfOfPages([[placement]], { title: drawing.title, ...options });
}

/**
 * Prints pages to one PDF on one paper size, DejaVu Sans embedded: each page is a list of drawings
 * placed in boxes and of primitives given in points (`{ items }`), drawn in order. Deterministic: the
 * creation date comes from the options and the file identifier from the content, so the same pages
 * give the same bytes.
 * @example await pdfOfPages([[{ drawing, x: 0, y: 0, width: 612, height: 792 }]], { paper: 'letter', orientation: 'portrait' })
 */
export async function pdfOfPages(pages: PageContent[][], options: PdfOptions = {}): Promise<Uint8Array> {
  const { paper = 'letter', margin = 36, orientation = 'landscape', date = '2000-01-01T00:00:00Z' } = options;
  checkOptions(paper, margin, orientation);
  const faces = options.fonts ?? (await readNodeFonts());
  const [pageWidth, pageHeight] = pagePoints(paper, orientation);
  const writer = createPdfWriter();
  const [catalog, pageTree, info] = [writer.reserve(), writer.reserve(), writer.reserve()];
  writer.object(info, infoDictionary({ date, title: options.title }));
  const fonts = fontsOf(faces);

  // Stage 1: each page's content and resources; fonts only note the glyphs used.
  const kids = pages.map((page) => {
    const { content, resources } = pageContentOf(page, { writer, fonts, pageHeight });
    const [pageId, contentId] = [writer.reserve(), writer.reserve()];
    writer.stream(contentId, content);
    writer.object(
      pageId,
      `<< /Type /Page /Parent ${pageTree} 0 R /MediaBox [0 0 ${pdfNumber(pageWidth)} ${pdfNumber(pageHeight)}] /Resources ${resources} /Contents ${contentId} 0 R >>`,
    );
    return pageId;
  });

  // Stage 2: the fonts, subset to what the pages drew, then the page tree and catalog.
  fonts.normal.write(writer);
  if (fonts.bold !== fonts.normal) fonts.bold.write(writer);
  writer.object(
    pageTree,
    `<< /Type /Pages /Kids [${kids.map((id) => `${id} 0 R`).join(' ')}] /Count ${kids.length} >>`,
  );
  writer.object(catalog, `<< /Type /Catalog /Pages ${pageTree} 0 R >>`);
  return writer.finish(catalog, info);
}

// Accepts the options; throws a one-line error naming the option when one is out of range.
function checkOptions(paper: string, margin: number, orientation: string): void {
  if (!(paper in PAPER_POINTS))
    throw new RangeError(`options.paper: expected "letter", "a4", "tabloid" or "a3", got "${paper}"`);
  if (orientation !== 'landscape' && orientation !== 'portrait')
    throw new RangeError(`options.orientation: expected "landscape" or "portrait", got "${orientation}"`);
  if (!(Number.isFinite(margin) && margin >= 0 && margin < 200))
    throw new RangeError(`options.margin: expected points from 0 to 200, got "${margin}"`);
}

// Accepts the faces to embed, if any; the regular and bold fonts the pages write with.
function fontsOf(faces: PdfOptions['fonts']): { normal: PdfFont; bold: PdfFont } {
  if (!faces) return { normal: createStandardFont('F1', 'normal'), bold: createStandardFont('F2', 'bold') };
  const normal = createEmbeddedFont(faces.regular, { name: 'F1', postScriptName: 'DejaVuSans' });
  const bold = faces.bold
    ? createEmbeddedFont(faces.bold, { name: 'F2', postScriptName: 'DejaVuSans-Bold', bold: true })
    : normal;
  return { normal, bold };
}

// The DejaVu faces from the system's font folder when running in Node; nothing in a browser or when they are missing.
async function readNodeFonts(): Promise<PdfOptions['fonts']> {
  const node = typeof process !== 'undefined' && typeof process.versions?.node === 'string';
  if (!node || typeof window !== 'undefined') return undefined;
  // A module name in a variable keeps bundlers from pulling Node's fs into the browser build.
  const fsName = 'node:fs';
  const { existsSync, readFileSync } = (await import(/* @vite-ignore */ fsName)) as typeof import('node:fs');
  const [regular, bold] = ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf'].map((name) => `${NODE_FONT_DIR}${name}`);
  if (!existsSync(regular)) return undefined;
  return { regular: readFileSync(regular), bold: existsSync(bold) ? readFileSync(bold) : undefined };
}
