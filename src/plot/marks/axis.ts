import type { PathItem, RectItem, TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { pixelOf, type SheetScales } from '../scales.ts';
import { textWidth } from '../textWidth.ts';
import { logTicks, tickLabel } from '../ticks.ts';

/** How the axes are drawn. */
export const axisDefaults = {
  stroke: SHEET_COLOURS.frame,
  textColour: SHEET_COLOURS.text,
  /** px, decade ticks */
  majorTick: 6,
  /** px, 2–9 ticks */
  minorTick: 3,
  /** px between a tick and its label */
  labelGap: 3,
} as const;

/** Options of the axis marks. */
export interface AxisOptions {
  /** Axis title, e.g. "Current in amperes at 480 V". */
  title: string;
  /** Tick-label size in px; the title is 1.1 × this. */
  fontSize: number;
  /** Length of the decade ticks in px. @default 6 */
  majorTick?: number;
  /** Length of the 2–9 ticks in px. @default 3 */
  minorTick?: number;
}

/**
 * The current axis under the plot: outward ticks at every 1–9 × 10^k amps, a label at each decade
 * ("10", "1000", "10 000") and the title centred below.
 * @example axisX(scales, { title: 'Current in amperes at 480 V', fontSize: 11 }).at(-1).text // 'Current in amperes at 480 V'
 */
export function axisX(scales: SheetScales, options: AxisOptions): (PathItem | TextItem)[] {
  const { title, fontSize, majorTick, minorTick, labelGap, stroke, textColour } = { ...axisDefaults, ...options };
  const bottom = scales.y.range[0];
  const ticks = logTicks(scales.x);
  const marks = ticks.map((t) => {
    const x = pixelOf(scales.x, t.value);
    return pathOf([x, bottom, x, bottom + (t.major ? majorTick : minorTick)]);
  });
  const labels: TextItem[] = ticks
    .filter((t) => t.major)
    .map((t) => ({
      type: 'text',
      role: 'tick-label-x',
      x: pixelOf(scales.x, t.value),
      y: bottom + majorTick + labelGap + fontSize * 0.93,
      text: tickLabel(t.value),
      size: fontSize,
      anchor: 'middle',
      fill: textColour,
    }));
  const [left, right] = scales.x.range;
  const titleItem: TextItem = {
    type: 'text',
    role: 'axis-title-x',
    x: (left + right) / 2,
    y: bottom + majorTick + labelGap + fontSize * 2.4,
    text: title,
    size: fontSize * 1.1,
    anchor: 'middle',
    fill: textColour,
  };
  return [tickPath('ticks-x', marks, stroke), ...labels, titleItem];
}

/**
 * The time axis left of the plot: outward ticks at every 1–9 × 10^k seconds, a label at each decade
 * ("0.01" … "1000") and the title turned to read upward.
 * @example axisY(scales, { title: 'Time in seconds', fontSize: 11 }).at(-1).rotate // -90
 */
export function axisY(scales: SheetScales, options: AxisOptions): (PathItem | TextItem)[] {
  const { title, fontSize, majorTick, minorTick, labelGap, stroke, textColour } = { ...axisDefaults, ...options };
  const left = scales.x.range[0];
  const ticks = logTicks(scales.y);
  const marks = ticks.map((t) => {
    const y = pixelOf(scales.y, t.value);
    return pathOf([left, y, left - (t.major ? majorTick : minorTick), y]);
  });
  const labels: TextItem[] = ticks
    .filter((t) => t.major)
    .map((t) => ({
      type: 'text',
      role: 'tick-label-y',
      x: left - majorTick - labelGap,
      y: pixelOf(scales.y, t.value) + fontSize * 0.36,
      text: tickLabel(t.value),
      size: fontSize,
      anchor: 'end',
      fill: textColour,
    }));
  const widest = Math.max(0, ...labels.map((l) => textWidth(l.text, fontSize)));
  const [bottom, top] = scales.y.range;
  const x = left - majorTick - labelGap - widest - fontSize * 0.6;
  const titleItem: TextItem = {
    type: 'text',
    role: 'axis-title-y',
    x,
    y: (top + bottom) / 2,
    text: title,
    size: fontSize * 1.1,
    anchor: 'middle',
    fill: textColour,
    rotate: -90,
  };
  return [tickPath('ticks-y', marks, stroke), ...labels, titleItem];
}

/**
 * The border of the plot area, drawn over the grid.
 * @example plotFrame(scales).role // 'plot-frame'
 */
export function plotFrame(scales: SheetScales): RectItem {
  const [left, right] = scales.x.range;
  const [bottom, top] = scales.y.range;
  return {
    type: 'rect',
    role: 'plot-frame',
    x: left,
    y: top,
    width: right - left,
    height: bottom - top,
    fill: 'none',
    stroke: axisDefaults.stroke,
    strokeWidth: 1,
  };
}

// Accepts the path strings of single tick lines; joins them into one path.
function tickPath(role: string, marks: string[], stroke: string): PathItem {
  return { type: 'path', role, d: marks.join(''), stroke, strokeWidth: 0.8, fill: 'none' };
}
