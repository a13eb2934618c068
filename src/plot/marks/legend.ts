import type { Marker } from '../../engine/withstand/withstand.ts';
import type { Box, Primitive } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { wrapText } from '../textWidth.ts';
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
  | { kind: 'band'; colour: string; coincident: boolean }
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
  /** The space the legend may fill, px. */
  box: Box;
  /** px */
  fontSize: number;
  /** @default 'Legend' */
  heading?: string;
}

/** The legend's drawing, how many entries fit, and the height used (px). */
export interface LegendGeometry {
  items: Primitive[];
  shown: number;
  height: number;
}

/**
 * Lays out the legend top-down in its box: a heading, then each group's heading and entries, each
 * entry a sample of its curve's code (fill and edges, dash, hatch or symbol) and its text wrapped to
 * the box. Entries that do not fit are counted in a closing "+ n more …" line.
 * @example legend(entries, { box, fontSize: 11 }).shown // entries.length when all fit
 */
export function legend(entries: LegendEntry[], options: LegendOptions): LegendGeometry {
  const { box, fontSize, heading = 'Legend' } = options;
  const { swatchWidth, swatchGap, lineHeight, entryGap } = legendDefaults;
  const step = fontSize * lineHeight;
  const textX = box.x + swatchWidth + swatchGap;
  const textWidthMax = box.width - swatchWidth - swatchGap;
  const bottom = box.y + box.height;
  const items: Primitive[] = [text('legend-heading', box.x, box.y + fontSize, heading, fontSize * 1.05, 'bold')];
  let y = box.y + fontSize + step * 0.6;
  let group = '';
  let shown = 0;
  for (const [i, entry] of entries.entries()) {
    const lines = wrapText(entry.text, textWidthMax, fontSize);
    const headingHeight = entry.group !== group ? step * 1.15 : 0;
    const height = headingHeight + lines.length * step + entryGap;
    // Keep a line free for the "more" note unless this is the last entry.
    const reserve = i < entries.length - 1 ? step : 0;
    if (y + height + reserve > bottom) break;
    if (headingHeight) {
      items.push(
        text('legend-group', box.x, y + step * 0.85, entry.group, fontSize * 0.9, 'bold', SHEET_COLOURS.mutedText),
      );
      y += headingHeight;
      group = entry.group;
    }
    const middle = y + step * 0.55;
    items.push(...swatchItems(entry, box.x, middle, swatchWidth));
    lines.forEach((line, k) =>
      items.push({ ...text('legend-text', textX, y + step * (k + 0.85), line, fontSize), dataId: entry.dataId }),
    );
    y += lines.length * step + entryGap;
    shown++;
  }
  if (shown < entries.length) {
    items.push(
      text(
        'legend-more',
        box.x,
        y + step * 0.85,
        `+ ${entries.length - shown} more not shown (enlarge the sheet)`,
        fontSize * 0.9,
        'normal',
        SHEET_COLOURS.mutedText,
      ),
    );
    y += step;
  }
  return { items, shown, height: y - box.y };
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
