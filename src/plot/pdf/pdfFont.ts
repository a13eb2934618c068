import type { PdfWriter } from './pdfWriter.ts';

/**
 * A font as the page content uses it: `encode` turns text into the operand of a `Tj` and measures it,
 * `reference` gives the font's object number (reserved at first use), and `write` puts the font's
 * objects in the file once every page has been drawn, so an embedded face can keep only the glyphs used.
 */
export interface PdfFont {
  /** The font's name in a page's `/Font` resources, e.g. `F1`. */
  name: string;
  /** The string operand for `Tj` and the text's advance width in ems (at size 1). */
  encode(text: string): { operand: string; advance: number };
  /** The font dictionary's object number, reserved on the first call. */
  reference(writer: PdfWriter): number;
  /** Writes the font's objects; does nothing when the font was never referenced. */
  write(writer: PdfWriter): void;
}
