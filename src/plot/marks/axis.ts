import type { PathItem, RectItem, TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { pixelOf, type SheetScales } from '../scales.ts';
import { textWidth } from '../textWidth.ts';
import { logTicks, tickLabel, type Tick } from '../ticks.ts';

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
  /** × font size: the least clear space between two tick labels along the axis */
  labelSpacing: 0.4,
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
 * The current axis under the plot: outward ticks at every 1–9 × 10^k amps, labels chosen by
 * {@link labelSeries} ("10", "1000", "10 000"; "2000", "5000" in a view within one decade) with no
 * two closer than `labelSpacing`, and the title centred below.
 * @example axisX(scales, { title: 'Current in amperes at 480 V', fontSize: 11 }).at(-1).text // 'Current in amperes at 480 V'
 */
export function axisX(scales: SheetScales, options: AxisOptions): (PathItem | TextItem)[] {
  const { title, fontSize, majorTick, minorTick, labelGap, labelSpacing, stroke, textColour } = {
    ...axisDefaults,
    ...options,
  };
  const bottom = scales.y.range[0];
  const ticks = logTicks(scales.x);
  const marks = ticks.map((t) => {
    const x = pixelOf(scales.x, t.value);
    return pathOf([x, bottom, x, bottom + (t.major ? majorTick : minorTick)]);
  });
  const labelled = spacedOut(labelSeries(ticks), fontSize * labelSpacing, (t) => {
    const half = textWidth(tickLabel(t.value), fontSize) / 2;
    const x = pixelOf(scales.x, t.value);
    return [x - half, x + half];
  });
  const labels: TextItem[] = labelled.map((t) => ({
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
 * The time axis left of the plot: outward ticks at every 1–9 × 10^k seconds, labels chosen by
 * {@link labelSeries} ("0.01" … "1000"; "0.02", "0.05", "0.1" … in a view within one decade) with no
 * two closer than `labelSpacing`, and the title turned to read upward.
 * @example axisY(scales, { title: 'Time in seconds', fontSize: 11 }).at(-1).rotate // -90
 */
export function axisY(scales: SheetScales, options: AxisOptions): (PathItem | TextItem)[] {
  const { title, fontSize, majorTick, minorTick, labelGap, labelSpacing, stroke, textColour } = {
    ...axisDefaults,
    ...options,
  };
  const left = scales.x.range[0];
  const ticks = logTicks(scales.y);
  const marks = ticks.map((t) => {
    const y = pixelOf(scales.y, t.value);
    return pathOf([left, y, left - (t.major ? majorTick : minorTick), y]);
  });
  // A label's extent along the time axis is its line of type, one font size tall.
  const labelled = spacedOut(labelSeries(ticks), fontSize * labelSpacing, (t) => {
    const y = pixelOf(scales.y, t.value);
    return [y - fontSize / 2, y + fontSize / 2];
  });
  const labels: TextItem[] = labelled.map((t) => ({
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
 * The ticks of a log axis offered a label, ascending: the decades; where fewer than two decades fall
 * inside the axis (a zoomed view), the 1-2-5 series; where that still gives fewer than two, every
 * 1–9 tick. So a view of 2000–9000 A reads "2000" and "5000" rather than no number at all.
 * @example labelSeries(logTicks({ domain: [150, 8000], range: [0, 1] })).map((t) => t.value) // [200, 500, 1000, 2000, 5000]
 */
export function labelSeries(ticks: Tick[]): Tick[] {
  const decades = ticks.filter((t) => t.major);
  if (decades.length >= 2) return decades;
  const oneTwoFive = ticks.filter((t) => labelRank(t) < 2);
  return oneTwoFive.length >= 2 ? oneTwoFive : ticks;
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

// Accepts ticks with each label's extent along the axis (px); keeps, ascending, those clear by `spacing` of
// every label kept before them, taken decades first, then 2s and 5s, then the rest.
function spacedOut(ticks: Tick[], spacing: number, extentOf: (tick: Tick) => [number, number]): Tick[] {
  const kept: { tick: Tick; low: number; high: number }[] = [];
  const byRank = ticks.map((tick, order) => ({ tick, order })).sort((a, b) => labelRank(a.tick) - labelRank(b.tick));
  for (const { tick } of byRank) {
    const [low, high] = extentOf(tick);
    if (kept.every((k) => low >= k.high + spacing || high <= k.low - spacing)) kept.push({ tick, low, high });
  }
  return ticks.filter((t) => kept.some((k) => k.tick === t));
}

// Accepts a tick; 0 for a decade, 1 for a 2 or 5 of the 1-2-5 series, 2 for the other 3–9 ticks.
function labelRank(tick: Tick): number {
  if (tick.major) return 0;
  const leadingDigit = tick.value.toExponential(0)[0];
  return leadingDigit === '2' || leadingDigit === '5' ? 1 : 2;
}
