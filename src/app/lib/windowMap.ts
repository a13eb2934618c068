import type { FeasibleMap } from '../../engine/window/index.ts';
import { textWidth } from '../../plot/textWidth.ts';

/** A labelled run of one edge of the feasible map: consecutive columns bound by the same constraint. */
export interface EdgeRun {
  side: 'lower' | 'upper';
  label: string;
  /** Polyline points in pixels. */
  points: [number, number][];
  /** Where the label sits (pixels): the anchor point of {@link EdgeRun.shown}, inside the plot box. */
  at: [number, number];
  /** Which end of the shown text `at` is. */
  anchor: LabelAnchor;
  /** The label as drawn: `label`, or its start and an ellipsis where the box has no room for it. */
  shown: string;
}

/** An SVG `text-anchor`. */
export type LabelAnchor = 'start' | 'middle' | 'end';

/** The plot box of a drawing (pixels). */
export interface PlotBox {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** Options of {@link edgeLabelPlacement}. */
export interface EdgeLabelOptions {
  /** The box the label must stay inside (pixels). */
  box: PlotBox;
  /** Font size, px. @default EDGE_LABEL_SIZE */
  size?: number;
  /** Gap kept between the text and the box's sides, px. @default 2 */
  inset?: number;
}

/** Where an edge label is drawn: anchor point, text-anchor, and the (perhaps shortened) text. */
export interface EdgeLabelPlacement {
  at: [number, number];
  anchor: LabelAnchor;
  shown: string;
}

/** The drawable geometry of a feasible map in a box of `width` × `height` pixels. */
export interface WindowMapGeometry {
  width: number;
  height: number;
  /** One rectangle per open column interval. */
  cells: { x: number; y: number; width: number; height: number }[];
  edges: EdgeRun[];
  /** Axis ticks: value and pixel. */
  xTicks: { value: number; px: number }[];
  yTicks: { value: number; px: number }[];
  /** Maps a setting pair to pixels and back (snapping to the settings' steps). */
  toPixels(x: number, y: number): [number, number];
  fromPixels(px: number, py: number): { x: number; y: number };
}

/** Margins of the plot box inside the drawing (pixels): room for ticks and axis titles. */
export const MAP_PADDING = { left: 44, right: 10, top: 10, bottom: 30 };

/** Font size of the edge labels, px. */
export const EDGE_LABEL_SIZE = 8;

/**
 * Lays out a feasible map for drawing: log scales on both settings, one rectangle per open interval
 * of each column (half-way to its neighbours), the lower and upper edges as polylines split into runs
 * by binding constraint, and the pixel ↔ setting conversion a click uses (snapped to the steps).
 * Geometry only: the window itself comes from the engine.
 *
 * @example windowMapGeometry(window.maps[0], 420, 260).cells.length
 */
export function windowMapGeometry(map: FeasibleMap, width: number, height: number): WindowMapGeometry {
  const { left, right, top, bottom } = MAP_PADDING;
  const lx = (v: number) => Math.log(v);
  const [x0, x1] = [lx(map.x.min), lx(map.x.max === map.x.min ? map.x.min * 1.01 : map.x.max)];
  const [y0, y1] = [lx(map.y.min), lx(map.y.max === map.y.min ? map.y.min * 1.01 : map.y.max)];
  const px = (v: number) => left + ((lx(v) - x0) / (x1 - x0)) * (width - left - right);
  const py = (v: number) => height - bottom - ((lx(v) - y0) / (y1 - y0)) * (height - top - bottom);
  const columns = map.columns;
  const half = (i: number, side: -1 | 1) => {
    const neighbour = columns[i + side];
    const here = px(columns[i].x);
    if (!neighbour) return side < 0 ? Math.max(left, here - 6) : Math.min(width - right, here + 6);
    return (here + px(neighbour.x)) / 2;
  };
  const cells = columns.flatMap((c, i) =>
    c.intervals.map((interval) => {
      const xa = half(i, -1);
      const xb = half(i, 1);
      const ya = py(interval.to);
      const yb = py(interval.from);
      return { x: xa, y: ya, width: Math.max(1, xb - xa), height: Math.max(2, yb - ya) };
    }),
  );
  const edges: EdgeRun[] = [];
  for (const side of ['lower', 'upper'] as const) {
    let run: EdgeRun | undefined;
    let runId = '';
    columns.forEach((c, i) => {
      const interval = c.intervals[0];
      if (!interval) {
        run = undefined;
        return;
      }
      const binding = side === 'lower' ? interval.lower : interval.upper;
      const y = py(side === 'lower' ? interval.from : interval.to);
      const points: [number, number][] = [
        [half(i, -1), y],
        [half(i, 1), y],
      ];
      if (run && runId === binding.id) run.points.push(...points);
      else {
        run = { side, label: binding.label, points, at: points[0], anchor: 'middle', shown: binding.label };
        runId = binding.id;
        edges.push(run);
      }
    });
  }
  const box = { left, right: width - right, top, bottom: height - bottom };
  for (const edge of edges) Object.assign(edge, edgeLabelPlacement(edge, { box }));
  const ticksOf = (min: number, max: number, steps?: number[]) => {
    const candidates = steps && steps.length <= 12 ? steps : niceLogTicks(min, max);
    return candidates.filter((v) => v >= min * (1 - 1e-9) && v <= max * (1 + 1e-9));
  };
  const snap = (value: number, min: number, max: number, steps?: number[]) => {
    const clamped = Math.min(max, Math.max(min, value));
    if (!steps) return Number(clamped.toPrecision(3));
    return steps.reduce((best, v) => (Math.abs(lx(v) - lx(clamped)) < Math.abs(lx(best) - lx(clamped)) ? v : best));
  };
  return {
    width,
    height,
    cells,
    edges,
    xTicks: ticksOf(map.x.min, map.x.max, map.x.values).map((value) => ({ value, px: px(value) })),
    yTicks: ticksOf(map.y.min, map.y.max, map.y.values).map((value) => ({ value, px: py(value) })),
    toPixels: (x, y) => [px(x), py(y)],
    fromPixels: (cx, cy) => {
      const x = Math.exp(x0 + ((cx - left) / (width - left - right)) * (x1 - x0));
      const y = Math.exp(y0 + ((height - bottom - cy) / (height - top - bottom)) * (y1 - y0));
      return { x: snap(x, map.x.min, map.x.max, map.x.values), y: snap(y, map.y.min, map.y.max, map.y.values) };
    },
  };
}

/**
 * Places an edge's label wholly inside the plot box, so it never runs off the map or onto the tick
 * labels beside it: centred under a lower edge's middle (above an upper edge's), moved to the
 * other side of the line when that side has no room, end-anchored at the right side or
 * start-anchored at the left when centring would cross it, and cut to its start and an ellipsis
 * when it is wider than the box (the caller keeps the full label for a tooltip).
 *
 * @example edgeLabelPlacement(edge, { box: { left: 44, right: 430, top: 10, bottom: 220 } }).anchor // 'end'
 */
export function edgeLabelPlacement(
  edge: Pick<EdgeRun, 'side' | 'label' | 'points'>,
  options: EdgeLabelOptions,
): EdgeLabelPlacement {
  const { box, size = EDGE_LABEL_SIZE, inset = 2 } = options;
  const [midX, lineY] = edge.points[Math.floor(edge.points.length / 2)];
  const shown = shortenedTo(edge.label, box.right - box.left - 2 * inset, size);
  const half = textWidth(shown, size) / 2;
  // A horizontal label is centred on the run unless that would cross a side of the box.
  const [x, anchor]: [number, LabelAnchor] =
    midX + half > box.right - inset
      ? [box.right - inset, 'end']
      : midX - half < box.left + inset
        ? [box.left + inset, 'start']
        : [midX, 'middle'];
  // The baseline: the text's ascent above it and descent below it (DejaVu Sans, about 0.76 and 0.24 em).
  const ascent = 0.76 * size;
  const descent = 0.24 * size;
  const below = lineY + 4 + ascent;
  const above = lineY - 4 - descent;
  const fitsBelow = below + descent <= box.bottom - inset;
  const fitsAbove = above - ascent >= box.top + inset;
  const preferred =
    edge.side === 'lower' ? (fitsBelow || !fitsAbove ? below : above) : fitsAbove || !fitsBelow ? above : below;
  const y = Math.min(box.bottom - inset - descent, Math.max(box.top + inset + ascent, preferred));
  return { at: [x, y], anchor, shown };
}

/** `text` whole when it is at most `room` px wide at `size`, else its longest start that fits with an ellipsis. */
function shortenedTo(text: string, room: number, size: number): string {
  if (textWidth(text, size) <= room) return text;
  const chars = Array.from(text);
  for (let n = chars.length - 1; n > 0; n--) {
    const cut = `${chars.slice(0, n).join('').trimEnd()}…`;
    if (textWidth(cut, size) <= room) return cut;
  }
  return '…';
}

/** 1, 2, 5 × 10ⁿ between `min` and `max`. */
function niceLogTicks(min: number, max: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(min)); e <= Math.ceil(Math.log10(max)); e++)
    for (const m of [1, 2, 5]) ticks.push(Number((m * Math.pow(10, e)).toPrecision(3)));
  return ticks;
}

/**
 * Whether a pair of settings lies in the map's feasible region: the time setting within an interval of
 * the column nearest the pickup (the columns are the pickups solved). Judged in setting units, not by
 * the drawn cells, which are widened to stay visible.
 *
 * @example keepsEveryConstraint(window.maps[0], 4, 0.25) // true where 0.25 s lies in the 4 × column's interval
 */
export function keepsEveryConstraint(map: Pick<FeasibleMap, 'columns'>, x: number, y: number): boolean {
  let nearest: FeasibleMap['columns'][number] | undefined;
  for (const column of map.columns)
    if (!nearest || Math.abs(Math.log(column.x / x)) < Math.abs(Math.log(nearest.x / x))) nearest = column;
  return (nearest?.intervals ?? []).some((i) => y >= i.from * (1 - 1e-9) && y <= i.to * (1 + 1e-9));
}
