import { Resvg } from '@resvg/resvg-js';
import { PNG_LARGEST_PIXELS, PNG_SCALE } from './sheetOptions.ts';

/** The DejaVu faces a PNG is set in (Debian `fonts-dejavu-core`); named so output never depends on what else is installed. */
export const DEJAVU_FONT_FILES = [
  '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf',
  '/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf',
] as const;

/** Options of {@link pngOf}. */
export interface PngOptions {
  /** Pixels per SVG unit: 2 gives a 1920 × 1440 image from a 960 × 720 sheet. @default 2 */
  scale?: number;
  /** TrueType files to set the text in. @default DEJAVU_FONT_FILES */
  fontFiles?: readonly string[];
}

/**
 * Renders an SVG string (a sheet from `svgOf`) to PNG bytes in Node with resvg, with system fonts
 * off and the DejaVu files named, so the same SVG gives the same pixels on every machine that has
 * those files. Throws a `RangeError` for a scale outside 0.1–10 or an image past `PNG_LARGEST_PIXELS`.
 * @example writeFileSync('sheet.png', pngOf(svgOf(sheet), { scale: 2 }))
 */
export function pngOf(svg: string, options: PngOptions = {}): Uint8Array {
  const { scale = 2, fontFiles = DEJAVU_FONT_FILES } = options;
  if (!(Number.isFinite(scale) && scale >= PNG_SCALE.smallest && scale <= PNG_SCALE.largest))
    throw new RangeError(
      `options.scale: expected a zoom from ${PNG_SCALE.smallest} to ${PNG_SCALE.largest}, got "${scale}"`,
    );
  const resvg = new Resvg(svg, {
    font: { loadSystemFonts: false, fontFiles: [...fontFiles], defaultFontFamily: 'DejaVu Sans' },
    fitTo: { mode: 'zoom', value: scale },
    background: '#ffffff',
  });
  const pixels = resvg.width * resvg.height * scale * scale;
  if (pixels > PNG_LARGEST_PIXELS)
    throw new RangeError(`options.scale: expected a PNG of at most ${PNG_LARGEST_PIXELS} pixels, got ${pixels}`);
  return new Uint8Array(resvg.render().asPng());
}
