import type { Paper } from '../../plot/pdf.ts';
import type { Drawing } from '../../plot/svg.ts';
import { downloadBlob } from './download.ts';
import { loadPdfFonts } from './pdfFonts.ts';

/** A kind of file the Export menu writes. */
export type ExportFormat =
  'svg' | 'png' | 'pdf' | 'findings-md' | 'findings-csv' | 'probes-csv' | 'study-json' | 'report-html' | 'report-pdf';

/**
 * What the Export menu asks for: a kind of file, or a printable one (the sheet's PDF, the study
 * report as PDF or print-ready HTML) with the paper it prints on. A printable kind asked for alone
 * prints on the command line's default page.
 */
export type ExportKind = ExportFormat | PagedExport;

/** A printable export with its page: `orientation` left out means the usual one for what is printed. */
export interface PagedExport {
  kind: 'pdf' | 'report-pdf' | 'report-html';
  paper: Paper;
  orientation?: Orientation;
}

/** Which way up a printed page is. */
export type Orientation = 'landscape' | 'portrait';

/** The page an export prints on: paper and orientation, as the command line's `--paper`/`--orientation`. */
export interface ExportPage {
  paper: Paper;
  orientation: Orientation;
}

/** The papers a printable export offers, with the label the menu shows (ANSI and ISO 216 sizes). */
export const EXPORT_PAPERS: readonly { paper: Paper; label: string }[] = [
  { paper: 'letter', label: 'Letter' },
  { paper: 'a4', label: 'A4' },
  { paper: 'tabloid', label: 'Tabloid 11×17' },
  { paper: 'a3', label: 'A3' },
];

/**
 * The page an export prints on, with the command line's defaults for what is left out: Letter,
 * landscape for a sheet (`discern plot`) and portrait for the study report (`discern report`).
 * @example exportPageOf({ kind: 'report-pdf', paper: 'a4' }) // { paper: 'a4', orientation: 'portrait' }
 */
export function exportPageOf(request: ExportKind): ExportPage {
  const kind = typeof request === 'string' ? request : request.kind;
  const usual: Orientation = kind.startsWith('report-') ? 'portrait' : 'landscape';
  if (typeof request === 'string') return { paper: 'letter', orientation: usual };
  return { paper: request.paper, orientation: request.orientation ?? usual };
}

/**
 * Downloads a sheet's standalone SVG (the plot layer's `svgOf`, so it matches the CLI's figure).
 * @example downloadSvg('harrowmere-V1.svg', svg)
 */
export function downloadSvg(fileName: string, svg: string): void {
  downloadBlob(fileName, new Blob([svg], { type: 'image/svg+xml' }));
}

/**
 * Rasterises a standalone SVG at `scale` × its own size through a canvas and downloads the PNG.
 * @example await downloadPng('sheet.png', svg, 2)
 */
export async function downloadPng(fileName: string, svg: string, scale = 2): Promise<void> {
  const { width, height } = sizeOfSvg(svg);
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.decoding = 'async';
    image.src = url;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('PNG export: expected a 2D canvas, got none');
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('PNG export: expected the canvas to encode, got nothing');
    downloadBlob(fileName, blob);
  } finally {
    URL.revokeObjectURL(url);
  }
}

/**
 * Prints a sheet (the drawing `svgOf` would write) to a one-page PDF on the chosen page with the plot
 * layer's `pdfOf` (the command line's writer, so the same paper gives the same page) and downloads it.
 * DejaVu Sans is embedded, so Ω, µ, ≥ and × print; the writer and the fonts load only when a PDF is
 * asked for.
 * @example await downloadPdf('sheet.pdf', sheet, { paper: 'a4', orientation: 'landscape' })
 */
export async function downloadPdf(fileName: string, drawing: Drawing, page: ExportPage): Promise<void> {
  const [{ pdfOf }, fonts] = await Promise.all([import('../../plot/pdf.ts'), loadPdfFonts()]);
  downloadBlob(fileName, pdfBlobOf(await pdfOf(drawing, { ...page, fonts })));
}

/**
 * Downloads a PDF written elsewhere (the study report, written in its worker).
 * @example downloadPdfBytes('study-report.pdf', written.bytes)
 */
export function downloadPdfBytes(fileName: string, bytes: Uint8Array): void {
  downloadBlob(fileName, pdfBlobOf(bytes));
}

// Accepts a PDF's bytes; a Blob of them with the PDF media type.
function pdfBlobOf(bytes: Uint8Array): Blob {
  return new Blob([bytes as Uint8Array<ArrayBuffer>], { type: 'application/pdf' });
}

/**
 * The pixel size an SVG string declares (`width`/`height`, else its `viewBox`).
 * @example sizeOfSvg('<svg width="800" height="600">') // { width: 800, height: 600 }
 */
export function sizeOfSvg(svg: string): { width: number; height: number } {
  const head = /<svg\b[^>]*>/.exec(svg)?.[0] ?? '';
  const width = Number(/\swidth="([\d.]+)"/.exec(head)?.[1]);
  const height = Number(/\sheight="([\d.]+)"/.exec(head)?.[1]);
  if (width > 0 && height > 0) return { width, height };
  const box = /viewBox="[\d.-]+[ ,]+[\d.-]+[ ,]+([\d.]+)[ ,]+([\d.]+)"/.exec(head);
  if (box) return { width: Number(box[1]), height: Number(box[2]) };
  throw new RangeError(`svg: expected a width and height or a viewBox, got "${head.slice(0, 60)}"`);
}
