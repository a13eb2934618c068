import { formatVolts, significant } from '../../engine/quantity/format.ts';
import type { PathItem, Primitive } from '../geometry.ts';
import { SHEET_COLOURS } from '../palette.ts';
import { pathOf } from '../precision.ts';
import { pixelOf, type SheetScales } from '../scales.ts';
import type { SheetFaultLine } from '../sheetInput.ts';
import { textWidth } from '../textWidth.ts';

/** How fault-current lines are drawn: full-height verticals, solid for maximum, dash-dot for minimum. */
export const faultLineDefaults = {
  colour: SHEET_COLOURS.faultLine,
  /** px */
  strokeWidth: 1.3,
  /** px: the minimum-fault line's dash, gap, dot, gap */
  minDash: '9 3 2 3',
  /** × the sheet's font size: the labels in the band above the plot */
  labelScale: 0.9,
} as const;

/** Options of the fault-line mark. */
export interface FaultLineOptions {
  /** @default '#4d4d4d' */
  colour?: string;
}

/** A fault line's drawing (nothing when it lies off the current axis). */
export interface FaultLineGeometry {
  items: PathItem[];
}

/**
 * Draws a bus's fault current as a vertical line at its current on the sheet's base, from the foot
 * of the plot to its top; its label is set above the plot by {@link faultLabelBand}. Nothing is drawn
 * off the current axis.
 * @example faultLine(swbdMax, scales, { fontSize: 11, referenceVolts: 12470 }).items[0].role // 'fault-max'
 */
export function faultLine(fault: SheetFaultLine, scales: SheetScales, options: FaultLineOptions): FaultLineGeometry {
  const { colour, strokeWidth, minDash } = { ...faultLineDefaults, ...options };
  const [low, high] = scales.x.domain;
  if (fault.amps < low || fault.amps > high) return { items: [] };
  const x = pixelOf(scales.x, fault.amps);
  const [bottom, top] = scales.y.range;
  const points = new Float64Array([x, bottom, x, top]);
  const item: PathItem = {
    type: 'path',
    role: `fault-${fault.kind}`,
    dataId: faultDataId(fault),
    d: pathOf(points),
    points,
    stroke: colour,
    strokeWidth,
    ...(fault.kind === 'min' ? { dash: minDash } : {}),
    fill: 'none',
  };
  return { items: [item] };
}

/** One fault line's label in the band above the plot: its text, where it sits and which row. */
export interface FaultLabelSlot {
  dataId: string;
  text: string;
  /** px: left edge of the text and its width */
  x: number;
  width: number;
  /** 0 is the row nearest the plot. */
  row: number;
  /** px: the line's x, or null when the current lies off the axis (the label then points off the sheet with an arrow). */
  lineX: number | null;
}

/**
 * Sets the fault lines' labels level, in rows above the plot: each as a flag beside its line (to
 * its right, else its left, else centred over it; held inside the plot's width), in the lowest row
 * where it meets no other label and where the tick from it down to its line crosses no label below
 * (nor does it sit on a tick from a row above). A current beyond the axis gets a label at that end
 * with an arrow ("MV 11.6 kA @ 12.47 kV = 302 kA @ 480 V →"), so no fault is left unsaid. Returns
 * the slots and the number of rows.
 * @example faultLabelSlots(input.faultLines, scales, { fontSize: 11, referenceVolts: 480 }).rows // 1
 */
export function faultLabelSlots(
  faults: SheetFaultLine[],
  scales: SheetScales,
  options: { fontSize: number; referenceVolts: number },
): { slots: FaultLabelSlot[]; rows: number } {
  const size = options.fontSize * faultLineDefaults.labelScale;
  const [low, high] = scales.x.domain;
  const [left, right] = scales.x.range;
  const gap = 8;
  const slots: FaultLabelSlot[] = [];
  // Lines on the axis first, highest current first; faults beyond the axis last, so they take rows no tick crosses.
  const off = (f: SheetFaultLine) => (f.amps > high || f.amps < low ? 1 : 0);
  const sorted = [...faults].sort((a, b) => off(a) - off(b) || b.amps - a.amps);
  const fits = (x: number, width: number, row: number, lineX: number | null) =>
    slots.every((o) => {
      if (o.row === row) return x + width + gap <= o.x || o.x + o.width + gap <= x;
      // A tick runs from its label's row down to the plot: it must not cross a label in a lower row.
      const [upper, lower] = o.row > row ? [o, { x, width, lineX }] : [{ x, width, lineX }, o];
      return upper.lineX === null || upper.lineX < lower.x - 2 || upper.lineX > lower.x + lower.width + 2;
    });
  for (const fault of sorted) {
    const beyond = fault.amps > high ? 'right' : fault.amps < low ? 'left' : null;
    const base = faultLabel(fault, options.referenceVolts);
    const text = beyond === 'right' ? `${base} →` : beyond === 'left' ? `← ${base}` : base;
    const width = textWidth(text, size);
    const lineX = beyond ? null : pixelOf(scales.x, fault.amps);
    const wanted =
      beyond === 'right'
        ? [right - width]
        : beyond === 'left'
          ? [left]
          : [lineX! + 3, lineX! - 3 - width, lineX! - width / 2];
    const places = wanted.map((x) => Math.max(left, Math.min(right - width, x)));
    // Rows up to one per fault; when none is clear of every tick, a new row on top (crossing a tick beats a lost label).
    let slot: FaultLabelSlot | undefined;
    for (let row = 0; row <= faults.length && !slot; row++) {
      const x = places.find((p) => fits(p, width, row, lineX));
      if (x !== undefined) slot = { dataId: faultDataId(fault), text, x, width, row, lineX };
    }
    const top = slots.reduce((m, o) => Math.max(m, o.row + 1), 0);
    slots.push(slot ?? { dataId: faultDataId(fault), text, x: places[0], width, row: top, lineX });
  }
  return { slots, rows: slots.length ? Math.max(...slots.map((s) => s.row)) + 1 : 0 };
}

