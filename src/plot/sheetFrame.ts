import { axisDefaults, labelSeries } from './marks/axis.ts';
import type { LogAxis, PlotFrame } from './scales.ts';
import type { ResolvedSheetOptions } from './sheetOptions.ts';
import { textWidth } from './textWidth.ts';
import { logTicks, tickLabel } from './ticks.ts';

/**
 * The least plot a sheet keeps: a share of the sheet's height (width), capped in px. At the smallest
 * sheet accepted (480 × 360 px) 40 % keeps 144 px for the plot, about 29 px for each of the five
 * default time decades, room for a label at each decade and the 1-2-5 labels of a zoomed view; the
 * 200 px cap keeps a large sheet's key and strip from being cut for a plot already big enough to read.
 */
export const plotMinimum = { share: 0.4, px: 200 } as const;

/** The heights (px) of the bands a sheet stacks around its plot, measured by their marks. */
export interface SheetBands {
  /** The study strip across the top. */
  strip: number;
  /** The fault-label band just above the plot (0 when there are no fault lines). */
  faults: number;
  /** The key under the current axis (0 when every curve is labelled on the plot). */
  key: number;
  /**
   * The least the key may be cut to (px), its heading and its "+ n more" line, where the sheet is too
   * short for the key and the plot's minimum. Omitted: the key keeps `key`.
   */
  keyLeast?: number;
  /** The strip's height without its optional lines, the notes (never the caution) (px). Omitted: the strip keeps `strip`. */
  stripBrief?: number;
}

/** Where the parts of a sheet go, in px. */
export interface SheetFrame {
  plot: PlotFrame;
  /** Top of the study strip. */
  stripTop: number;
  /** Top of the key under the current axis. */
  keyTop: number;
  /** The height the key may fill: `bands.key`, or down to `bands.keyLeast` on a short sheet. */
  keyHeight: number;
  /** Whether the strip must be drawn without its optional lines (`bands.stripBrief` tall) to keep the plot's minimum. */
  stripBrief: boolean;
}

/**
 * Divides the sheet from the top down: the study strip, the fault-label band, the plot (full width
 * but for room for the axis labels and titles: the widest time label, and half the first and last
 * current labels), the current axis, and the key. With `bands` omitted the plot's left and right
 * edges are still exact, so fault labels can be laid out before the heights are known.
 *
 * The plot keeps at least {@link minimumPlotSize}: on a short sheet the key is cut first (down to
 * `bands.keyLeast`), then the strip drops its optional lines (to `bands.stripBrief`); a part with no
 * least given keeps its height. Only when even that leaves too little does the plot get less. On a
 * narrow sheet the side margins give way (down to nothing) before the plot's width does.
 * @example frameOf({ current: [10, 1e5], time: [0.01, 1000] }, { strip: 60, faults: 18, key: 0 }, sheetDefaults).plot
 */
export function frameOf(
  ranges: { current: [number, number]; time: [number, number] },
  bands: SheetBands,
  options: ResolvedSheetOptions,
): SheetFrame {
  const { width, height, margin, fontSize } = options;
  const minimum = minimumPlotSize(options);
  const labels = (domain: [number, number]) =>
    labelSeries(logTicks({ domain, range: [0, 1] } satisfies LogAxis)).map((t) =>
      textWidth(tickLabel(t.value), fontSize),
    );
  const timeLabel = Math.max(0, ...labels(ranges.time));
  const currentLabels = labels(ranges.current);
  const lastCurrent = currentLabels.at(-1) ?? 0;
  const firstCurrent = currentLabels[0] ?? 0;

  // Across: the labels' room, then the margins give up what the plot's least width needs.
  const axisTitle = fontSize * 1.1 * 1.2;
  let left =
    margin + Math.max(axisTitle + 8 + timeLabel + axisDefaults.majorTick + axisDefaults.labelGap, firstCurrent / 2);
  let right = width - margin - Math.max(6, lastCurrent / 2 + 2);
  const narrowBy = Math.min(minimum.width - (right - left), 2 * margin);
  if (narrowBy > 0) [left, right] = [left - narrowBy / 2, right + narrowBy / 2];

  // Down: the plot's height with a strip and a key, and what it lacks of its minimum.
  const axisBelow = axisDefaults.majorTick + axisDefaults.labelGap + fontSize * 2.4 + fontSize * 0.4;
  const fixed = 2 * margin + 10 + bands.faults + axisBelow;
  const keyRoom = (key: number) => (key > 0 ? key + 6 : 0);
  const shortBy = (strip: number, key: number) => minimum.height - (height - fixed - strip - keyRoom(key));
  const keyLeast = Math.min(bands.key, bands.keyLeast ?? bands.key);
  const stripBrief =
    bands.stripBrief !== undefined && bands.stripBrief < bands.strip && shortBy(bands.strip, keyLeast) > 0;
  const strip = stripBrief ? bands.stripBrief! : bands.strip;
  // The key gives up only what the plot lacks, never going below its least.
  const keyHeight = Math.max(keyLeast, Math.min(bands.key, bands.key - shortBy(strip, bands.key)));

  const stripTop = margin;
  const top = stripTop + strip + 10 + bands.faults;
  const keyTop = height - margin - keyHeight;
  const bottom = keyTop - (keyHeight > 0 ? 6 : 0) - axisBelow;
  return { plot: { left, top, right, bottom }, stripTop, keyTop, keyHeight, stripBrief };
}

/**
 * The least width and height (px) {@link frameOf} keeps for the plot while optional parts can give way:
 * `plotMinimum.share` of the sheet's, at most `plotMinimum.px`.
 * @example minimumPlotSize({ ...sheetDefaults, width: 480, height: 360 }) // { width: 192, height: 144 }
 */
export function minimumPlotSize(options: Pick<ResolvedSheetOptions, 'width' | 'height'>): {
  width: number;
  height: number;
} {
  const least = (size: number) => Math.min(plotMinimum.share * size, plotMinimum.px);
  return { width: least(options.width), height: least(options.height) };
}
