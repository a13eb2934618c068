import type { jsPDF as JsPdf } from 'jspdf';
import type {} from 'svg2pdf.js';
import type { Primitive } from './geometry.ts';
import { textWidth } from './textWidth.ts';

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
   * from the app's assets), or the text falls back to Helvetica, which lacks those glyphs.
   */
  fonts?: { regular: Uint8Array; bold?: Uint8Array };
  /**
   * The document's creation date, written into the PDF so that the same input gives the same bytes.
   * @default '2000-01-01T00:00:00Z' (a fixed date: the writer reads no clock)
   */
  date?: string;
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

/**
 * One thing on a page of a multi-page PDF, in points from the page's top-left corner: an SVG placed in
 * a box, or plain text and straight rules written directly (much faster than through SVG, and the
 * same glyphs), as a report's text pages are.
 */
export type PageContent = PagePlacement | { items: Primitive[] };

/** One SVG placed on a page of a multi-page PDF, in points from the page's top-left corner. */
export interface PagePlacement {
  svg: string;
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Where Node reads the embedded faces from when `fonts` is not given. */
const NODE_FONT_DIR = '/usr/share/fonts/truetype/dejavu/';

/**
 * Prints an SVG sheet to a one-page landscape PDF with jspdf and svg2pdf.js, scaled to fit inside
 * the margins and centred, with DejaVu Sans embedded. The same function runs in the browser (the
 * page's own DOM parses the SVG) and in Node (a jsdom window stands in for it during the call, with
 * text measured by the sheet's own DejaVu widths since jsdom does no layout).
 * @example writeFileSync('sheet.pdf', await pdfOf(svgOf(sheet), { paper: 'a4' }))
 */
export async function pdfOf(svg: string, options: PdfOptions = {}): Promise<Uint8Array> {
  const { paper = 'letter', margin = 36, orientation = 'landscape' } = options;
  checkOptions(paper, margin, orientation);
  const [pageWidth, pageHeight] = pagePoints(paper, orientation);
  const size = /<svg[^>]*?\swidth="([\d.]+)"[^>]*?\sheight="([\d.]+)"/.exec(svg);
  const [width, height] = [Number(size?.[1]) || 960, Number(size?.[2]) || 720];
  const fit = Math.min((pageWidth - 2 * margin) / width, (pageHeight - 2 * margin) / height);
  const [w, h] = [width * fit, height * fit];
  return pdfOfPages([[{ svg, x: (pageWidth - w) / 2, y: (pageHeight - h) / 2, width: w, height: h }]], options);
}

/**
 * Prints pages of placed SVGs to one PDF on one paper size, with DejaVu Sans embedded; each page is a
 * list of placements drawn in order. Deterministic: the creation date comes from the options and the
 * file identifier from the content, so the same pages give the same bytes.
 * @example await pdfOfPages([[{ svg, x: 0, y: 0, width: 612, height: 792 }]], { paper: 'letter', orientation: 'portrait' })
 */
export async function pdfOfPages(pages: PageContent[][], options: PdfOptions = {}): Promise<Uint8Array> {
  const { paper = 'letter', margin = 36, orientation = 'landscape' } = options;
  checkOptions(paper, margin, orientation);
  const job: PrintJob = { pages, paper, orientation, date: options.date ?? '2000-01-01T00:00:00Z' };
  const inBrowser = typeof window !== 'undefined' && typeof document !== 'undefined' && !isJsdom();
  return inBrowser ? printInBrowser(job, options.fonts) : printInNode(job, options.fonts);
}

/** What one call prints. */
interface PrintJob {
  pages: PageContent[][];
  paper: Paper;
  orientation: 'landscape' | 'portrait';
  date: string;
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

// Accepts a print job; prints it with the page's DOM.
async function printInBrowser(job: PrintJob, fonts: PdfOptions['fonts']): Promise<Uint8Array> {
  const { jsPDF } = await import('jspdf');
  await import('svg2pdf.js');
  // Kept out of sight but in the document, so styles and text measurement work.
  const holder = document.createElement('div');
  holder.style.cssText = 'position:absolute;left:-10000px;top:0;visibility:hidden';
  document.body.appendChild(holder);
  try {
    const parse = (svg: string) => {
      const element = new DOMParser().parseFromString(svg, 'image/svg+xml').documentElement;
      return holder.appendChild(document.importNode(element, true)) as unknown as SVGSVGElement;
    };
    return await print(jsPDF, job, parse, fonts);
  } finally {
    holder.remove();
  }
}

// Accepts a print job; prints it in Node with a jsdom window installed as the global DOM for the call.
async function printInNode(job: PrintJob, fonts: PdfOptions['fonts']): Promise<Uint8Array> {
  // Module names in variables keep bundlers from pulling Node-only code into the browser build.
  const jsdomName = 'jsdom';
  const fsName = 'node:fs';
  const { JSDOM, VirtualConsole } = (await import(/* @vite-ignore */ jsdomName)) as typeof import('jsdom');
  const faces = fonts ?? (await readNodeFonts(fsName));
  const dom = new JSDOM('<!DOCTYPE html><html><body></body></html>', { virtualConsole: new VirtualConsole() });
  const restore = installGlobals(dom.window as unknown as Window & typeof globalThis);
  try {
    const { jsPDF } = await import('jspdf');
    await import('svg2pdf.js/dist/svg2pdf.es.min.js');
    const parse = (svg: string) => {
      const element = new dom.window.DOMParser().parseFromString(svg, 'image/svg+xml').documentElement;
      return dom.window.document.body.appendChild(element) as unknown as SVGSVGElement;
    };
    return await print(jsPDF, job, parse, faces);
  } finally {
    restore();
    dom.window.close();
  }
}

// Accepts the jsPDF class, a job and a way to put an SVG string into a document; the PDF bytes.
async function print(
  jsPDF: typeof JsPdf,
  job: PrintJob,
  parse: (svg: string) => SVGSVGElement,
  fonts: PdfOptions['fonts'],
): Promise<Uint8Array> {
  const doc = new jsPDF({ orientation: job.orientation, unit: 'pt', format: job.paper, compress: true });
  doc.setCreationDate(new Date(job.date));
  doc.setFileId(fileIdOf(job));
  if (fonts) {
    doc.addFileToVFS('DejaVuSans.ttf', base64Of(fonts.regular));
    doc.addFont('DejaVuSans.ttf', 'DejaVu Sans', 'normal');
    doc.addFileToVFS('DejaVuSans-Bold.ttf', base64Of(fonts.bold ?? fonts.regular));
    doc.addFont('DejaVuSans-Bold.ttf', 'DejaVu Sans', 'bold');
    doc.setFont('DejaVu Sans', 'normal');
  }
  for (const [index, page] of job.pages.entries()) {
    if (index > 0) doc.addPage(job.paper, job.orientation);
    for (const placement of page) {
      if ('items' in placement) {
        writeItems(doc, placement.items, fonts !== undefined);
        continue;
      }
      const element = parse(placement.svg);
      await doc.svg(element, { x: placement.x, y: placement.y, width: placement.width, height: placement.height });
      element.remove();
    }
  }
  return new Uint8Array(doc.output('arraybuffer'));
}

// Accepts a document and primitives in points; writes text and straight rules directly (other shapes are not used on text pages).
function writeItems(doc: JsPdf, items: Primitive[], embedded: boolean): void {
  for (const item of items) {
    if (item.type === 'text') {
      doc.setFont(embedded ? 'DejaVu Sans' : 'helvetica', item.weight === 'bold' ? 'bold' : 'normal');
      doc.setFontSize(item.size);
      doc.setTextColor(item.fill);
      const align = item.anchor === 'end' ? 'right' : item.anchor === 'middle' ? 'center' : 'left';
      doc.text(item.text, item.x, item.y, { align, baseline: 'alphabetic' });
    } else if (item.type === 'path' && item.stroke) {
      doc.setDrawColor(item.stroke);
      doc.setLineWidth(item.strokeWidth ?? 1);
      for (const [, x1, y1, x2, y2] of item.d.matchAll(/M(-?[\d.]+),(-?[\d.]+)L(-?[\d.]+),(-?[\d.]+)/g))
        doc.line(Number(x1), Number(y1), Number(x2), Number(y2));
    } else if (item.type === 'rect') {
      if (item.stroke) doc.setDrawColor(item.stroke);
      doc.rect(item.x, item.y, item.width, item.height, item.fill && item.fill !== 'none' ? 'FD' : 'S');
    }
  }
}

// Accepts a job; a 32-hex-digit identifier from its content (FNV-1a, four lanes), the same for the same job.
function fileIdOf(job: PrintJob): string {
  const lanes = [0x811c9dc5, 0x01000193, 0x9e3779b9, 0x85ebca6b];
  const contentOf = (p: PageContent) => ('items' in p ? JSON.stringify(p.items) : p.svg);
  const text = `${job.paper}|${job.orientation}|${job.date}|${job.pages.map((page) => page.map(contentOf).join('|')).join('#')}`;
  for (let i = 0; i < text.length; i++) {
    for (let lane = 0; lane < 4; lane++)
      lanes[lane] = Math.imul(lanes[lane] ^ (text.charCodeAt(i) + lane), 16777619) >>> 0;
  }
  return lanes
    .map((lane) => lane.toString(16).padStart(8, '0'))
    .join('')
    .toUpperCase();
}

// Accepts the window of a jsdom; puts its DOM classes on globalThis and returns a function that puts back what was there.
function installGlobals(window: Window & typeof globalThis): () => void {
  const names = [
    'window',
    'document',
    'navigator',
    'DOMParser',
    'Node',
    'Element',
    'SVGElement',
    'HTMLElement',
    'getComputedStyle',
    'XMLSerializer',
    'Image',
  ] as const;
  const saved = names.map((name) => [name, Object.getOwnPropertyDescriptor(globalThis, name)] as const);
  for (const name of names) {
    const value =
      name === 'window' ? window : name === 'getComputedStyle' ? window.getComputedStyle.bind(window) : window[name];
    Object.defineProperty(globalThis, name, { value, configurable: true, writable: true });
  }
  // jsdom does no layout: measure text with the sheet's DejaVu widths, which is also the face embedded.
  const proto = window.SVGElement.prototype as SVGElement & { getBBox?: () => DOMRect };
  const hadBBox = Object.getOwnPropertyDescriptor(proto, 'getBBox');
  proto.getBBox = function (this: SVGElement) {
    const size = Number.parseFloat(this.getAttribute('font-size') ?? '16') || 16;
    const bold = /bold|[6-9]00/.test(this.getAttribute('font-weight') ?? '');
    const width = textWidth(this.textContent ?? '', size, bold ? 'bold' : 'normal');
    return { x: 0, y: -size * 0.93, width, height: size * 1.17 } as DOMRect;
  };
  return () => {
    if (hadBBox) Object.defineProperty(proto, 'getBBox', hadBBox);
    else delete proto.getBBox;
    for (const [name, descriptor] of saved) {
      if (descriptor) Object.defineProperty(globalThis, name, descriptor);
      else delete (globalThis as Record<string, unknown>)[name];
    }
  };
}

// Accepts the name of Node's fs module; the DejaVu faces as bytes.
async function readNodeFonts(fsName: string): Promise<{ regular: Uint8Array; bold: Uint8Array }> {
  const { readFileSync } = (await import(/* @vite-ignore */ fsName)) as typeof import('node:fs');
  return {
    regular: readFileSync(`${NODE_FONT_DIR}DejaVuSans.ttf`),
    bold: readFileSync(`${NODE_FONT_DIR}DejaVuSans-Bold.ttf`),
  };
}

// Accepts bytes; their base64 text, without Buffer so it runs in the browser too.
function base64Of(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

// True inside a jsdom window (vitest's jsdom environment), which cannot lay out text for svg2pdf.
function isJsdom(): boolean {
  return typeof navigator !== 'undefined' && /jsdom/i.test(navigator.userAgent ?? '');
}
