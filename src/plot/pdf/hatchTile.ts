import type { HatchPattern } from '../geometry.ts';
import { type Matrix, matrixOperands, multiplyMatrix } from './matrix.ts';
import { rgbOf } from './paintOf.ts';
import { pdfNumber } from './pdfSyntax.ts';
import type { PdfWriter } from './pdfWriter.ts';

/**
 * Writes a sheet's hatch as a coloured tiling pattern (ISO 32000-1 §8.7.3.1), drawn as `svg.ts`
 * draws it: a square tile `spacing` wide holding one line through its middle (and a crossing one when
 * `cross`), turned by `angle` degrees. `placement` maps the drawing's pixels to the page's default
 * space, because a pattern's matrix is taken from there and not from the content's current transform.
 * @example writeHatchTile(writer, hatch, [1, 0, 0, -1, 0, 792]) // the pattern's object number
 */
export function writeHatchTile(writer: PdfWriter, hatch: HatchPattern, placement: Matrix): number {
  const id = writer.reserve();
  const s = hatch.spacing;
  const half = pdfNumber(s / 2);
  const size = pdfNumber(s);
  const colour = rgbOf(hatch.colour);
  const lines = [`${half} 0 m ${half} ${size} l`, ...(hatch.cross ? [`0 ${half} m ${size} ${half} l`] : [])];
  const content = colour ? `${colour} RG ${pdfNumber(hatch.strokeWidth)} w ${lines.join(' ')} S` : '';
  const radians = (hatch.angle * Math.PI) / 180;
  // SVG's rotate(angle) in the drawing's y-down pixels, then the drawing's placement on the page.
  const turn: Matrix = [Math.cos(radians), Math.sin(radians), -Math.sin(radians), Math.cos(radians), 0, 0];
  const dictionary = `/Type /Pattern /PatternType 1 /PaintType 1 /TilingType 1 /BBox [0 0 ${size} ${size}] /XStep ${size} /YStep ${size} /Resources << >> /Matrix [${matrixOperands(multiplyMatrix(turn, placement))}]`;
  writer.stream(id, content, dictionary);
  return id;
}
