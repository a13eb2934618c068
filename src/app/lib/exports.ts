import { downloadBlob } from './download.ts';

/** What the Export menu offers. */
export type ExportKind =
  'svg' | 'png' | 'pdf' | 'findings-md' | 'findings-csv' | 'probes-csv' | 'study-json' | 'report-html';

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
 * Writes a standalone SVG into a one-page PDF of the same proportions (jspdf + svg2pdf.js, loaded
 * only when a PDF is asked for so the workbench starts light).
 * @example await downloadPdf('sheet.pdf', svg)
 */
export async function downloadPdf(fileName: string, svg: string): Promise<void> {
  const [{ jsPDF }] = await Promise.all([import('jspdf'), import('svg2pdf.js')]);
  const { width, height } = sizeOfSvg(svg);
  const element = new DOMParser().parseFromString(svg, 'image/svg+xml').documentElement as unknown as SVGSVGElement;
  // svg2pdf measures text with getBBox, which needs the element in the document.
  const host = document.createElement('div');
  host.style.cssText = 'position:fixed;left:-10000px;top:0;visibility:hidden';
  host.append(element);
  document.body.append(host);
  try {
    const doc = new jsPDF({
      orientation: width >= height ? 'landscape' : 'portrait',
      unit: 'pt',
      format: [width, height],
    });
    await doc.svg(element, { x: 0, y: 0, width, height });
    downloadBlob(fileName, doc.output('blob'));
  } finally {
    host.remove();
  }
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
