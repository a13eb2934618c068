export { gridX, gridY, halfCycleRule, gridDefaults } from './grid.ts';
export type { GridOptions } from './grid.ts';
export { axisX, axisY, plotFrame, axisDefaults } from './axis.ts';
export type { AxisOptions } from './axis.ts';
export { bandArea, bandAreaDefaults, BAND_DASHES, BAND_DASH_NAMES } from './bandArea.ts';
export type { BandAreaOptions, BandAreaGeometry } from './bandArea.ts';
export { withstandLine, projectPolyline, withstandLineDefaults } from './withstandLine.ts';
export type { WithstandLineOptions, CurveGeometry } from './withstandLine.ts';
export { startingLine, startingLineDefaults } from './startingLine.ts';
export type { StartingLineOptions } from './startingLine.ts';
export { marker, symbolPath, markerDefaults } from './marker.ts';
export type { MarkerOptions, MarkerGeometry } from './marker.ts';
export {
  faultLine,
  faultLabel,
  faultLabelSlots,
  faultLabelBand,
  faultBandHeight,
  faultLineDefaults,
} from './faultLine.ts';
export type { FaultLineOptions, FaultLineGeometry, FaultLabelSlot } from './faultLine.ts';
export { overlapHatch, formatRange, overlapHatchDefaults } from './overlapHatch.ts';
export type { OverlapHatchOptions, OverlapHatchGeometry } from './overlapHatch.ts';
export { labelItems, labelSize, labelDefaults } from './label.ts';
export type { LabelSpec, LabelOptions } from './label.ts';
export { legend, legendHeight, legendDefaults } from './legend.ts';
export type { LegendEntry, LegendSwatch, LegendOptions, LegendGeometry } from './legend.ts';
export { studyStrip, studyStripDefaults } from './studyStrip.ts';
export type { StudyStripFields, StudyStripOptions } from './studyStrip.ts';
