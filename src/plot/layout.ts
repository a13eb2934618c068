import { segmentCrossesBox } from './clip.ts';
import { boxInside, boxesOverlap, type Box } from './geometry.ts';

/** One place a label may go, and how much we would rather not put it there (0 = ideal). */
export interface LabelCandidate {
  box: Box;
  cost: number;
}

/** A label to place: its size, the point it names and the places it may go, best first or not. */
export interface LabelRequest {
  id: string;
  width: number;
  height: number;
  /** The pixel the label names (a point on its curve, a marker); the fallback search starts here. */
  anchor: [number, number];
  candidates: LabelCandidate[];
}

/** Where a label went; `leader` is a line from its anchor to the box when the box had to move away. */
export interface LabelPlacement {
  id: string;
  box: Box;
  leader: [number, number, number, number] | null;
}

/** Options of the label layout. */
export interface LayoutOptions {
  /** Every label box must lie inside this (the plot area). */
  bounds: Box;
  /** Boxes no label may overlap (text already placed by other means). */
  obstacles?: Box[];
  /** Curve lines (interleaved pixels); a label crossing one pays `lineCost` per segment. */
  lines?: Float64Array[];
  /** The id of the request each line belongs to (same order as `lines`), if any. */
  lineOwners?: (string | undefined)[];
  /** A label this close (px) to another request's line pays `nearCost` per segment, so it reads as its own curve's. @default 6 */
  nearGap?: number;
  /** @default 1 */
  nearCost?: number;
  /** Cost of a label box crossing one curve segment. @default 4 */
  lineCost?: number;
  /** Clear space kept between label boxes, px. @default 1 */
  gap?: number;
  /** Grid step of the fallback search, px. @default 6 */
  searchStep?: number;
  /** How far from its anchor (px) the fallback search looks for a free spot. @default 240 */
  searchRadius?: number;
  /** How many labels may use the fallback search; later ones with no free candidate are unplaced. @default 40 */
  searchLimit?: number;
}

/** Side of a cell of the spatial grids, px. */
const CELL = 32;

/**
 * Places labels one after another, each in its cheapest candidate box that lies inside `bounds`,
 * overlaps no placed label or obstacle (with `gap` px to spare), counting the curve segments it
 * would cover. A label with no free candidate is put in the nearest free spot of a grid around its
 * anchor (within `searchRadius` px), with a leader line back to its anchor. Boxes never overlap; a
 * label that finds no spot at all is listed in `unplaced`. Curve segments and placed boxes are kept
 * in a coarse grid of cells, so the work grows with the number of labels and segments, not their
 * product.
 * @example placeLabels([request], { bounds }).placed[0].box
 */
export function placeLabels(
  requests: LabelRequest[],
  options: LayoutOptions,
): { placed: LabelPlacement[]; unplaced: string[] } {
  const { bounds, obstacles = [], lines = [], lineOwners = [], lineCost = 4, gap = 1, searchStep = 6 } = options;
  const { nearGap = 6, nearCost = 1, searchRadius = 240, searchLimit = 40 } = options;
  // Every box counted lies inside the bounds, grown by `nearGap` for the near count; a cell more to spare.
  const segments = new SegmentIndex(lines, lineOwners, CELL, grow(bounds, nearGap + CELL));
  const taken = new BoxIndex(CELL);
  for (const o of obstacles) taken.add(o);
  const placed: LabelPlacement[] = [];
  const unplaced: string[] = [];
  const free = (box: Box) => boxInside(box, bounds) && !taken.overlaps(grow(box, gap));
  let searches = 0;

  for (const request of requests) {
    // The crossings' cost, counted only as far as `budget` (a box already dearer than the best is not counted out).
    const lineCosts = (box: Box, budget = Infinity) => {
      const crossing = lineCost * segments.count(box, undefined, budget / lineCost);
      if (crossing >= budget) return crossing;
      return crossing + nearCost * segments.count(grow(box, nearGap), request.id, (budget - crossing) / nearCost);
    };
    let best: LabelCandidate | null = null;
    let bestCost = Infinity;
    for (const candidate of request.candidates) {
      if (candidate.cost >= bestCost || !free(candidate.box)) continue;
      const cost = candidate.cost + lineCosts(candidate.box, bestCost - candidate.cost);
      if (cost < bestCost) {
        best = candidate;
        bestCost = cost;
      }
    }
    let leader: LabelPlacement['leader'] = null;
    // The wider search is bounded in reach and in count, so a crowded sheet stays quick; the rest go to the key.
    if (!best && searches < searchLimit) {
      searches++;
      best = searchFree(request, bounds, searchStep, searchRadius, free, lineCosts);
      if (best) leader = leaderOf(request.anchor, best.box);
    }
    if (!best) {
      unplaced.push(request.id);
      continue;
    }
    taken.add(best.box);
    placed.push({ id: request.id, box: best.box, leader });
  }
  return { placed, unplaced };
}

