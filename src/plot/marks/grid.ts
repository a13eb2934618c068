import { HALF_CYCLE_SECONDS } from '../../engine/band.ts';
import type { PathItem, TextItem } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { pixelOf, type SheetScales } from '../scales.ts';
import { logTicks } from '../ticks.ts';

/** How the log-log grid is drawn. */
export const gridDefaults = {
  majorStroke: SHEET_COLOURS.gridMajor,
  minorStroke: SHEET_COLOURS.gridMinor,
  /** px */
  majorWidth: 0.9,
  /** px */
  minorWidth: 0.6,
} as const;

/** Options of the grid marks. */
export interface GridOptions {
  /** Colour of the decade lines. @default '#9a9a9a' */
  majorStroke?: string;
  /** Colour of the 2–9 lines. @default '#d9d9d9' */
  minorStroke?: string;
  /** Decade line width in px. @default 0.9 */
  majorWidth?: number;
  /** 2–9 line width in px. @default 0.6 */
  minorWidth?: number;
}

/**
 * Vertical grid lines at every 1–9 × 10^k amps across the current axis: two paths, the 2–9 lines
 * first and the heavier decade lines over them.
 * @example gridX(scales, {}).map((p) => p.role) // ['grid-x-minor', 'grid-x-major']
 */
export function gridX(scales: SheetScales, options: GridOptions): PathItem[] {
  const [top, bottom] = [scales.y.range[1], scales.y.range[0]];
  return gridPaths('x', scales, options, (value) => {
    const x = pixelOf(scales.x, value);
    return [x, bottom, x, top];
  });
}

/**
 * Horizontal grid lines at every 1–9 × 10^k seconds up the time axis, minor lines then decades.
 * @example gridY(scales, {}).map((p) => p.role) // ['grid-y-minor', 'grid-y-major']
 */
export function gridY(scales: SheetScales, options: GridOptions): PathItem[] {
  const [left, right] = scales.x.range;
  return gridPaths('y', scales, options, (value) => {
    const y = pixelOf(scales.y, value);
    return [left, y, right, y];
  });
}

/**
 * The half-cycle line (0.01 s, IEEE 242; the half-cycle limit, common practice) and its note, drawn only when the time axis reaches
 * below it; curves stop at this line, so it tells the reader why.
 * @example halfCycleRule(scales, 11) // [] when the axis starts at 0.01 s
 */
export function halfCycleRule(scales: SheetScales, fontSize: number): (PathItem | TextItem)[] {
  const [low, high] = scales.y.domain;
  if (!(low < HALF_CYCLE_SECONDS && high > HALF_CYCLE_SECONDS)) return [];
  const y = pixelOf(scales.y, HALF_CYCLE_SECONDS);
  const [left, right] = scales.x.range;
  const points = new Float64Array([left, y, right, y]);
  return [
    {
      type: 'path',
      role: 'half-cycle',
      d: pathOf(points),
      points,
      stroke: SHEET_COLOURS.frame,
      strokeWidth: 0.9,
      dash: '6 3',
      fill: 'none',
    },
    {
      type: 'text',
      role: 'half-cycle-note',
      x: right - 4,
      y: y + fontSize + 2,
      text: 'curves stop at ½ cycle (0.01 s)',
      size: fontSize * 0.85,
      anchor: 'end',
      fill: SHEET_COLOURS.mutedText,
    },
  ];
}

// Accepts an axis name and a function giving one line's end points for a tick value.
function gridPaths(
  axis: 'x' | 'y',
  scales: SheetScales,
  options: GridOptions,
  endpoints: (value: number) => [number, number, number, number],
): PathItem[] {
  const { majorStroke, minorStroke, majorWidth, minorWidth } = { ...gridDefaults, ...options };
  const ticks = logTicks(scales[axis]);
  const d = (major: boolean) =>
    ticks
      .filter((t) => t.major === major)
      .map((t) => pathOf(endpoints(t.value)))
      .join('');
  return [
    {
      type: 'path',
      role: `grid-${axis}-minor`,
      d: d(false),
      stroke: minorStroke,
      strokeWidth: minorWidth,
      fill: 'none',
    },
    {
      type: 'path',
      role: `grid-${axis}-major`,
      d: d(true),
      stroke: majorStroke,
      strokeWidth: majorWidth,
      fill: 'none',
    },
  ];
}
