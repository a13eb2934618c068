/**
 * Stands in for parts of the PDF library the workbench never calls — HTML rendering, raster SVG and
 * PNG decoding (html2canvas, dompurify, canvg, fast-png): sheets go to PDF as vector paths through
 * svg2pdf.js and carry no images — so the build does not ship them. Calling into it says so plainly.
 */
function absent(): never {
  throw new Error('this export path is not part of the workbench: sheets are written to PDF as vectors');
}

/** In place of html2canvas (HTML to canvas). @example absent() // throws */
export default absent;
/** In place of dompurify's `sanitize`. */
export const sanitize = absent;
/** In place of canvg's `Canvg` (raster SVG). */
export const Canvg = { from: absent, fromString: absent };
/** In place of fast-png's `decode` (PNG images in a PDF). */
export const decode = absent;
