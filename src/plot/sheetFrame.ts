import { axisDefaults } from './marks/axis.ts';
import { cautionHeight } from './marks/caution.ts';
import type { LogAxis, PlotFrame } from './scales.ts';
import type { ResolvedSheetOptions } from './sheetOptions.ts';
import { textWidth } from './textWidth.ts';
import { logTicks, tickLabel } from './ticks.ts';

/** Where the parts of a sheet go, in px: the plot area, the right-hand column and the caution line. */
export interface SheetFrame {
  plot: PlotFrame;
  /** Baseline of the title above the plot. */
  titleBaseline: number;
  /** The legend and title-block column. */
  panel: { x: number; top: number; bottom: number; width: number };
  /** Top of the caution text. */
  cautionTop: number;
}

/**
 * Divides the sheet: the title on top, the caution at the foot (as many lines as it wraps to), the
 * legend column on the right, and the plot in what is left, with room for the axis labels and titles
 * (the widest time label, and half the last current label so it does not run under the column).
 * @example frameOf({ current: [10, 1e5], time: [0.01, 1000] }, caution, sheetDefaults).plot
 */
export function frameOf(
  ranges: { current: [number, number]; time: [number, number] },
  cautionText: string,
  options: ResolvedSheetOptions,
): SheetFrame {
  const { width, height, margin, fontSize, panelWidth } = options;
  const labels = (domain: [number, number]) =>
    logTicks({ domain, range: [0, 1] } satisfies LogAxis)
      .filter((t) => t.major)
      .map((t) => textWidth(tickLabel(t.value), fontSize));
  const timeLabel = Math.max(0, ...labels(ranges.time));
  const currentLabels = labels(ranges.current);
  const lastCurrent = currentLabels.at(-1) ?? 0;
  const firstCurrent = currentLabels[0] ?? 0;

  const titleSize = fontSize * 1.35;
  const titleBaseline = margin + titleSize * 0.93;
  const top = margin + titleSize * 1.2 + 10;
  const cautionTop = height - margin - cautionHeight(cautionText, width - 2 * margin, fontSize);
  const axisBelow = axisDefaults.majorTick + axisDefaults.labelGap + fontSize * 2.4 + fontSize * 0.4;
  const bottom = cautionTop - 8 - axisBelow;
  const axisTitle = fontSize * 1.1 * 1.2;
  const left =
    margin + Math.max(axisTitle + 8 + timeLabel + axisDefaults.majorTick + axisDefaults.labelGap, firstCurrent / 2);
  const panelX = width - margin - panelWidth;
  const right = panelX - Math.max(18, lastCurrent / 2 + 8);
  return {
    plot: { left, top, right, bottom },
    titleBaseline,
    panel: { x: panelX, top, bottom: cautionTop - 10, width: panelWidth },
    cautionTop,
  };
}