/**
 * The eight places around a point a label of `width` × `height` px may take, `gap` px from it, with
 * the costs of a reader's preference: above right first, then right, above, below right, and so on.
 * @example candidatesAround([100, 100], 40, 12, 3)[0].box // { x: 103, y: 85, width: 40, height: 12 }
 */
export function candidatesAround(
  anchor: readonly [number, number],
  width: number,
  height: number,
  gap: number,
  baseCost = 0,
): LabelCandidate[] {
  // Written out, with no list of places to read back: a sheet asks for two dozen sets per curve.
  const x = anchor[0];
  const y = anchor[1];
  const candidate = (left: number, top: number, cost: number): LabelCandidate => ({
    box: { x: left, y: top, width, height },
    cost: cost + baseCost,
  });
  return [
    candidate(x + gap, y - gap - height, 0),
    candidate(x + gap, y - height / 2, 0.4),
    candidate(x - width / 2, y - gap - height, 0.8),
    candidate(x + gap, y + gap, 1),
    candidate(x - gap - width, y - gap - height, 1.2),
    candidate(x - gap - width, y - height / 2, 1.5),
    candidate(x - width / 2, y + gap, 1.5),
    candidate(x - gap - width, y + gap, 2),
  ];
}

/**
 * Points spread evenly by length along a polyline (interleaved pixels), at fractions
 * (i + 0.5) / count of its length; the anchors a curve's label is tried at.
 * @example pointsAlong(new Float64Array([0, 0, 100, 0]), 2) // [[25, 0], [75, 0]]
 */
export function pointsAlong(polyline: Float64Array, count: number): [number, number][] {
  const n = polyline.length / 2;
  if (n === 0) return [];
  if (n === 1) return [[polyline[0], polyline[1]]];
  const lengths = [0];
  for (let i = 1; i < n; i++)
    lengths.push(
      lengths[i - 1] + Math.hypot(polyline[2 * i] - polyline[2 * i - 2], polyline[2 * i + 1] - polyline[2 * i - 1]),
    );
  const total = lengths[n - 1];
  const out: [number, number][] = [];
  let j = 1;
  for (let k = 0; k < count; k++) {
    const target = (total * (k + 0.5)) / count;
    while (j < n - 1 && lengths[j] < target) j++;
    const span = lengths[j] - lengths[j - 1];
    const f = span > 0 ? (target - lengths[j - 1]) / span : 0;
    out.push([
      polyline[2 * j - 2] + f * (polyline[2 * j] - polyline[2 * j - 2]),
      polyline[2 * j - 1] + f * (polyline[2 * j + 1] - polyline[2 * j - 1]),
    ]);
  }
  return out;
}

