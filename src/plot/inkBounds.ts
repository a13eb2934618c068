import type { Primitive, TextItem } from './geometry.ts';
import { pathStepsOf } from './pdf/pathData.ts';

/** A box by its edges, in a drawing's px: left, top, right, bottom. */
export type Edges = readonly [number, number, number, number];

/**
 * The box any ink of a primitive may fall in, in its drawing's px: generous, strokes widened for miter
 * joins (limit 4), text taken as a circle of its advance plus 1.5 em about its anchor, whatever its
 * anchor and turn. `advanceOf` gives a text's advance in em, in the face it is drawn in. What is drawn
 * in part of a large drawing (a tile of a printed one-line, the panel's view of it) is what reaches it.
 *
 * @example inkBoundsOf({ type: 'rect', role: 'box', x: 0, y: 0, width: 10, height: 5, fill: '#fff' }, () => 0) // [-2, -2, 12, 7]
 */
export function inkBoundsOf(item: Primitive, advanceOf: (text: TextItem) => number): Edges {
  let [left, top, right, bottom] = [Infinity, Infinity, -Infinity, -Infinity];
  const take = (x: number, y: number) => {
    [left, top, right, bottom] = [Math.min(left, x), Math.min(top, y), Math.max(right, x), Math.max(bottom, y)];
  };
  let pad: number;
  if (item.type === 'text') {
    pad = (advanceOf(item) + 1.5) * item.size;
    take(item.x, item.y);
  } else if (item.type === 'rect') {
    pad = 2 * (item.strokeWidth ?? 1);
    take(item.x, item.y);
    take(item.x + item.width, item.y + item.height);
  } else {
    pad = 2 * (item.strokeWidth ?? 1);
    for (const step of pathStepsOf(item.d)) {
      if (step.op === 'C') take(step.x1, step.y1);
      if (step.op === 'C') take(step.x2, step.y2);
      if (step.op !== 'Z') take(step.x, step.y);
    }
  }
  return [left - pad, top - pad, right + pad, bottom + pad];
}
