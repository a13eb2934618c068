import type { Primitive, TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { truncateText, wrapText } from '../textWidth.ts';

/** How the title block is laid out. */
export const titleBlockDefaults = {
  /** px: the column of field names */
  nameWidth: 74,
  /** px inside the frame */
  padding: 6,
  lineHeight: 1.3,
  /** Lines of notes shown before they are cut with "…". */
  noteLines: 4,
} as const;

/** The fields of the title block, in the order they print; empty ones are left out. */
export interface TitleBlockFields {
  study: string;
  view: string;
  date?: string;
  preparedBy?: string;
  notes?: string;
}

/** Options of the title-block mark: where it sits (its bottom edge) and the type size. */
export interface TitleBlockOptions {
  x: number;
  /** px: the block's bottom edge; it grows upward to fit. */
  bottom: number;
  width: number;
  fontSize: number;
}

/**
 * The title block: a framed table of study, view, date, prepared by and notes (wrapped), anchored
 * at its bottom edge. Returns its primitives and its top edge so the legend can stop above it.
 * @example titleBlock({ study: 'Harrowmere Cold Store', view: 'Main' }, { x: 700, bottom: 690, width: 240, fontSize: 11 }).top
 */
export function titleBlock(fields: TitleBlockFields, options: TitleBlockOptions): { items: Primitive[]; top: number } {
  const { x, bottom, width, fontSize } = options;
  const { nameWidth, padding, lineHeight, noteLines } = titleBlockDefaults;
  const step = fontSize * lineHeight;
  const valueWidth = width - nameWidth - 2 * padding;
  const rows: [string, string[]][] = [
    ['Study', wrapText(fields.study, valueWidth, fontSize).slice(0, 2)],
    ['View', wrapText(fields.view, valueWidth, fontSize).slice(0, 2)],
  ];
  if (fields.date) rows.push(['Date', [truncateText(fields.date, valueWidth, fontSize)]]);
  if (fields.preparedBy) rows.push(['Prepared by', wrapText(fields.preparedBy, valueWidth, fontSize).slice(0, 2)]);
  if (fields.notes)
    rows.push(['Notes', clampLines(wrapText(fields.notes, valueWidth, fontSize), noteLines, valueWidth, fontSize)]);
  const height = rows.reduce((h, [, lines]) => h + Math.max(1, lines.length) * step, 0) + 2 * padding;
  const top = bottom - height;
  const items: Primitive[] = [
    {
      type: 'rect',
      role: 'title-block',
      x,
      y: top,
      width,
      height,
      fill: SHEET_COLOURS.panel,
      stroke: SHEET_COLOURS.frame,
      strokeWidth: 0.9,
    },
  ];
  let y = top + padding;
  const separators: string[] = [];
  rows.forEach(([name, lines], i) => {
    if (i > 0) separators.push(pathOf([x, y - padding / 2 + 2, x + width, y - padding / 2 + 2]));
    items.push(line('title-block-name', x + padding, y + fontSize, name, fontSize * 0.9, SHEET_COLOURS.mutedText));
    lines.forEach((text, k) =>
      items.push(
        line(
          `title-block-${name.toLowerCase().replace(' ', '-')}`,
          x + padding + nameWidth,
          y + fontSize + k * step,
          text,
          fontSize,
        ),
      ),
    );
    y += Math.max(1, lines.length) * step;
  });
  items.push({
    type: 'path',
    role: 'title-block-rules',
    d: separators.join(''),
    stroke: SHEET_COLOURS.gridMajor,
    strokeWidth: 0.6,
    fill: 'none',
  });
  return { items, top };
}

/**
 * The sheet's title, bold, above the plot; cut with "…" if wider than `width`.
 * @example sheetTitle('Main to MCC feeder', { x: 70, y: 24, width: 600, fontSize: 11 }).text
 */
export function sheetTitle(
  title: string,
  options: { x: number; y: number; width: number; fontSize: number },
): TextItem {
  const size = options.fontSize * 1.35;
  return {
    type: 'text',
    role: 'sheet-title',
    x: options.x,
    y: options.y,
    text: truncateText(title, options.width, size, 'bold'),
    size,
    anchor: 'start',
    fill: SHEET_COLOURS.text,
    weight: 'bold',
  };
}

// Accepts wrapped lines; at most `count` of them, the last cut with "…" when some were dropped.
function clampLines(lines: string[], count: number, width: number, size: number): string[] {
  if (lines.length <= count) return lines;
  const kept = lines.slice(0, count);
  kept[count - 1] = truncateText(`${kept[count - 1]} …`, width, size);
  return kept;
}

// Accepts a role, a baseline position and text; one left-aligned line.
function line(
  role: string,
  x: number,
  y: number,
  text: string,
  size: number,
  fill: string = SHEET_COLOURS.text,
): TextItem {
  return { type: 'text', role, x, y, text, size, anchor: 'start', fill };
}
