export { sheetOf, DEFAULT_TIME_RANGE } from './sheet.ts';
export { inferCurrentRange } from './currentRange.ts';
export type { Sheet, SheetCurve, SheetLabel } from './sheet.ts';
export { checkSheetInput } from './sheetInput.ts';
export type {
  SheetInput,
  SheetBand,
  SheetWithstand,
  SheetMarker,
  SheetStarting,
  SheetFaultLine,
  SheetRegion,
  RegionStatus,
} from './sheetInput.ts';
export { resolveSheetOptions, sheetDefaults } from './sheetOptions.ts';
export type { SheetOptions, ResolvedSheetOptions } from './sheetOptions.ts';
export { viewInputOf } from './viewInput.ts';
export { svgOf, escapeXml } from './svg.ts';
export { pdfOf, pdfOfPages, pagePoints, PAPER_POINTS } from './pdf.ts';
export type { PdfOptions, Paper, PageContent, PagePlacement } from './pdf.ts';
export { scalesOf, scaleOf, pixelOf, valueOf, decadeRangeOf, drawWindowOf, drawBoxOf } from './scales.ts';
export type { LogAxis, SheetScales, PlotFrame, DrawWindow } from './scales.ts';
export { logTicks, tickLabel } from './ticks.ts';
export type { Tick } from './ticks.ts';
export { OKABE_ITO, CURVE_COLOURS, ALL_CURVE_COLOURS, REGION_COLOURS, SHEET_COLOURS, curveColour } from './palette.ts';
export { boxesOverlap, boxInside } from './geometry.ts';
export type { Box, Paint, Tagged, PathItem, RectItem, TextItem, Primitive, HatchPattern, Layer } from './geometry.ts';
export { placeLabels, candidatesAround, pointsAlong } from './layout.ts';
export type { LabelCandidate, LabelRequest, LabelPlacement, LayoutOptions } from './layout.ts';
export { traceBand, clampTime } from './bandTrace.ts';
export type { BandTrace } from './bandTrace.ts';
export { clipPolyline, segmentCrossesBox } from './clip.ts';
export { simplifyPolyline } from './simplify.ts';
export { textWidth, wrapText, truncateText } from './textWidth.ts';
export { DIGITS, fixed, pathOf } from './precision.ts';
export { frameOf } from './sheetFrame.ts';
export type { SheetFrame } from './sheetFrame.ts';
export { legendEntriesOf } from './legendEntries.ts';
export * from './marks/index.ts';
