import { axisDefaults } from './marks/axis.ts';
import type { LogAxis, PlotFrame } from './scales.ts';
import type { ResolvedSheetOptions } from './sheetOptions.ts';
import { textWidth } from './textWidth.ts';
import { logTicks, tickLabel } from './ticks.ts';

/** The heights (px) of the bands a sheet stacks around its plot, measured by their marks. */
export interface SheetBands {
  /** The study strip across the top. */
  strip: number;
  /** The fault-label band just above the plot (0 when there are no fault lines). */
  faults: number;
  /** The key under the current axis (0 when every curve is labelled on the plot). */
  key: number;
}

/** Where the parts of a sheet go, in px. */
export interface SheetFrame {
  plot: PlotFrame;
  /** Top of the study strip. */
  stripTop: number;
  /** Top of the key under the current axis. */
  keyTop: number;
}

/**
 * Divides the sheet from the top down: the study strip, the fault-label band, the plot (full width
 * but for room for the axis labels and titles: the widest time label, and half the first and last
 * current labels), the current axis, and the key. With `bands` omitted the plot's left and right
 * edges are still exact, so fault labels can be laid out before the heights are known.
 * @example frameOf({ current: [10, 1e5], time: [0.01, 1000] }, { strip: 60, faults: 18, key: 0 }, sheetDefaults).plot
 */
export function frameOf(
  ranges: { current: [number, number]; time: [number, number] },
  bands: SheetBands,
  options: ResolvedSheetOptions,
): SheetFrame {
  const { width, height, margin, fontSize } = options;
  const labels = (domain: [number, number]) =>
    logTicks({ domain, range: [0, 1] } satisfies LogAxis)
      .filter((t) => t.major)
      .map((t) => textWidth(tickLabel(t.value), fontSize));
  const timeLabel = Math.max(0, ...labels(ranges.time));
  const currentLabels = labels(ranges.current);
  const lastCurrent = currentLabels.at(-1) ?? 0;
  const firstCurrent = currentLabels[0] ?? 0;

  const stripTop = margin;
  const top = stripTop + bands.strip + 10 + bands.faults;
  const keyTop = height - margin - bands.key;
  const axisBelow = axisDefaults.majorTick + axisDefaults.labelGap + fontSize * 2.4 + fontSize * 0.4;
  const bottom = keyTop - (bands.key > 0 ? 6 : 0) - axisBelow;
  const axisTitle = fontSize * 1.1 * 1.2;
  const left =
    margin + Math.max(axisTitle + 8 + timeLabel + axisDefaults.majorTick + axisDefaults.labelGap, firstCurrent / 2);
  const right = width - margin - Math.max(6, lastCurrent / 2 + 2);
  return { plot: { left, top, right, bottom }, stripTop, keyTop };
}
