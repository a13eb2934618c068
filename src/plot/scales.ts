import { scaleLog, type ScaleLogarithmic } from 'd3-scale';
import { HALF_CYCLE_SECONDS } from '../engine/band.ts';
import type { Box } from './geometry.ts';

/**
 * One logarithmic axis as plain data: `domain` in amps or seconds (ascending), `range` in pixels
 * (the pixel of `domain[0]`, then of `domain[1]`). Plain so a sheet can cross a Worker boundary.
 */
export interface LogAxis {
  domain: [number, number];
  range: [number, number];
}

/** The two axes of a sheet: `x` is current in amps at the reference voltage, `y` is time in seconds (up). */
export interface SheetScales {
  x: LogAxis;
  y: LogAxis;
}

/** The plot area in pixels, as edges. */
export interface PlotFrame {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/**
 * The scales of a sheet: currents left to right across the frame, times bottom to top.
 * @example scalesOf({ current: [1, 1e5], time: [0.01, 1000] }, { left: 60, top: 40, right: 660, bottom: 640 }).x.range // [60, 660]
 */
export function scalesOf(ranges: { current: [number, number]; time: [number, number] }, frame: PlotFrame): SheetScales {
  return {
    x: { domain: [...ranges.current], range: [frame.left, frame.right] },
    y: { domain: [...ranges.time], range: [frame.bottom, frame.top] },
  };
}

/**
 * A d3 log scale for an axis (for ticks, the probe, or drawing elsewhere); it extrapolates outside
 * the domain rather than clamping.
 * @example scaleOf({ domain: [1, 1000], range: [0, 300] })(10) // 100
 */
export function scaleOf(axis: LogAxis): ScaleLogarithmic<number, number> {
  return scaleLog().domain(axis.domain).range(axis.range);
}

/**
 * The pixel of `value` (amps or seconds) on an axis; the fast path used while sampling curves.
 * Non-positive values map to -Infinity decades (off the low end).
 * @example pixelOf({ domain: [1, 1000], range: [0, 300] }, 100) // 200
 */
export function pixelOf(axis: LogAxis, value: number): number {
  const [d0, d1] = axis.domain;
  const [r0, r1] = axis.range;
  return r0 + ((Math.log(value) - Math.log(d0)) / (Math.log(d1) - Math.log(d0))) * (r1 - r0);
}

/**
 * The value (amps or seconds) at a pixel on an axis; the inverse of {@link pixelOf}.
 * @example valueOf({ domain: [1, 1000], range: [0, 300] }, 200) // 100
 */
export function valueOf(axis: LogAxis, pixel: number): number {
  const [d0, d1] = axis.domain;
  const [r0, r1] = axis.range;
  return Math.exp(Math.log(d0) + ((pixel - r0) / (r1 - r0)) * (Math.log(d1) - Math.log(d0)));
}

/**
 * The decade range `[10^a, 10^b]` that holds every value in `values` (finite, positive ones only)
 * with a little room (`pad`, a factor) at each end, at least `minDecades` wide; `fallback` when no
 * value qualifies.
 * @example decadeRangeOf([110, 28_421], { pad: 1.2 }) // [10, 100000]
 */
export function decadeRangeOf(
  values: Iterable<number>,
  options: { pad?: number; minDecades?: number; fallback?: [number, number] } = {},
): [number, number] {
  const { pad = 1.2, minDecades = 2, fallback = [1, 10_000] } = options;
  let low = Infinity;
  let high = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v) || v <= 0) continue;
    low = Math.min(low, v);
    high = Math.max(high, v);
  }
  if (low === Infinity) return [...fallback];
  // A small tolerance keeps a value that sits on a decade (1000 A) from being pushed a decade out by rounding.
  let a = Math.floor(Math.log10(low / pad) + 1e-9);
  let b = Math.ceil(Math.log10(high * pad) - 1e-9);
  // Widen alternately upward and downward until the axis spans `minDecades`.
  while (b - a < minDecades) {
    b += 1;
    if (b - a < minDecades) a -= 1;
  }
  return [10 ** a, 10 ** b];
}

/** The part of the sheet curves may be drawn in: currents in amps and times in seconds, ascending. */
export interface DrawWindow {
  amps: [number, number];
  seconds: [number, number];
}

/**
 * Where curves may be drawn: the whole current axis, and times from the half-cycle line (0.01 s,
 * IEEE 242; the half-cycle limit, common practice: practitioners stop every curve there) or the axis bottom if higher, to the top.
 * @example drawWindowOf(scales).seconds // [0.01, 1000]
 */
export function drawWindowOf(scales: SheetScales): DrawWindow {
  const [low, high] = scales.y.domain;
  return { amps: [...scales.x.domain], seconds: [Math.min(high, Math.max(low, HALF_CYCLE_SECONDS)), high] };
}

/**
 * The draw window in pixels, for clipping polylines.
 * @example drawBoxOf(scales) // { x: 60, y: 40, width: 600, height: 600 }
 */
export function drawBoxOf(scales: SheetScales): Box {
  const window = drawWindowOf(scales);
  const x0 = pixelOf(scales.x, window.amps[0]);
  const x1 = pixelOf(scales.x, window.amps[1]);
  const y0 = pixelOf(scales.y, window.seconds[1]);
  const y1 = pixelOf(scales.y, window.seconds[0]);
  return { x: Math.min(x0, x1), y: Math.min(y0, y1), width: Math.abs(x1 - x0), height: Math.abs(y1 - y0) };
}