// Accepts a request with no free candidate; the free grid spot nearest its anchor within `radius`, counting crossings.
function searchFree(
  request: LabelRequest,
  bounds: Box,
  step: number,
  radius: number,
  free: (box: Box) => boolean,
  crossingCost: (box: Box, budget?: number) => number,
): LabelCandidate | null {
  const { width, height, anchor } = request;
  let best: LabelCandidate | null = null;
  const x0 = Math.max(bounds.x + 2, anchor[0] - radius - width);
  const x1 = Math.min(bounds.x + bounds.width - 2 - width, anchor[0] + radius);
  const y0 = Math.max(bounds.y + 2, anchor[1] - radius - height);
  const y1 = Math.min(bounds.y + bounds.height - 2 - height, anchor[1] + radius);
  for (let y = y0; y <= y1; y += step) {
    for (let x = x0; x <= x1; x += step) {
      const box = { x, y, width, height };
      const [lx, ly] = nearestPoint(anchor, box);
      const distanceCost = Math.hypot(lx - anchor[0], ly - anchor[1]) / 10;
      if (best && distanceCost >= best.cost) continue;
      if (!free(box)) continue;
      const cost: number = distanceCost + crossingCost(box, best ? best.cost - distanceCost : Infinity);
      if (!best || cost < best.cost) best = { box, cost };
    }
  }
  return best;
}

// Accepts an anchor and a box; the leader from the anchor to the box's nearest point.
function leaderOf(anchor: [number, number], box: Box): [number, number, number, number] {
  const [x, y] = nearestPoint(anchor, box);
  return [anchor[0], anchor[1], x, y];
}

// Accepts a point and a box; the point of the box closest to it.
function nearestPoint([x, y]: [number, number], box: Box): [number, number] {
  return [Math.min(Math.max(x, box.x), box.x + box.width), Math.min(Math.max(y, box.y), box.y + box.height)];
}

// Accepts curve lines and their owners; answers how many segments touch a box, through a grid of cells
// over `area`, which every box asked about lies within (segments outside it are never counted). A
// layout asks this of every candidate box of every label (a sheet's curve label has 192), so the loops
// below call no function per cell and allocate nothing per query.
class SegmentIndex {
  /** Each cell's segments, row by row over the area. */
  readonly #cells: (number[] | undefined)[];
  readonly #owners: (string | undefined)[];
  /** Each segment's line, and its end points (x0, y0, x1, y1) four apart. */
  readonly #segLine: Int32Array;
  readonly #ends: Float64Array;
  /** Per segment, the last query that counted it, so a segment in several cells counts once. */
  readonly #seen: Int32Array;
  #query = 0;
  readonly #cell: number;
  /** The area's first and last column and row of cells. */
  readonly #columns: [number, number];
  readonly #rows: [number, number];

