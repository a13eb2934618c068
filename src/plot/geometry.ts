/**
 * The drawing primitives a sheet is made of: plain, structured-cloneable objects in pixel
 * coordinates (origin top left, y down). Marks produce them; `svg.ts` writes them out and the
 * workbench renders the same objects.
 */

/** An axis-aligned box in pixels: `x`, `y` is the top-left corner. */
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Stroke and fill shared by the shapes. Colours are CSS hex strings; `'none'` leaves a part unpainted. */
export interface Paint {
  stroke?: string;
  /** Stroke width in px. */
  strokeWidth?: number;
  /** SVG dash array in px, e.g. `'7 4'`; omitted for a solid line. */
  dash?: string;
  fill?: string;
  /** 0–1. */
  fillOpacity?: number;
  /** 0–1. */
  strokeOpacity?: number;
  /** Paints the fill with the sheet's hatch pattern of this id instead of `fill`. */
  patternId?: string;
  /** Line ends; round caps turn a short dash into a dot. @default 'butt' */
  lineCap?: 'butt' | 'round';
}

/** What a primitive stands for, so tests, the probe and the findings panel can find it. */
export interface Tagged {
  /** e.g. `'band-fill'`, `'band-max'`, `'tick-label'`. */
  role: string;
  /** Id of the curve, bus or finding it belongs to. */
  dataId?: string;
}

/**
 * A path: `d` is the SVG path string (rounded once, by `pathOf`); `points` keeps the same
 * polyline unrounded as interleaved `[x0, y0, x1, y1, …]` pixels when the path is a polyline.
 */
export interface PathItem extends Paint, Tagged {
  type: 'path';
  d: string;
  points?: Float64Array;
}

/** A rectangle (frames, legend swatches, the title block). */
export interface RectItem extends Paint, Tagged, Box {
  type: 'rect';
}

/** One line of text. `x`, `y` is the anchor point on the baseline; `rotate` turns it about that point (degrees, clockwise). */
export interface TextItem extends Tagged {
  type: 'text';
  x: number;
  y: number;
  text: string;
  /** Font size in px. */
  size: number;
  anchor: 'start' | 'middle' | 'end';
  fill: string;
  weight?: 'normal' | 'bold';
  rotate?: number;
}

/** Anything the sheet draws. */
export type Primitive = PathItem | RectItem | TextItem;

/** A tiling hatch used to fill regions: parallel lines `spacing` px apart at `angle` degrees (two sets when `cross`). */
export interface HatchPattern {
  id: string;
  colour: string;
  angle: number;
  spacing: number;
  strokeWidth: number;
  cross: boolean;
}

/** A named group of primitives drawn together, in order; later layers paint over earlier ones. */
export interface Layer {
  name: string;
  items: Primitive[];
}

/**
 * True when two boxes share interior area (touching edges do not count).
 * @example boxesOverlap({ x: 0, y: 0, width: 10, height: 10 }, { x: 10, y: 0, width: 5, height: 5 }) // false
 */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * True when `inner` lies wholly inside `outer`.
 * @example boxInside({ x: 1, y: 1, width: 2, height: 2 }, { x: 0, y: 0, width: 10, height: 10 }) // true
 */
export function boxInside(inner: Box, outer: Box): boolean {
  return (
    inner.x >= outer.x &&
    inner.y >= outer.y &&
    inner.x + inner.width <= outer.x + outer.width &&
    inner.y + inner.height <= outer.y + outer.height
  );
}
