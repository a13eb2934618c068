import type { Box } from './geometry.ts';

/**
 * Clips a polyline (interleaved pixel coordinates `[x0, y0, x1, y1, …]`) to a box and returns the
 * pieces that lie inside, each as its own interleaved array, in drawing order. Segment by segment
 * with the Liang–Barsky method, so a piece enters and leaves exactly on the box edge; a piece that
 * touches the box in a single point is dropped. Non-finite points split the line.
 * @example clipPolyline(new Float64Array([-10, 5, 20, 5]), { x: 0, y: 0, width: 10, height: 10 }) // [Float64Array [0, 5, 10, 5]]
 */
export function clipPolyline(points: ArrayLike<number>, box: Box): Float64Array[] {
  const pieces: Float64Array[] = [];
  let current: number[] = [];
  const flush = () => {
    if (current.length >= 4) pieces.push(Float64Array.from(current));
    current = [];
  };
  for (let i = 0; i + 3 < points.length; i += 2) {
    const segment = clipSegment(points[i], points[i + 1], points[i + 2], points[i + 3], box);
    if (!segment) {
      flush();
      continue;
    }
    const [ax, ay, bx, by] = segment;
    const n = current.length;
    const continues = n >= 2 && current[n - 2] === ax && current[n - 1] === ay;
    if (!continues) {
      flush();
      current.push(ax, ay);
    }
    current.push(bx, by);
    // A segment that leaves the box ends its piece.
    if (bx !== points[i + 2] || by !== points[i + 3]) flush();
  }
  flush();
  return pieces;
}

/**
 * True when the segment from (x0, y0) to (x1, y1) passes through or touches the box.
 * @example segmentCrossesBox(0, 0, 10, 10, { x: 4, y: 4, width: 2, height: 2 }) // true
 */
export function segmentCrossesBox(x0: number, y0: number, x1: number, y1: number, box: Box): boolean {
  if (Math.max(x0, x1) < box.x || Math.min(x0, x1) > box.x + box.width) return false;
  if (Math.max(y0, y1) < box.y || Math.min(y0, y1) > box.y + box.height) return false;
  // A point, or a segment whose clipped part has length, touches the box.
  return clippedSpan(x0, y0, x1, y1, box) || (x0 === x1 && y0 === y1);
}

// Accepts one segment's end points; returns the part inside the box, or null when none is.
function clipSegment(
  x0: number,
  y0: number,
  x1: number,
  y1: number,
  box: Box,
): [number, number, number, number] | null {
  if (!clippedSpan(x0, y0, x1, y1, box)) return null;
  const [t0, t1] = span;
  const dx = x1 - x0;
  const dy = y1 - y0;
  const ax = t0 === 0 ? x0 : x0 + t0 * dx;
  const ay = t0 === 0 ? y0 : y0 + t0 * dy;
  const bx = t1 === 1 ? x1 : x0 + t1 * dx;
  const by = t1 === 1 ? y1 : y0 + t1 * dy;
  return [ax, ay, bx, by];
}

/** The parameters (0 to 1 along the segment) where the last clipped segment enters and leaves the box. */
const span = new Float64Array(2);

// Accepts one segment's end points; true when a part of it lies inside the box (the Liang–Barsky
// method), its span left in `span`. Numbers only, no arrays: label placement asks this of thousands of
// segments per layout.
function clippedSpan(x0: number, y0: number, x1: number, y1: number, box: Box): boolean {
  if (!(Number.isFinite(x0) && Number.isFinite(y0) && Number.isFinite(x1) && Number.isFinite(y1))) return false;
  const dx = x1 - x0;
  const dy = y1 - y0;
  let t0 = 0;
  let t1 = 1;
  for (let edge = 0; edge < 4; edge++) {
    const p = edge === 0 ? -dx : edge === 1 ? dx : edge === 2 ? -dy : dy;
    const q =
      edge === 0 ? x0 - box.x : edge === 1 ? box.x + box.width - x0 : edge === 2 ? y0 - box.y : box.y + box.height - y0;
    if (p === 0) {
      if (q < 0) return false;
      continue;
    }
    const r = q / p;
    if (p < 0) t0 = Math.max(t0, r);
    else t1 = Math.min(t1, r);
    if (t0 > t1) return false;
  }
  if (t0 === t1 && !(dx === 0 && dy === 0)) return false;
  span[0] = t0;
  span[1] = t1;
  return true;
}
