import type { jsPDF as JsPdf } from 'jspdf';
import type {} from 'svg2pdf.js';
import { textWidth } from './textWidth.ts';

/** Options of {@link pdfOf}. */
export interface PdfOptions {
  /** Paper, printed landscape. @default 'letter' */
  paper?: 'letter' | 'a4';
  /** Clear margin on every side, in points (1/72 in). @default 36 */
  margin?: number;
  /**
   * DejaVu Sans regular and bold TTF bytes to embed, so "Ω", "µ" and "≥" print. In Node they are
   * read from `/usr/share/fonts/truetype/dejavu/` when omitted; in the browser pass them (e.g. fetched
   * from the app's assets), or the text falls back to Helvetica, which lacks those glyphs.
   */
  fonts?: { regular: Uint8Array; bold?: Uint8Array };
}

/** Paper sizes in points, landscape: width × height. */
export const PAPER_POINTS = { letter: [792, 612], a4: [841.89, 595.28] } as const;

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
  const { paper = 'letter', margin = 36 } = options;
  if (paper !== 'letter' && paper !== 'a4')
    throw new RangeError(`options.paper: expected "letter" or "a4", got "${paper}"`);
  if (!(Number.isFinite(margin) && margin >= 0 && margin < 200))
    throw new RangeError(`options.margin: expected points from 0 to 200, got "${margin}"`);
  const inBrowser = typeof window !== 'undefined' && typeof document !== 'undefined' && !isJsdom();
  return inBrowser ? printInBrowser(svg, paper, margin, options.fonts) : printInNode(svg, paper, margin, options.fonts);
}

// Accepts an SVG string; prints it with the page's DOM.
async function printInBrowser(
  svg: string,
  paper: 'letter' | 'a4',
  margin: number,
  fonts: PdfOptions['fonts'],
): Promise<Uint8Array> {
  const { jsPDF } = await import('jspdf');
  await import('svg2pdf.js');
  const element = new DOMParser().parseFromString(svg, 'image/svg+xml').documentElement as unknown as SVGSVGElement;
  // Kept out of sight but in the document, so styles and text measurement work.
  const holder = document.createElement('div');
  holder.style.cssText = 'position:absolute;left:-10000px;top:0;visibility:hidden';
  holder.appendChild(document.importNode(element, true));
  document.body.appendChild(holder);
  try {
    return await print(jsPDF, holder.firstElementChild as SVGSVGElement, paper, margin, fonts);
  } finally {
    holder.remove();
  }
}

// Accepts an SVG string; prints it in Node with a jsdom window installed as the global DOM for the call.
async function printInNode(
  svg: string,
  paper: 'letter' | 'a4',
  margin: number,
  fonts: PdfOptions['fonts'],
): Promise<Uint8Array> {
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
    const element = new dom.window.DOMParser().parseFromString(svg, 'image/svg+xml').documentElement;
    dom.window.document.body.appendChild(element);
    return await print(jsPDF, element as unknown as SVGSVGElement, paper, margin, faces);
  } finally {
    restore();
    dom.window.close();
  }
}

// Accepts the jsPDF class and an SVG element in a document; the PDF bytes.
async function print(
  jsPDF: typeof JsPdf,
  element: SVGSVGElement,
  paper: 'letter' | 'a4',
  margin: number,
  fonts: PdfOptions['fonts'],
): Promise<Uint8Array> {
  const [pageWidth, pageHeight] = PAPER_POINTS[paper];
  const doc = new jsPDF({ orientation: 'landscape', unit: 'pt', format: paper, compress: true });
  if (fonts) {
    doc.addFileToVFS('DejaVuSans.ttf', base64Of(fonts.regular));
    doc.addFont('DejaVuSans.ttf', 'DejaVu Sans', 'normal');
    doc.addFileToVFS('DejaVuSans-Bold.ttf', base64Of(fonts.bold ?? fonts.regular));
    doc.addFont('DejaVuSans-Bold.ttf', 'DejaVu Sans', 'bold');
    doc.setFont('DejaVu Sans', 'normal');
  }
  const width = Number(element.getAttribute('width')) || 960;
  const height = Number(element.getAttribute('height')) || 720;
  const fit = Math.min((pageWidth - 2 * margin) / width, (pageHeight - 2 * margin) / height);
  const [w, h] = [width * fit, height * fit];
  await doc.svg(element, { x: (pageWidth - w) / 2, y: (pageHeight - h) / 2, width: w, height: h });
  return new Uint8Array(doc.output('arraybuffer'));
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
