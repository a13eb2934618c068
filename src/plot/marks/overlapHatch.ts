import { significant } from '../../engine/quantity/format.ts';
import type { HatchPattern, PathItem, RectItem } from '../geometry.ts';
import type { LabelCandidate } from '../layout.ts';
import { OKABE_ITO } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { drawBoxOf, pixelOf, type SheetScales } from '../scales.ts';
import type { RegionStatus, SheetRegion } from '../sheetInput.ts';
import { labelSize, type LabelSpec } from './label.ts';

/** How each region status is hatched: its own colour, angle and spacing, so none relies on colour alone. */
export const overlapHatchDefaults: Record<RegionStatus, Omit<HatchPattern, 'id'>> = {
  overlap: { colour: OKABE_ITO.vermillion, angle: 45, spacing: 7, strokeWidth: 0.9, cross: false },
  'thin margin': { colour: OKABE_ITO.reddishPurple, angle: -45, spacing: 9, strokeWidth: 0.9, cross: false },
  'not provable from curves': { colour: OKABE_ITO.blue, angle: 0, spacing: 10, strokeWidth: 0.8, cross: true },
};

/** Options of the region mark. */
export interface OverlapHatchOptions {
  /** Id of the sheet's hatch pattern for this region's status. */
  patternId: string;
  /** Label size in px. */
  fontSize: number;
  /** Opacity of the hatch lines, 0–1. @default 0.8 */
  opacity?: number;
}

/** A region's drawing and its label request. */
export interface OverlapHatchGeometry {
  items: (RectItem | PathItem)[];
  label: LabelSpec | null;
}

/**
 * Hatches a current interval a finding marks (overlap, thin margin, not provable from curves) over
 * the draw window's height, edges drawn as thin verticals, with a label of its status and current
 * range ("overlap 3.2–12 kA") asked for near the foot of the plot.
 * @example overlapHatch(region, 0, scales, { patternId: 'tcc-hatch-1', fontSize: 11 }).label?.text // 'overlap 3.2–12 kA'
 */
export function overlapHatch(
  region: SheetRegion,
  index: number,
  scales: SheetScales,
  options: OverlapHatchOptions,
): OverlapHatchGeometry {
  const { patternId, fontSize, opacity = 0.8 } = options;
  const [low, high] = scales.x.domain;
  const from = Math.max(low, region.fromAmps);
  const to = Math.min(high, region.toAmps);
  if (!(to > from)) return { items: [], label: null };
  const box = drawBoxOf(scales);
  const x0 = pixelOf(scales.x, from);
  const x1 = pixelOf(scales.x, to);
  const { colour } = overlapHatchDefaults[region.status];
  const dataId = region.findingId;
  const role = `region-${region.status.replaceAll(' ', '-')}`;
  const edges = new Float64Array([x0, box.y + box.height, x0, box.y, x1, box.y, x1, box.y + box.height]);
  const items: (RectItem | PathItem)[] = [
    {
      type: 'rect',
      role,
      dataId,
      x: x0,
      y: box.y,
      width: x1 - x0,
      height: box.height,
      patternId,
      fillOpacity: opacity,
      stroke: 'none',
    },
    {
      type: 'path',
      role: `${role}-edges`,
      dataId,
      d: pathOf(edges.subarray(0, 4)) + pathOf(edges.subarray(4)),
      stroke: colour,
      strokeWidth: 0.8,
      strokeOpacity: opacity,
      fill: 'none',
    },
  ];
  const text = `${region.status} ${formatRange(region.fromAmps, region.toAmps)}`;
  const size = fontSize * 0.9;
  const { width, height } = labelSize(text, size, 'bold');
  const centre = (x0 + x1) / 2 - width / 2;
  const foot = box.y + box.height - height - 3;
  const candidates: LabelCandidate[] = [0, 1, 2, 3, 4, 5, 6, 7].flatMap((k) => [
    { box: { x: centre, y: foot - (height + 3) * k, width, height }, cost: k },
    { box: { x: centre, y: box.y + 3 + (height + 3) * k, width, height }, cost: k + 0.5 },
  ]);
  const label: LabelSpec = {
    id: `region:${index}`,
    dataId,
    text,
    colour,
    size,
    weight: 'bold',
    anchor: [(x0 + x1) / 2, foot],
    candidates,
  };
  return { items, label };
}

/**
 * A current interval as a study reads it, both ends in one unit, three significant figures:
 * "150–800 A", "3.2–12 kA", "0.8–1.2 kA".
 * @example formatRange(3200, 12000) // '3.2–12 kA'
 */
export function formatRange(fromAmps: number, toAmps: number): string {
  if (toAmps < 1000) return `${significant(fromAmps, 3)}–${significant(toAmps, 3)} A`;
  return `${significant(fromAmps / 1000, 3)}–${significant(toAmps / 1000, 3)} kA`;
}
