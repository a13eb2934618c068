import type { PathItem, Primitive } from '../geometry.ts';
import type { LabelCandidate, LabelPlacement } from '../layout.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { textWidth, type FontWeight } from '../textWidth.ts';

/** How curve and line labels are drawn: on a near-white backdrop so they read over the grid. */
export const labelDefaults = {
  /** px around the text inside its box */
  padX: 2,
  padY: 1,
  backdropOpacity: 0.85,
  /** px */
  leaderWidth: 0.9,
} as const;

/** A label a mark asks for: its text and look, the point it names and the boxes it may take. */
export interface LabelSpec {
  id: string;
  /** Id of the curve or line it names. */
  dataId: string;
  text: string;
  colour: string;
  /** px */
  size: number;
  weight?: FontWeight;
  /** -90 sets the text reading upward, as along a vertical line. */
  rotate?: 0 | -90;
  anchor: [number, number];
  candidates: LabelCandidate[];
}

/** Options of the label mark. */
export interface LabelOptions {
  /** Draw a backdrop behind the text. @default true */
  backdrop?: boolean;
}

/**
 * The box a label of this text takes, in px, before it is placed (turned for `rotate: -90`).
 * @example labelSize('MAIN', 11) // { width: ≈ 31.5, height: ≈ 14.9 }
 */
export function labelSize(
  text: string,
  size: number,
  weight: FontWeight = 'normal',
  rotate: 0 | -90 = 0,
): { width: number; height: number } {
  const along = textWidth(text, size, weight) + 2 * labelDefaults.padX;
  const across = size * 1.17 + 2 * labelDefaults.padY;
  return rotate === -90 ? { width: across, height: along } : { width: along, height: across };
}

/**
 * The primitives of a placed label: its backdrop, the leader line (when it was moved off its
 * anchor) and the text, positioned in its box.
 * @example labelItems(spec, placement, {}).map((p) => p.role) // ['label-backdrop', 'label']
 */
export function labelItems(spec: LabelSpec, placement: LabelPlacement, options: LabelOptions): Primitive[] {
  const { backdrop = true } = options;
  const { box, leader } = placement;
  const items: Primitive[] = [];
  if (backdrop)
    items.push({
      type: 'rect',
      role: 'label-backdrop',
      dataId: spec.dataId,
      ...box,
      fill: SHEET_COLOURS.halo,
      fillOpacity: labelDefaults.backdropOpacity,
      stroke: 'none',
    });
  if (leader) items.push(leaderPath(spec, leader));
  const { padX, padY } = labelDefaults;
  const ascent = spec.size * 0.93;
  const upward = spec.rotate === -90;
  items.push({
    type: 'text',
    role: 'label',
    dataId: spec.dataId,
    x: upward ? box.x + padY + ascent : box.x + padX,
    y: upward ? box.y + box.height - padX : box.y + padY + ascent,
    text: spec.text,
    size: spec.size,
    anchor: 'start',
    fill: spec.colour,
    weight: spec.weight ?? 'normal',
    ...(upward ? { rotate: -90 } : {}),
  });
  return items;
}

// Accepts a leader from the anchor to the box; a thin line in the label's colour.
function leaderPath(spec: LabelSpec, leader: [number, number, number, number]): PathItem {
  return {
    type: 'path',
    role: 'label-leader',
    dataId: spec.dataId,
    d: pathOf(leader),
    stroke: spec.colour,
    strokeWidth: labelDefaults.leaderWidth,
    fill: 'none',
  };
}
