import type { Box } from '../plot/geometry.ts';
import type { Drawing } from '../plot/svg.ts';

/** How a figure too large to print legibly on one page is split into tiles, in points on the page. */
export const figureTileDefaults = {
  /** pt: the size a tile prints a figure's smallest text at. */
  legibleText: 6,
  /** pt: how much of the drawing neighbouring tiles both show, so a label on a seam is whole on one of them. */
  overlap: 36,
  /**
   * How much larger than the whole-page fit a tile must print the drawing for tiling to be worth its
   * pages, so a figure is tiled only where fitted whole its smallest text prints below 4.8 pt. A
   * time-current sheet fitted to Letter portrait prints its 9.68-px tick labels at 5.2 pt: tiles would
   * each repeat most of a sheet that is read as a whole, for 1.15 times the size. The whole-site
   * one-line of the demo gains 2.4 times.
   */
  minGain: 1.25,
  /**
   * Tiles from which an index of what a reader looks for on the figure (a one-line's buses) follows
   * them, giving each one's part and page: a few tiles are read through, many are looked things up in.
   */
  indexedFrom: 8,
} as const;

/** One tile: the window of the drawing it shows (in the drawing's px) and its place in the grid, counted from 1. */
export interface FigureTile {
  window: Box;
  row: number;
  column: number;
}

/** A figure's tiles, row by row, and the scale (pt per drawing px) they all print at. */
export interface FigureTiling {
  scale: number;
  rows: number;
  columns: number;
  tiles: FigureTile[];
}

/**
 * The size of a drawing's smallest text, in its px, or Infinity when it has none. Measured from the
 * text items rather than taken from the one-line's nominal 11-px labels, so the device marks inside
 * its symbols ("51", "?" at 8 px) stay legible on a tile too, and any figure is judged by what it holds.
 * @example smallestTextSize(oneLineOf(analysis)) // 8
 */
export function smallestTextSize(drawing: Drawing): number {
  let smallest = Infinity;
  for (const layer of drawing.layers)
    for (const item of layer.items)
      if (item.type === 'text' && item.text !== '') smallest = Math.min(smallest, item.size);
  return smallest;
}

/**
 * Splits a drawing into tiles when fitting it whole (at `fit` pt per px) prints its smallest text
 * below `legibleText` pt and tiles at `legibleText` would print it at least `minGain` times larger;
 * otherwise null, and the figure prints whole (as it does when there is no `room`, in pt, for a tile).
 * Each tile fills at most `room` at the legible scale; tiles step evenly across the drawing,
 * neighbours sharing at least `overlap` pt, the first starting at its top-left corner and the last
 * ending at its bottom-right. Deterministic.
 * @example figureTilingOf(oneLine, 0.3, { width: 516, height: 620 })?.tiles.length // 6
 */
export function figureTilingOf(
  drawing: Drawing,
  fit: number,
  room: Pick<Box, 'width' | 'height'>,
): FigureTiling | null {
  const { legibleText, overlap, minGain } = figureTileDefaults;
  const scale = legibleText / smallestTextSize(drawing);
  if (!(scale >= fit * minGain && room.width > 0 && room.height > 0)) return null;
  const across = spansOf(drawing.width, room.width / scale, overlap / scale);
  const down = spansOf(drawing.height, room.height / scale, overlap / scale);
  const tiles = down.flatMap(([y, height], r) =>
    across.map(([x, width], c): FigureTile => ({ window: { x, y, width, height }, row: r + 1, column: c + 1 })),
  );
  return { scale, rows: down.length, columns: across.length, tiles };
}

// Accepts a length to cover, the most one window shows and the least neighbours share (all px); each
// window's start and length. Windows are spread evenly, so the overlap is shared out rather than piled on the last.
function spansOf(length: number, most: number, overlap: number): [number, number][] {
  if (most >= length) return [[0, length]];
  // A window no wider than the overlap would never advance: keep a third of it new.
  const shared = Math.min(overlap, (2 * most) / 3);
  const count = Math.ceil((length - shared) / (most - shared));
  const step = (length - most) / (count - 1);
  return Array.from({ length: count }, (_, i) => [i === count - 1 ? length - most : i * step, most]);
}
