import { formatVolts, significant } from '../../engine/quantity/format.ts';
import type { PathItem } from '../geometry.ts';
import type { LabelCandidate } from '../layout.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { pixelOf, type SheetScales } from '../scales.ts';
import type { SheetFaultLine } from '../sheetInput.ts';
import { labelSize, type LabelSpec } from './label.ts';

/** How fault-current lines are drawn: full-height verticals, solid for maximum, dash-dot for minimum. */
export const faultLineDefaults = {
  colour: SHEET_COLOURS.faultLine,
  /** px */
  strokeWidth: 1.3,
  /** px: the minimum-fault line's dash, gap, dot, gap */
  minDash: '9 3 2 3',
} as const;

/** Options of the fault-line mark. */
export interface FaultLineOptions {
  /** Label size in px. */
  fontSize: number;
  /** The sheet's voltage base (V), for the label's reflected value. */
  referenceVolts: number;
  /** @default '#4d4d4d' */
  colour?: string;
}

/** A fault line's drawing and its label request. */
export interface FaultLineGeometry {
  items: PathItem[];
  label: LabelSpec | null;
}

/**
 * Draws a bus's fault current as a vertical line at its current on the sheet's base, labelled with
 * the value at the bus's own voltage and, when the sheet is on another base, the value drawn, so a
 * secondary fault and its primary-reflected value read together:
 * "SWBD 28.4 kA @ 480 V = 1.09 kA @ 12.47 kV". Nothing is drawn off the current axis.
 * @example faultLine(swbdMax, scales, { fontSize: 11, referenceVolts: 12470 }).label?.text
 */
export function faultLine(fault: SheetFaultLine, scales: SheetScales, options: FaultLineOptions): FaultLineGeometry {
  const { fontSize, referenceVolts, colour, strokeWidth, minDash } = { ...faultLineDefaults, ...options };
  const [low, high] = scales.x.domain;
  if (fault.amps < low || fault.amps > high) return { items: [], label: null };
  const x = pixelOf(scales.x, fault.amps);
  const [bottom, top] = scales.y.range;
  const points = new Float64Array([x, bottom, x, top]);
  const dataId = `${fault.busId}:${fault.kind}`;
  const item: PathItem = {
    type: 'path',
    role: `fault-${fault.kind}`,
    dataId,
    d: pathOf(points),
    points,
    stroke: colour,
    strokeWidth,
    ...(fault.kind === 'min' ? { dash: minDash } : {}),
    fill: 'none',
  };
  const text = faultLabel(fault, referenceVolts);
  const size = fontSize * 0.9;
  const { width, height } = labelSize(text, size, 'normal', -90);
  // Along the line from the top down, on its right first, then its left.
  const candidates: LabelCandidate[] = [0, 1, 2, 3, 4, 5].flatMap((k) => [
    { box: { x: x + 1.5, y: top + 4 + 45 * k, width, height }, cost: k },
    { box: { x: x - 1.5 - width, y: top + 4 + 45 * k, width, height }, cost: k + 0.3 },
  ]);
  return {
    items: [item],
    label: { id: dataId, dataId, text, colour, size, rotate: -90, anchor: [x, top + 4], candidates },
  };
}

/**
 * The text of a fault line's label: bus, "min" for a minimum level, the current at the bus's own
 * voltage and, if the sheet is on another base, "= the current drawn @ the sheet's voltage". A
 * `label` that already states a current ("… 28.4 kA @ 480 V") is taken as the whole text.
 * @example faultLabel({ busId: 'SWBD', label: 'SWBD', amps: 1093.99, ownVolts: 480, ownAmps: 28421.1, kind: 'max' }, 12470) // 'SWBD 28.4 kA @ 480 V = 1.09 kA @ 12.47 kV'
 */
export function faultLabel(fault: SheetFaultLine, referenceVolts: number): string {
  // A label that already states its current ("SWBD 28.4 kA @ 480 V …") is used as given.
  if (/\d\s*k?A\s*@/.test(fault.label)) return fault.label;
  const kind = fault.kind === 'min' ? 'min ' : '';
  const own = `${fault.label} ${kind}${faultAmps(fault.ownAmps)} @ ${formatVolts(fault.ownVolts)}`;
  const sameBase = Math.abs(fault.ownVolts - referenceVolts) <= 1e-9 * referenceVolts;
  return sameBase ? own : `${own} = ${faultAmps(fault.amps)} @ ${formatVolts(referenceVolts)}`;
}

// Accepts amps; three significant figures, in kA from 1000 A up, as fault levels are quoted.
function faultAmps(amps: number): string {
  return amps >= 1000 ? `${significant(amps / 1000, 3)} kA` : `${significant(amps, 3)} A`;
}