  constructor(lines: Float64Array[], owners: (string | undefined)[], cell: number, area: Box) {
    this.#owners = owners;
    this.#cell = cell;
    // An area squeezed to nothing (a sheet too small for its strip) still has one cell, not a negative count.
    const [firstColumn, lastColumn] = (this.#columns = [
      Math.floor(area.x / cell),
      Math.floor((area.x + Math.max(0, area.width)) / cell),
    ]);
    const [firstRow, lastRow] = (this.#rows = [
      Math.floor(area.y / cell),
      Math.floor((area.y + Math.max(0, area.height)) / cell),
    ]);
    const width = lastColumn - firstColumn + 1;
    const cells = (this.#cells = new Array<number[] | undefined>(width * (lastRow - firstRow + 1)));
    let segments = 0;
    for (const line of lines) segments += Math.max(0, (line.length >> 1) - 1);
    const segLine = (this.#segLine = new Int32Array(segments));
    const ends = (this.#ends = new Float64Array(4 * segments));
    this.#seen = new Int32Array(segments);
    let id = 0;
    lines.forEach((line, l) => {
      for (let i = 0; i + 3 < line.length; i += 2, id++) {
        segLine[id] = l;
        const ax = line[i];
        const ay = line[i + 1];
        const bx = line[i + 2];
        const by = line[i + 3];
        ends[4 * id] = ax;
        ends[4 * id + 1] = ay;
        ends[4 * id + 2] = bx;
        ends[4 * id + 3] = by;
        if (!(Number.isFinite(ax) && Number.isFinite(ay) && Number.isFinite(bx) && Number.isFinite(by))) continue;
        const c0 = Math.max(firstColumn, Math.floor(Math.min(ax, bx) / cell));
        const c1 = Math.min(lastColumn, Math.floor(Math.max(ax, bx) / cell));
        const r0 = Math.max(firstRow, Math.floor(Math.min(ay, by) / cell));
        const r1 = Math.min(lastRow, Math.floor(Math.max(ay, by) / cell));
        for (let r = r0; r <= r1; r++)
          for (let c = c0; c <= c1; c++) {
            const at = (r - firstRow) * width + (c - firstColumn);
            const list = cells[at];
            if (list) list.push(id);
            else cells[at] = [id];
          }
      }
    });
  }

  /**
   * Segments touching the box; with `notOwnedBy`, only those of lines that have an owner other than it.
   * Stops counting once the count passes `limit`.
   */
  count(box: Box, notOwnedBy?: string, limit = Infinity): number {
    const query = ++this.#query;
    const cells = this.#cells;
    const seen = this.#seen;
    const ends = this.#ends;
    const cell = this.#cell;
    const [firstColumn, lastColumn] = this.#columns;
    const [firstRow, lastRow] = this.#rows;
    const width = lastColumn - firstColumn + 1;
    const span = cellsTouched(box, cell);
    const c0 = Math.max(firstColumn, span[0]);
    const c1 = Math.min(lastColumn, span[1]);
    const r0 = Math.max(firstRow, span[2]);
    const r1 = Math.min(lastRow, span[3]);
    let count = 0;
    for (let r = r0; r <= r1; r++)
      for (let c = c0; c <= c1; c++) {
        const list = cells[(r - firstRow) * width + (c - firstColumn)];
        if (list === undefined) continue;
        for (let k = 0; k < list.length; k++) {
          if (count > limit) return count;
          const id = list[k];
          if (seen[id] === query) continue;
          seen[id] = query;
          if (notOwnedBy !== undefined) {
            const owner = this.#owners[this.#segLine[id]];
            if (owner === undefined || owner === notOwnedBy) continue;
          }
          const at = 4 * id;
          if (segmentCrossesBox(ends[at], ends[at + 1], ends[at + 2], ends[at + 3], box)) count++;
        }
      }
    return count;
  }
}

// Accepts boxes as they are placed; answers whether a box overlaps any, through a grid of cells.
class BoxIndex {
  readonly #cells = new Map<number, Box[]>();
  readonly #cell: number;
  constructor(cell: number) {
    this.#cell = cell;
  }
  add(box: Box): void {
    const span = cellsTouched(box, this.#cell);
    const c0 = span[0];
    const c1 = span[1];
    const r0 = span[2];
    const r1 = span[3];
    for (let r = r0; r <= r1; r++)
      for (let c = c0; c <= c1; c++) {
        const key = cellKey(r, c);
        const list = this.#cells.get(key);
        if (list) list.push(box);
        else this.#cells.set(key, [box]);
      }
  }
  overlaps(box: Box): boolean {
    const span = cellsTouched(box, this.#cell);
    const c0 = span[0];
    const c1 = span[1];
    const r0 = span[2];
    const r1 = span[3];
    for (let r = r0; r <= r1; r++)
      for (let c = c0; c <= c1; c++) {
        const list = this.#cells.get(cellKey(r, c));
        if (list === undefined) continue;
        for (let k = 0; k < list.length; k++) if (boxesOverlap(box, list[k])) return true;
      }
    return false;
  }
}

/** The first and last column and row of the cells a box touches, as `cellsTouched` last wrote them. */
const touched = new Float64Array(4);

// Accepts a box and the cells' side; the first and last column and row of the cells it touches, in a
// scratch array the next call overwrites (a layout asks this of every candidate box).
function cellsTouched(box: Box, cell: number): Float64Array {
  touched[0] = Math.floor(box.x / cell);
  touched[1] = Math.floor((box.x + box.width) / cell);
  touched[2] = Math.floor(box.y / cell);
  touched[3] = Math.floor((box.y + box.height) / cell);
  return touched;
}

// Accepts a grid cell's row and column; its key in a cell map.
function cellKey(row: number, column: number): number {
  return (row + 4096) * 8192 + (column + 4096);
}

// Accepts a box; the same box grown by `by` px on every side.
function grow(box: Box, by: number): Box {
  return { x: box.x - by, y: box.y - by, width: box.width + 2 * by, height: box.height + 2 * by };
}
