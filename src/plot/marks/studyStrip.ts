import type { Primitive, TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { textWidth, truncateText, wrapText } from '../textWidth.ts';

/** How the study strip is set: sizes relative to the sheet's font size, spacing in px. */
export const studyStripDefaults = {
  /** × font size: the sheet's title */
  titleScale: 1.3,
  /** × font size: details and caution */
  detailScale: 0.88,
  lineHeight: 1.3,
  /** px: the dark bar down the strip's left edge */
  barWidth: 5,
  /** px between the bar and the text */
  indent: 10,
  /** Lines of notes kept; more are summarised with "…". */
  noteLines: 2,
  /** Lines of the title and of the study's details kept, so that the longest fields leave the plot its room. */
  titleLines: 2,
  detailLines: 2,
} as const;

/** What the strip prints; empty fields are left out. */
export interface StudyStripFields {
  title: string;
  study: string;
  view: string;
  site?: string;
  client?: string;
  /** The current revision mark ("B"). */
  revision?: string;
  date?: string;
  preparedBy?: string;
  checkedBy?: string;
  notes?: string;
  /** The caution every figure carries (the cautions in README.md); left out when empty (a page that prints it itself). */
  caution: string;
}

/** Options of the strip: its top-left corner, its width and the type size. */
export interface StudyStripOptions {
  x: number;
  y: number;
  width: number;
  fontSize: number;
}

/**
 * The study strip across the top of a sheet: a dark bar down its left edge, the sheet's title in
 * bold with revision and date set right, one wrapped line of study details (study · site · client ·
 * sheet · prepared and checked by), the view's notes and the caution in muted type, closed by a
 * rule. Returns its primitives and its height, so the plot starts below it.
 * @example studyStrip(fields, { x: 16, y: 16, width: 928, fontSize: 11 }).height
 */
export function studyStrip(
  fields: StudyStripFields,
  options: StudyStripOptions,
): { items: Primitive[]; height: number } {
  const { x, y, width, fontSize } = options;
  const {
    titleScale,
    detailScale,
    lineHeight,
    barWidth,
    indent,
    noteLines,
    titleLines: titleMost,
    detailLines,
  } = studyStripDefaults;
  const titleSize = fontSize * titleScale;
  const detailSize = fontSize * detailScale;
  const textX = x + barWidth + indent;
  const textWidthMax = width - barWidth - indent;
  const items: Primitive[] = [];

  // Line 1: title left, revision and date right (the title wraps if the two would meet). The stamp takes
  // at most two fifths of the line, so that a long revision mark cannot squeeze the title out: the date
  // stays whole and the mark is shortened.
  const date = fields.date ?? '';
  const dateRoom = date ? textWidth(`  ·  ${date}`, fontSize, 'bold') : 0;
  const mark = fields.revision
    ? truncateText(`Rev ${fields.revision}`, Math.max(0, textWidthMax * 0.4 - dateRoom), fontSize, 'bold')
    : '';
  const stamp = [mark, date].filter(Boolean).join('  ·  ');
  const stampWidth = stamp ? textWidth(stamp, fontSize, 'bold') + 16 : 0;
  const titleLines = keptLines(wrapText(fields.title, textWidthMax - stampWidth, titleSize, 'bold'), titleMost);
  let baseline = y + titleSize * 0.93;
  titleLines.forEach((line, i) =>
    items.push(
      text('sheet-title', textX, baseline + i * titleSize * lineHeight, line, titleSize, SHEET_COLOURS.text, 'bold'),
    ),
  );
  if (stamp)
    items.push({
      ...text('strip-stamp', x + width, baseline, stamp, fontSize, SHEET_COLOURS.text, 'bold'),
      anchor: 'end',
    });
  baseline += (titleLines.length - 1) * titleSize * lineHeight + detailSize * lineHeight + 2;

  // Then the study's details, the notes and the caution, each wrapped to the strip.
  const details = [
    fields.study,
    fields.site,
    fields.client ? `for ${fields.client}` : undefined,
    `sheet ${fields.view}`,
    fields.preparedBy ? `prepared by ${fields.preparedBy}` : undefined,
    fields.checkedBy ? `checked by ${fields.checkedBy}` : undefined,
  ]
    .filter((d): d is string => Boolean(d))
    .join(' · ');
  const blocks: [string, string[], string][] = [
    ['strip-details', keptLines(wrapText(details, textWidthMax, detailSize), detailLines), SHEET_COLOURS.text],
  ];
  if (fields.notes)
    blocks.push([
      'strip-notes',
      keptLines(wrapText(fields.notes, textWidthMax, detailSize), noteLines),
      SHEET_COLOURS.text,
    ]);
  if (fields.caution)
    blocks.push(['caution', wrapText(fields.caution, textWidthMax, detailSize), SHEET_COLOURS.mutedText]);
  for (const [role, lines, fill] of blocks)
    for (const line of lines) {
      items.push(text(role, textX, baseline, line, detailSize, fill));
      baseline += detailSize * lineHeight;
    }
  const bottom = baseline - detailSize * lineHeight + detailSize * 0.35 + 4;
  items.unshift({
    type: 'rect',
    role: 'strip-bar',
    x,
    y,
    width: barWidth,
    height: bottom - y,
    fill: SHEET_COLOURS.text,
    stroke: 'none',
  });
  items.push({
    type: 'path',
    role: 'strip-rule',
    d: pathOf([x, bottom, x + width, bottom]),
    stroke: SHEET_COLOURS.gridMajor,
    strokeWidth: 0.8,
    fill: 'none',
  });
  return { items, height: bottom - y };
}

// Accepts a role, a baseline position and text; one left-aligned line.
function text(
  role: string,
  x: number,
  y: number,
  value: string,
  size: number,
  fill: string,
  weight: 'normal' | 'bold' = 'normal',
): TextItem {
  return { type: 'text', role, x, y, text: value, size, anchor: 'start', fill, weight };
}

// Accepts wrapped lines and how many to keep; the first lines, the last kept ending "…" when more were cut.
function keptLines(lines: string[], most: number): string[] {
  return lines.length > most ? [...lines.slice(0, most - 1), `${lines[most - 1]} …`] : lines;
}
