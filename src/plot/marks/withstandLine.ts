import { clipPolyline } from '../clip.ts';
import type { PathItem } from '../geometry.ts';
import { pathOf } from '../precision.ts';
import { drawBoxOf, pixelOf, type SheetScales } from '../scales.ts';
import type { SheetWithstand } from '../sheetInput.ts';

/** How a withstand (damage) curve is drawn: dashed, so it never reads as a device band. */
export const withstandLineDefaults = {
  /** px */
  strokeWidth: 1.6,
  /** px: dash, gap */
  dash: '7 4',
} as const;

/** Options of the withstand mark. */
export interface WithstandLineOptions {
  colour: string;
  /** px. @default 1.6 */
  strokeWidth?: number;
  /** SVG dash array in px. @default '7 4' */
  dash?: string;
}

/** A curve's drawing: primitives, and its visible pieces in pixels for label placement. */
export interface CurveGeometry {
  items: PathItem[];
  strokes: Float64Array[];
}

/**
 * Draws a withstand curve as a dashed polyline, its currents multiplied by `scale` onto the sheet's
 * base, clipped to the draw window (so it too stops at the half-cycle line and the top of the sheet).
 * Straight segments between the curve's points are straight on log-log paper, as the curve is defined.
 * @example withstandLine(transformerCurve, scales, { colour: '#009E73' }).items[0].dash // '7 4'
 */
export function withstandLine(
  withstand: SheetWithstand,
  scales: SheetScales,
  options: WithstandLineOptions,
): CurveGeometry {
  const { colour, strokeWidth, dash } = { ...withstandLineDefaults, ...options };
  const { amps, seconds } = withstand.curve;
  const strokes = clipPolyline(projectPolyline(amps, seconds, withstand.scale, scales), drawBoxOf(scales));
  const items: PathItem[] = strokes.map((points) => ({
    type: 'path',
    role: 'withstand',
    dataId: withstand.id,
    d: pathOf(points),
    points,
    stroke: colour,
    strokeWidth,
    dash,
    fill: 'none',
  }));
  return { items, strokes };
}

/**
 * A polyline given in amps and seconds, currents multiplied by `scale`, as interleaved pixels.
 * Shared by the curve marks that are point lists (withstand, motor starting).
 * @example projectPolyline(new Float64Array([100, 1000]), new Float64Array([10, 0.1]), 1, scales)
 */
export function projectPolyline(
  amps: ArrayLike<number>,
  seconds: ArrayLike<number>,
  scale: number,
  scales: SheetScales,
): Float64Array {
  const n = Math.min(amps.length, seconds.length);
  const out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    out[2 * i] = pixelOf(scales.x, amps[i] * scale);
    out[2 * i + 1] = pixelOf(scales.y, seconds[i]);
  }
  return out;
}
