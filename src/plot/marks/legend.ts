import type { Marker } from '../../engine/withstand/withstand.ts';
import type { Primitive } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { textWidth, wrapText } from '../textWidth.ts';
import { symbolPath } from './marker.ts';

/** How the legend is laid out. */
export const legendDefaults = {
  /** px: the sample drawn before each entry */
  swatchWidth: 26,
  /** px between the swatch and the text */
  swatchGap: 8,
  /** line height as a multiple of the font size */
  lineHeight: 1.25,
  /** px between entries */
  entryGap: 4,
} as const;

/** How an entry's sample is drawn: the same code as on the plot. */
export type LegendSwatch =
  | { kind: 'band'; colour: string; coincident: boolean; dash?: string }
  | { kind: 'line'; colour: string; dash?: string; width: number; round?: boolean }
  | { kind: 'hatch'; colour: string; patternId: string }
  | { kind: 'symbol'; colour: string; symbol: Marker['kind'] };

/** One legend entry, under a group heading ("Devices", "Fault current", …). */
export interface LegendEntry {
  group: string;
  text: string;
  swatch: LegendSwatch;
  dataId: string;
}

/** Options of the legend mark. */
export interface LegendOptions {
  /** Where the key starts (top-left, px) and how wide it may run. */
  box: { x: number; y: number; width: number };
  /** The most height it may take (px); entries beyond are counted in a closing line. @default Infinity */
  maxHeight?: number;
  /** px */
  fontSize: number;
  /** @default 'Not labelled on the plot:' */
  heading?: string;
}

/** The legend's drawing, how many entries fit, and the height used (px). */
export interface LegendGeometry {
  items: Primitive[];
  shown: number;
  height: number;
}

/**
 * The key under the plot, cut to what the plot could not label: a heading, then each entry (a
 * sample of its curve's code — fill and edges, dash, hatch or symbol — and its whole text) set
 * left to right and wrapped into rows across the width. Entries beyond `maxHeight` are counted in a
 * closing "+ n more curves not named in this key" line, worded to fit the width, never dropped unsaid.
 * No entries, no key (height 0).
 * @example legend(entries, { box, fontSize: 11 }).shown // entries.length when all fit
 */
export function legend(entries: LegendEntry[], options: LegendOptions): LegendGeometry {
  const { box, fontSize, maxHeight = Infinity, heading = 'Not labelled on the plot:' } = options;
  if (entries.length === 0) return { items: [], shown: 0, height: 0 };
  const { swatchWidth, swatchGap, lineHeight, entryGap } = legendDefaults;
  const step = fontSize * lineHeight;
  const right = box.x + box.width;
  const headingSize = fontSize * 0.9;
  const items: Primitive[] = [
    text('legend-heading', box.x, box.y + step * 0.8, heading, headingSize, 'bold', SHEET_COLOURS.mutedText),
  ];
  let x = box.x + textWidth(heading, headingSize, 'bold') + entryGap * 3;
  let row = 0;
  let shown = 0;
  const rowsAllowed = Math.max(1, Math.floor(maxHeight / step));
  for (const [i, entry] of entries.entries()) {
    const full = swatchWidth + swatchGap + textWidth(entry.text, fontSize);
    const lines =
      full <= box.width ? [entry.text] : wrapText(entry.text, box.width - swatchWidth - swatchGap, fontSize);
    const width = Math.min(full, box.width);
    let nextRow = row;
    let nextX = x;
    if (x + width > right) [nextRow, nextX] = [row + 1, box.x];
    // Keep a row free for the "more" note unless this is the last entry.
    const reserve = i < entries.length - 1 ? 1 : 0;
    if (nextRow + lines.length + reserve > rowsAllowed) break;
    [row, x] = [nextRow, nextX];
    const top = box.y + row * step;
    items.push(...swatchItems(entry, x, top + step * 0.5, swatchWidth));
    lines.forEach((line, k) =>
      items.push({
        ...text('legend-text', x + swatchWidth + swatchGap, top + step * (k + 0.8), line, fontSize),
        dataId: entry.dataId,
      }),
    );
    row += lines.length - 1;
    x = lines.length > 1 ? right : x + width + entryGap * 5;
    shown++;
  }
  if (shown < entries.length) {
    row += 1;
    const moreSize = fontSize * 0.9;
    items.push(
      text(
        'legend-more',
        box.x,
        box.y + row * step + step * 0.8,
        moreLineOf(entries.slice(shown), box.width, moreSize),
        moreSize,
        'normal',
        SHEET_COLOURS.mutedText,
      ),
    );
  }
  return { items, shown, height: (row + 1) * step + 2 };
}

