import { traceBand, clampTime, type BandTrace } from '../bandTrace.ts';
import type { PathItem } from '../geometry.ts';
import { pathOf } from '../precision.ts';
import { drawWindowOf, pixelOf, type SheetScales } from '../scales.ts';
import type { SheetBand } from '../sheetInput.ts';
import { simplifyPolyline } from '../simplify.ts';

/** How a band is drawn: a light fill between its edges and a solid line along each edge. */
export const bandAreaDefaults = {
  /** px */
  strokeWidth: 1.6,
  fillOpacity: 0.13,
  /** px: points closer than this to the line through their neighbours are dropped. */
  tolerance: 0.1,
} as const;

/**
 * The edge patterns bands take in order on a sheet, so colour is never the only code for a device:
 * solid, long dash, short dash, dash-dot, long dash-dot-dot, even dash; beyond six they repeat.
 * Withstand curves ('7 4') and starting curves (dotted) keep patterns of their own.
 */
export const BAND_DASHES: readonly string[] = ['', '10 3', '3.5 2.5', '10 3 2.5 3', '16 3 2.5 3 2.5 3', '5.5 5.5'];

/** What each of {@link BAND_DASHES} is called in plain words, for the reading guide. */
export const BAND_DASH_NAMES: readonly string[] = [
  'solid edges',
  'long-dash edges',
  'short-dash edges',
  'dash-dot edges',
  'dash-dot-dot edges',
  'even-dash edges',
];

/** Options of the band mark. */
export interface BandAreaOptions {
  /** Stroke and fill colour (an Okabe–Ito colour, by the band's order on the sheet). */
  colour: string;
  /** Edge dash pattern (SVG dash array, px); solid when empty. @default '' */
  dash?: string;
  /** Edge line width in px. @default 1.6 */
  strokeWidth?: number;
  /** Opacity of the fill between the edges, 0–1. @default 0.13 */
  fillOpacity?: number;
  /** Traces kept between layouts of one sheet, by band; a band traced for the same windows is not traced again. */
  traces?: Map<SheetBand, { key: string; trace: BandTrace | null }>;
  /** Simplification tolerance in px. @default 0.1 */
  tolerance?: number;
}

/** A band's drawing: the primitives, and its edge lines in pixels for label placement. */
export interface BandAreaGeometry {
  items: PathItem[];
  /** Visible edge lines as interleaved pixels, the maximum (clearing) edge first. */
  strokes: Float64Array[];
}

/**
 * Draws a band: the area between its edges clipped to the draw window (times from the half-cycle
 * line to the top of the sheet, currents across the axis up to the band's `maxAmps` or the sheet
 * band's `toAmps`, whichever is lower), and each edge
 * as a line where it lies inside the window. A pickup is an exact vertical because the band is
 * sampled on both sides of each breakpoint. When the edges coincide it is one line and no fill.
 * @example bandArea(sheetBand, scales, { colour: '#E69F00' }).items.map((p) => p.role) // ['band-fill', 'band-max', 'band-min']
 */
export function bandArea(sheetBand: SheetBand, scales: SheetScales, options: BandAreaOptions): BandAreaGeometry {
  const { colour, strokeWidth, fillOpacity, tolerance, dash = '' } = { ...bandAreaDefaults, ...options };
  // A band drawn before with the same look on the same axes is drawn the same: the sheet after an
  // edit of one device takes the other devices' drawings as they were (bands are read-only).
  const { x, y } = scales;
  const look = `${sheetBand.id}|${sheetBand.toAmps}|${x.domain}|${x.range}|${y.domain}|${y.range}|${colour}|${strokeWidth}|${fillOpacity}|${tolerance}|${dash}`;
  const drawn = drawings.get(sheetBand.band) ?? [];
  const known = drawn.find((entry) => entry.look === look);
  if (known) return known.geometry;
  const geometry = drawBandArea(sheetBand, scales, { ...options, colour, strokeWidth, fillOpacity, tolerance, dash });
  // A few looks per band: the workbench's sheet, its layout with the key, an exported figure.
  drawings.set(sheetBand.band, [{ look, geometry }, ...drawn.slice(0, 3)]);
  return geometry;
}

const drawings = new WeakMap<SheetBand['band'], { look: string; geometry: BandAreaGeometry }[]>();

