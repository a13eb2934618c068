import { significant } from '../../engine/quantity/format.ts';
import type { HatchPattern, PathItem } from '../geometry.ts';
import { candidatesAround, type LabelCandidate } from '../layout.ts';
import { REGION_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { drawWindowOf, pixelOf, type SheetScales } from '../scales.ts';
import type { RegionStatus, SheetRegion } from '../sheetInput.ts';
import { labelSize, type LabelSpec } from './label.ts';

/**
 * How each region status is hatched: its own colour (none a curve's, see `REGION_COLOURS`), angle
 * and spacing, so none relies on colour alone: an overlap in dense single hatching, a thin margin in
 * heavier hatching the other way, a range curves cannot prove in a cross-hatch.
 */
export const overlapHatchDefaults: Record<RegionStatus, Omit<HatchPattern, 'id'>> = {
  overlap: { colour: REGION_COLOURS.overlap, angle: 45, spacing: 6, strokeWidth: 1, cross: false },
  'thin margin': { colour: REGION_COLOURS['thin margin'], angle: -45, spacing: 7, strokeWidth: 1.8, cross: false },
  'not provable from curves': {
    colour: REGION_COLOURS['not provable from curves'],
    angle: 0,
    spacing: 8,
    strokeWidth: 0.8,
    cross: true,
  },
};

/** Options of the region mark. */
export interface OverlapHatchOptions {
  /** Id of the sheet's hatch pattern for this region's status. */
  patternId: string;
  /** Label size in px. */
  fontSize: number;
  /** Opacity of the hatch lines, 0–1. @default 0.85 */
  opacity?: number;
  /** Samples per pixel column across the interval, for the edges between which the hatch lies. @default 0.5 */
  density?: number;
}

/** A region's drawing, its outline in pixels (for tests and label placement) and its label request. */
export interface OverlapHatchGeometry {
  items: PathItem[];
  /** The hatched polygon as interleaved pixels: the upper edge left to right, then the lower edge back. */
  outline: Float64Array | null;
  label: LabelSpec | null;
}

/**
 * Hatches what a finding marks (overlap, thin margin, not provable from curves): the area between
 * the two edges in conflict — the upstream device's earliest operation and the downstream device's
 * latest clearing — over the finding's current interval, clipped to the draw window (a clearing
 * time that never comes reaches the top of the sheet). A region with no edges (a finding not about
 * two bands) is hatched over the draw window's height. The label ("overlap 3.2–12 kA") is asked for
 * beside the polygon, nearest the currents where the edges cross first.
 * @example overlapHatch(region, 0, scales, { patternId: 'tcc-hatch-1', fontSize: 11 }).label?.text // 'overlap 3.2–12 kA'
 */
export function overlapHatch(
  region: SheetRegion,
  index: number,
  scales: SheetScales,
  options: OverlapHatchOptions,
): OverlapHatchGeometry {
  const { patternId, fontSize, opacity = 0.85, density = 0.5 } = options;
  const none = { items: [], outline: null, label: null };
  const window = drawWindowOf(scales);
  const from = Math.max(window.amps[0], region.fromAmps);
  const to = Math.min(window.amps[1], region.toAmps);
  if (!(to > from)) return none;

  // Stage 1: the currents to trace at: a log grid about every other pixel, plus each breakpoint inside.
  const x0 = pixelOf(scales.x, from);
  const x1 = pixelOf(scales.x, to);
  const n = Math.max(2, Math.ceil((x1 - x0) * density) + 1);
  const amps: number[] = [];
  for (let i = 0; i < n; i++) amps.push(from * (to / from) ** (i / (n - 1)));
  const breaks = region.edges ? [...region.edges.upstream.breakpoints, ...region.edges.downstream.breakpoints] : [];
  for (const b of breaks) for (const a of [b * (1 - 1e-9), b * (1 + 1e-9)]) if (a > from && a < to) amps.push(a);
  amps.sort((a, b) => a - b);

  // Stage 2: at each current the upper and lower time of the region, held in the window.
  const [bottom, top] = window.seconds;
  const clamp = (t: number) => (Number.isNaN(t) ? top : Math.min(top, Math.max(bottom, t)));
  const upper = new Float64Array(amps.length);
  const lower = new Float64Array(amps.length);
  amps.forEach((a, i) => {
    if (!region.edges) [upper[i], lower[i]] = [top, bottom];
    else {
      const up = clamp(region.edges.upstream.minTime(a));
      const down = clamp(region.edges.downstream.maxTime(a));
      [upper[i], lower[i]] = [Math.max(up, down), Math.min(up, down)];
    }
  });
  const outline = new Float64Array(amps.length * 4);
  amps.forEach((a, i) => {
    const x = pixelOf(scales.x, a);
    outline[2 * i] = x;
    outline[2 * i + 1] = pixelOf(scales.y, upper[i]);
    const back = 2 * (2 * amps.length - 1 - i);
    outline[back] = x;
    outline[back + 1] = pixelOf(scales.y, lower[i]);
  });

  const { colour } = overlapHatchDefaults[region.status];
  const dataId = region.findingId;
  const role = `region-${region.status.replaceAll(' ', '-')}`;
  const items: PathItem[] = [
    {
      type: 'path',
      role,
      dataId,
      d: pathOf(outline, true),
      patternId,
      fillOpacity: opacity,
      stroke: colour,
      strokeWidth: 0.8,
      strokeOpacity: opacity,
    },
  ];

  // Stage 3: the label, beside the region's middle line, the crossing end (the lowest current) first.
  const text = `${region.status} ${formatRange(region.fromAmps, region.toAmps)}${region.fault ? `, ${region.fault}` : ''}`;
  const size = fontSize * 0.9;
  const { width, height } = labelSize(text, size, 'bold');
  const anchors = [0, 0.25, 0.5, 0.75, 1].map((f): [number, number] => {
    const i = Math.round(f * (amps.length - 1));
    return [pixelOf(scales.x, amps[i]), pixelOf(scales.y, Math.sqrt(upper[i] * lower[i]))];
  });
  const candidates: LabelCandidate[] = anchors.flatMap((a, k) => [
    ...candidatesAround(a, width, height, 4, k * 0.6),
    ...candidatesAround(a, width, height, 18, 2 + k * 0.6),
  ]);
  const label: LabelSpec = {
    id: `region:${index}`,
    dataId,
    text,
    colour: labelColour(region.status),
    size,
    weight: 'bold',
    anchor: anchors[0],
    candidates,
  };
  return { items, outline, label };
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

// Accepts a status; the colour its label is set in (yellow text would not read on white, so a thin margin's label is dark).
function labelColour(status: RegionStatus): string {
  return status === 'thin margin' ? '#6b6000' : status === 'overlap' ? REGION_COLOURS.overlap : '#666666';
}