/**
 * The height in px of the fault-label band for this many rows (0 rows, no band).
 * @example faultBandHeight(2, 11) // ≈ 30
 */
export function faultBandHeight(rows: number, fontSize: number): number {
  return rows === 0 ? 0 : rows * fontSize * faultLineDefaults.labelScale * 1.35 + 6;
}

/**
 * Draws the fault-label band: a pale strip the width of the plot just above it, each label in its
 * row and a short tick from the label down to its line at the plot's top edge.
 * @example faultLabelBand(slots, rows, { left: 60, right: 900, bottom: 80, fontSize: 11 })
 */
export function faultLabelBand(
  slots: FaultLabelSlot[],
  rows: number,
  options: { left: number; right: number; bottom: number; fontSize: number; colour?: string },
): Primitive[] {
  if (rows === 0) return [];
  const { left, right, bottom, fontSize, colour = faultLineDefaults.colour } = options;
  const size = fontSize * faultLineDefaults.labelScale;
  const step = size * 1.35;
  const height = faultBandHeight(rows, fontSize);
  const items: Primitive[] = [
    {
      type: 'rect',
      role: 'fault-band',
      x: left,
      y: bottom - height,
      width: right - left,
      height,
      fill: '#f3f3f3',
      stroke: 'none',
    },
  ];
  const ticks: number[][] = [];
  for (const slot of slots) {
    const baseline = bottom - 4 - slot.row * step - size * 0.28;
    items.push({
      type: 'text',
      role: 'fault-label',
      dataId: slot.dataId,
      x: slot.x,
      y: baseline,
      text: slot.text,
      size,
      anchor: 'start',
      fill: colour,
    });
    if (slot.lineX !== null) ticks.push([slot.lineX, baseline + size * 0.3, slot.lineX, bottom]);
  }
  if (ticks.length)
    items.push({
      type: 'path',
      role: 'fault-tick',
      d: ticks.map((t) => pathOf(t)).join(''),
      stroke: colour,
      strokeWidth: 0.9,
      fill: 'none',
    });
  return items;
}

/**
 * The text of a fault line's label: bus, "min" for a minimum level, the current at the bus's own
 * voltage and, if the sheet is on another base, the current drawn @ the sheet's voltage: "= …" by the
 * voltage ratio, "→ … (through T1)" where it is the current through a transformer, with any
 * `reflection` note in brackets. A `label` that already states a current ("… 28.4 kA @ 480 V") is
 * taken as the whole text.
 * @example faultLabel({ busId: 'SWBD', label: 'SWBD', amps: 1094, ownVolts: 480, ownAmps: 29977, kind: 'max', reflection: 'through T1' }, 12470) // 'SWBD 30 kA @ 480 V → 1.09 kA @ 12.47 kV (through T1)'
 */
export function faultLabel(fault: SheetFaultLine, referenceVolts: number): string {
  const scenario = fault.scenario ? `${fault.scenario}: ` : '';
  // A label that already states its current ("SWBD 28.4 kA @ 480 V …") is used as given.
  if (/\d\s*k?A\s*@/.test(fault.label)) return `${scenario}${fault.label}`;
  const kind = fault.kind === 'min' ? 'min ' : '';
  const own = `${scenario}${fault.label} ${kind}${faultAmps(fault.ownAmps)} @ ${formatVolts(fault.ownVolts)}`;
  const sameBase = Math.abs(fault.ownVolts - referenceVolts) <= 1e-9 * referenceVolts;
  if (sameBase) return own;
  const drawn = `${faultAmps(fault.amps)} @ ${formatVolts(referenceVolts)}`;
  if (!fault.reflection) return `${own} = ${drawn}`;
  return `${own} ${fault.reflection.startsWith('through') ? '→' : '='} ${drawn} (${fault.reflection})`;
}

/**
 * The id a fault line's drawing, label and key entry share: bus and kind, and its scenario when it names one.
 * @example faultDataId({ busId: 'EMP', kind: 'max', scenario: 'On generator', … }) // 'EMP:max:On generator'
 */
export function faultDataId(fault: SheetFaultLine): string {
  return `${fault.busId}:${fault.kind}${fault.scenario ? `:${fault.scenario}` : ''}`;
}

// Accepts amps; three significant figures, in kA from 1000 A up, as fault levels are quoted.
function faultAmps(amps: number): string {
  return amps >= 1000 ? `${significant(amps / 1000, 3)} kA` : `${significant(amps, 3)} A`;
}
