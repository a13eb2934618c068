import { clipPolyline } from '../clip.ts';
import type { PathItem } from '../geometry.ts';
import { pathOf } from '../precision.ts';
import { drawBoxOf, type SheetScales } from '../scales.ts';
import type { SheetStarting } from '../sheetInput.ts';
import { projectPolyline, type CurveGeometry } from './withstandLine.ts';

/** How a motor starting curve is drawn: dotted, so it reads as a load, neither a band nor a limit. */
export const startingLineDefaults = {
  /** px */
  strokeWidth: 1.8,
  /** px: dot, gap (drawn with round caps) */
  dash: '1.5 3.5',
} as const;

/** Options of the motor starting mark. */
export interface StartingLineOptions {
  colour: string;
  /** px. @default 1.8 */
  strokeWidth?: number;
  /** SVG dash array in px. @default '1.5 3.5' */
  dash?: string;
}

/**
 * Draws a motor starting curve (full-load current at long times, locked-rotor current to the
 * acceleration time) as a dotted polyline on the sheet's base, clipped to the draw window.
 * @example startingLine(motorStart, scales, { colour: '#CC79A7' }).items[0].role // 'starting'
 */
export function startingLine(
  starting: SheetStarting,
  scales: SheetScales,
  options: StartingLineOptions,
): CurveGeometry {
  const { colour, strokeWidth, dash } = { ...startingLineDefaults, ...options };
  const { amps, seconds } = starting.curve;
  const strokes = clipPolyline(projectPolyline(amps, seconds, starting.scale, scales), drawBoxOf(scales));
  const items: PathItem[] = strokes.map((points) => ({
    type: 'path',
    role: 'starting',
    dataId: starting.id,
    d: pathOf(points),
    points,
    stroke: colour,
    strokeWidth,
    dash,
    lineCap: 'round',
    fill: 'none',
  }));
  return { items, strokes };
}