function drawBandArea(
  sheetBand: SheetBand,
  scales: SheetScales,
  options: BandAreaOptions & { strokeWidth: number; fillOpacity: number; tolerance: number; dash: string },
): BandAreaGeometry {
  const { colour, strokeWidth, fillOpacity, tolerance, dash } = options;
  const window = drawWindowOf(scales);
  const perDecade =
    Math.abs(scales.x.range[1] - scales.x.range[0]) / Math.log10(scales.x.domain[1] / scales.x.domain[0]);
  const to = Math.min(window.amps[1], sheetBand.toAmps ?? Infinity);
  // The trace depends on the band, the current and time windows and the samples per decade, not on the
  // plot's height: a sheet laid out twice (to make room for its key) samples each band once.
  const key = `${window.amps[0]}|${to}|${window.seconds[0]}|${window.seconds[1]}|${Math.max(8, perDecade)}`;
  const cached = options.traces?.get(sheetBand);
  const trace =
    cached && cached.key === key
      ? cached.trace
      : traceBand(sheetBand.band, { ...window, amps: [window.amps[0], to] }, Math.max(8, perDecade));
  options.traces?.set(sheetBand, { key, trace });
  if (!trace) return { items: [], strokes: [] };
  const [bottom, top] = window.seconds;
  const first = trace.minTimes.findIndex((t) => t <= top);
  const last = lastIndex(trace.maxTimes, (t) => t >= bottom);
  if (first < 0 || last < first) return { items: [], strokes: [] };

  const items: PathItem[] = [];
  const dataId = sheetBand.id;
  if (!trace.coincident) {
    const outline = fillOutline(trace, first, last, scales, window.seconds);
    const points = simplifyPolyline(outline, tolerance);
    items.push({
      type: 'path',
      role: 'band-fill',
      dataId,
      d: pathOf(points, true),
      points,
      fill: colour,
      fillOpacity,
      stroke: 'none',
    });
  }
  const strokes: Float64Array[] = [];
  const edges = trace.coincident ? (['max'] as const) : (['max', 'min'] as const);
  for (const edge of edges) {
    const times = edge === 'max' ? trace.maxTimes : trace.minTimes;
    for (const run of visibleRuns(trace.amps, times, scales, window.seconds)) {
      const points = simplifyPolyline(run, tolerance);
      strokes.push(points);
      const role = trace.coincident ? 'band-line' : `band-${edge}`;
      items.push({
        type: 'path',
        role,
        dataId,
        d: pathOf(points),
        points,
        stroke: colour,
        strokeWidth,
        fill: 'none',
        ...(dash ? { dash } : {}),
      });
    }
  }
  return { items, strokes };
}

// Accepts a trace and the index span where the band shows; the fill outline, upper edge out and lower edge back.
function fillOutline(
  trace: BandTrace,
  first: number,
  last: number,
  scales: SheetScales,
  seconds: [number, number],
): Float64Array {
  const count = last - first + 1;
  const out = new Float64Array(count * 4);
  for (let k = 0; k < count; k++) {
    const i = first + k;
    const x = pixelOf(scales.x, trace.amps[i]);
    out[2 * k] = x;
    out[2 * k + 1] = pixelOf(scales.y, clampTime(trace.maxTimes[i], seconds));
    const back = 2 * (2 * count - 1 - k);
    out[back] = x;
    out[back + 1] = pixelOf(scales.y, clampTime(trace.minTimes[i], seconds));
  }
  return out;
}

// Accepts one edge's samples; the runs of consecutive samples inside the time window, as pixel polylines.
function visibleRuns(
  amps: Float64Array,
  times: Float64Array,
  scales: SheetScales,
  [bottom, top]: [number, number],
): Float64Array[] {
  const runs: Float64Array[] = [];
  let run: number[] = [];
  for (let i = 0; i <= amps.length; i++) {
    const inside = i < amps.length && times[i] >= bottom && times[i] <= top;
    if (inside) {
      run.push(pixelOf(scales.x, amps[i]), pixelOf(scales.y, times[i]));
      continue;
    }
    if (run.length >= 4) runs.push(Float64Array.from(run));
    run = [];
  }
  return runs;
}

// Accepts a typed array and a predicate; the last index where it holds, or -1.
function lastIndex(values: Float64Array, predicate: (v: number) => boolean): number {
  for (let i = values.length - 1; i >= 0; i--) if (predicate(values[i])) return i;
  return -1;
}