/**
 * The height in px the key needs to show every entry across `width`, so the sheet can make room.
 * @example legendHeight(entries, 900, 11) // ≈ 14 for one short row
 */
export function legendHeight(entries: LegendEntry[], width: number, fontSize: number): number {
  return legend(entries, { box: { x: 0, y: 0, width }, fontSize }).height;
}

// Accepts an entry and the swatch's left edge and vertical centre; the sample of the curve's code.
function swatchItems(entry: LegendEntry, x: number, y: number, width: number): Primitive[] {
  const { swatch, dataId } = entry;
  const role = 'legend-swatch';
  switch (swatch.kind) {
    case 'band': {
      const top = pathOf([x, y - 4, x + width, y - 4]);
      if (swatch.coincident)
        return [
          {
            type: 'path',
            role,
            dataId,
            d: pathOf([x, y, x + width, y]),
            stroke: swatch.colour,
            strokeWidth: 1.6,
            fill: 'none',
            ...(swatch.dash ? { dash: swatch.dash } : {}),
          },
        ];
      return [
        {
          type: 'rect',
          role,
          dataId,
          x,
          y: y - 4,
          width,
          height: 8,
          fill: swatch.colour,
          fillOpacity: 0.13,
          stroke: 'none',
        },
        {
          type: 'path',
          role,
          dataId,
          d: top + pathOf([x, y + 4, x + width, y + 4]),
          stroke: swatch.colour,
          strokeWidth: 1.6,
          fill: 'none',
          ...(swatch.dash ? { dash: swatch.dash } : {}),
        },
      ];
    }
    case 'line':
      return [
        {
          type: 'path',
          role,
          dataId,
          d: pathOf([x, y, x + width, y]),
          stroke: swatch.colour,
          strokeWidth: swatch.width,
          fill: 'none',
          ...(swatch.dash ? { dash: swatch.dash } : {}),
          ...(swatch.round ? { lineCap: 'round' as const } : {}),
        },
      ];
    case 'hatch':
      return [
        {
          type: 'rect',
          role,
          dataId,
          x,
          y: y - 5,
          width,
          height: 10,
          patternId: swatch.patternId,
          stroke: swatch.colour,
          strokeWidth: 0.8,
        },
      ];
    case 'symbol':
      return [
        {
          type: 'path',
          role,
          dataId,
          d: symbolPath(swatch.symbol, x + width / 2, y, 4),
          stroke: swatch.colour,
          strokeWidth: 1.4,
          fill: swatch.symbol === 'fault' ? 'none' : '#ffffff',
        },
      ];
  }
}

// Accepts the entries the key has no room for, the width and the size; the longest closing line that fits.
// It names no notes: an exported figure carries none, and the workbench lists them beside the sheet anyway.
function moreLineOf(left: LegendEntry[], width: number, size: number): string {
  const n = left.length;
  const curves = left.every((e) => e.swatch.kind === 'band' || e.swatch.kind === 'line');
  const noun = curves ? (n === 1 ? 'curve' : 'curves') : n === 1 ? 'item' : 'items';
  const wordings = [
    `+ ${n} more ${noun} not named in this key; enlarge the sheet to name ${n === 1 ? 'it' : 'them'} here`,
    `+ ${n} more ${noun} not named in this key`,
    `+ ${n} more`,
  ];
  return wordings.find((line) => textWidth(line, size) <= width) ?? wordings[wordings.length - 1];
}

// Accepts a role, a baseline position and the text; one left-aligned line.
function text(
  role: string,
  x: number,
  y: number,
  value: string,
  size: number,
  weight: 'normal' | 'bold' = 'normal',
  fill: string = SHEET_COLOURS.text,
): Primitive {
  return { type: 'text', role, x, y, text: value, size, anchor: 'start', fill, weight };
}
