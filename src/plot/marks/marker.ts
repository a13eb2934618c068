import type { Marker } from '../../engine/withstand/withstand.ts';
import type { PathItem } from '../geometry.ts';
import { candidatesAround } from '../layout.ts';
import { fixed, pathOf } from '../precision.ts';
import { drawWindowOf, pixelOf, type SheetScales } from '../scales.ts';
import type { SheetMarker } from '../sheetInput.ts';
import { labelSize, type LabelSpec } from './label.ts';

/** How markers are drawn: a symbol per kind at a point, or a thin dotted vertical line at a current. */
export const markerDefaults = {
  /** px, half the symbol's size */
  radius: 4,
  /** px */
  strokeWidth: 1.4,
  /** px: the vertical line of a marker with no time */
  lineDash: '2 3',
} as const;

/** Options of the marker mark. */
export interface MarkerOptions {
  colour: string;
  /** Label size in px. */
  fontSize: number;
  /** px. @default 4 */
  radius?: number;
}

/** A marker's drawing and its label request. */
export interface MarkerGeometry {
  items: PathItem[];
  label: LabelSpec | null;
}

/**
 * Draws a marker at its current (× `scale`, onto the sheet's base): a point marker (inrush, locked
 * rotor) as a symbol whose shape names its kind (inrush ○, locked rotor ◇, full load △, fault ×),
 * a marker with no time as a dotted vertical line. Returns nothing when it falls outside the window.
 * @example marker({ ...inrush, scale: 1 }, 0, scales, { colour: '#000000', fontSize: 11 }).items[0].role // 'marker-inrush'
 */
export function marker(m: SheetMarker, index: number, scales: SheetScales, options: MarkerOptions): MarkerGeometry {
  const { colour, fontSize, radius } = { ...markerDefaults, ...options };
  const window = drawWindowOf(scales);
  const amps = m.amps * m.scale;
  const dataId = `${m.elementId}:${m.kind}:${index}`;
  if (amps < window.amps[0] || amps > window.amps[1]) return { items: [], label: null };
  const x = pixelOf(scales.x, amps);
  if (m.seconds === undefined) {
    const [y0, y1] = [pixelOf(scales.y, window.seconds[0]), pixelOf(scales.y, window.seconds[1])];
    const points = new Float64Array([x, y0, x, y1]);
    const item: PathItem = {
      type: 'path',
      role: `marker-${m.kind}`,
      dataId,
      d: pathOf(points),
      points,
      stroke: colour,
      strokeWidth: 1,
      dash: markerDefaults.lineDash,
      fill: 'none',
    };
    const { width, height } = labelSize(m.label, fontSize * 0.9, 'normal', -90);
    const candidates = [0, 1, 2, 3].flatMap((k) => [
      { box: { x: x + 2, y: y0 - height - 4 - 40 * k, width, height }, cost: k },
      { box: { x: x - 2 - width, y: y0 - height - 4 - 40 * k, width, height }, cost: k + 0.5 },
    ]);
    return {
      items: [item],
      label: {
        id: dataId,
        dataId,
        text: m.label,
        colour,
        size: fontSize * 0.9,
        rotate: -90,
        anchor: [x, y0],
        candidates,
      },
    };
  }
  if (m.seconds < window.seconds[0] || m.seconds > window.seconds[1]) return { items: [], label: null };
  const y = pixelOf(scales.y, m.seconds);
  const d = symbolPath(m.kind, x, y, radius);
  const item: PathItem = {
    type: 'path',
    role: `marker-${m.kind}`,
    dataId,
    d,
    stroke: colour,
    strokeWidth: markerDefaults.strokeWidth,
    fill: m.kind === 'fault' ? 'none' : '#ffffff',
  };
  const size = fontSize * 0.9;
  const { width, height } = labelSize(m.label, size);
  const candidates = candidatesAround([x, y], width, height, radius + 2);
  return { items: [item], label: { id: dataId, dataId, text: m.label, colour, size, anchor: [x, y], candidates } };
}

/**
 * The outline of a marker kind's symbol centred on (x, y), `r` px from centre to edge.
 * @example symbolPath('locked-rotor', 10, 10, 4) // 'M10,6L14,10L10,14L6,10Z'
 */
export function symbolPath(kind: Marker['kind'], x: number, y: number, r: number): string {
  switch (kind) {
    case 'inrush': {
      const [left, right, cy, radius] = [x - r, x + r, y, r].map(fixed);
      return `M${left},${cy}A${radius},${radius} 0 1 1 ${right},${cy}A${radius},${radius} 0 1 1 ${left},${cy}Z`;
    }
    case 'locked-rotor':
      return pathOf([x, y - r, x + r, y, x, y + r, x - r, y], true);
    case 'full-load':
      return pathOf([x, y - r, x + r, y + r * 0.8, x - r, y + r * 0.8], true);
    case 'fault':
      return `${pathOf([x - r, y - r, x + r, y + r])}${pathOf([x - r, y + r, x + r, y - r])}`;
    case 'ampacity':
      return pathOf([x, y - r, x, y + r]);
  }
}
