import type { TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { truncateText, wrapText } from '../textWidth.ts';

/** How the caution line is set: small, muted, at most three lines. */
export const cautionDefaults = {
  /** × the sheet's font size */
  scale: 0.85,
  maxLines: 3,
  lineHeight: 1.25,
} as const;

/** Options of the caution mark: the top-left of its first line's box and the width it may use. */
export interface CautionOptions {
  x: number;
  y: number;
  width: number;
  fontSize: number;
}

/**
 * The caution every exported figure carries (DESIGN §9), wrapped to the sheet's width in at most
 * three lines; the last is cut with "…" if the text is longer still.
 * @example caution('Results are for review by a qualified engineer.', { x: 16, y: 700, width: 900, fontSize: 11 }).length // 1
 */
export function caution(text: string, options: CautionOptions): TextItem[] {
  const { x, y, width, fontSize } = options;
  const size = fontSize * cautionDefaults.scale;
  const lines = cautionWrap(text, width, size);
  return lines.map((line, i) => ({
    type: 'text',
    role: 'caution',
    x,
    y: y + size * 0.93 + i * size * cautionDefaults.lineHeight,
    text: line,
    size,
    anchor: 'start',
    fill: SHEET_COLOURS.mutedText,
  }));
}

/**
 * The height in px the caution takes at this width, so the sheet can leave room for it.
 * @example cautionHeight('Results are for review by a qualified engineer.', 900, 11) // ≈ 11.7
 */
export function cautionHeight(text: string, width: number, fontSize: number): number {
  const size = fontSize * cautionDefaults.scale;
  return cautionWrap(text, width, size).length * size * cautionDefaults.lineHeight;
}

// Accepts the caution and the line width; its lines, at most `maxLines`, the last cut if needed.
function cautionWrap(text: string, width: number, size: number): string[] {
  const lines = wrapText(text, width, size);
  const { maxLines } = cautionDefaults;
  if (lines.length <= maxLines) return lines;
  const kept = lines.slice(0, maxLines);
  kept[maxLines - 1] = truncateText(`${kept[maxLines - 1]} ${lines[maxLines]}`, width, size);
  return kept;
}
