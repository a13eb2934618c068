export {
  AUTOSAVE_PREFIX,
  AUTOSAVE_SLOTS,
  LEGACY_AUTOSAVE_KEY,
  nameOf,
  needsOffer,
  readKept,
  refusalOf,
  StudyKeeper,
} from './autosave.ts';
export type {
  AutosaveRecord,
  KeepOutcome,
  KeptProblem,
  KeptStudies,
  KeptVersion,
  StaleMark,
  StorageLike,
} from './autosave.ts';
export { installBenchHook } from './benchHook.ts';
export type { BenchHook } from './benchHook.ts';
export { builtStudyOf, documentOfText, networkOrUndefined, readingOf } from './builtStudy.ts';
export type { BuildOutcome, BuiltStudy, StudyReading } from './builtStudy.ts';
export { CAUTION } from './caution.ts';
export { pointsTargetsOf, previewTablesOf, withPoints } from './csvImport.ts';
export type { PointsTarget } from './csvImport.ts';
export { DEFAULT_DEMO, DEMO_STUDIES } from './demos.ts';
export type { DemoStudy } from './demos.ts';
export { formatDocumentPath, valueAt, withItemAdded, withValueAt, withoutItemAt } from './documentPath.ts';
export type { DocumentPath } from './documentPath.ts';
export { downloadBlob, downloadText, fileStemOf, readFileText } from './download.ts';
export {
  downloadPdf,
  downloadPng,
  downloadPdfBytes,
  downloadSvg,
  EXPORT_PAPERS,
  exportPageOf,
  sizeOfSvg,
} from './exports.ts';
export type { ExportFormat, ExportKind, ExportPage, Orientation, PagedExport } from './exports.ts';
export { fieldInfoAt, missingFieldsAt, schemaNodeAt, STUDY_JSON_SCHEMA } from './fieldInfo.ts';
export type { FieldControl, FieldInfo, SchemaNode } from './fieldInfo.ts';
export { fieldLabel } from './fieldLabel.ts';
export { handlePlacementsOf, handleSettingsOf, movedBy } from './handles.ts';
export type { HandlePlacement, HandleSettings } from './handles.ts';
export { bandsOf, findingCountsOf, idSetOf, lookupOf } from './lookups.ts';
export type { FindingCount } from './lookups.ts';
export { newStudyDocument, newViewOf } from './newItems.ts';
export { idleScheduler } from './idle.ts';
export type { IdleHost, Scheduler } from './idle.ts';
export { loadPdfFonts } from './pdfFonts.ts';
export type { PdfFonts } from './pdfFonts.ts';
export { csvCell, probesCsv } from './probeCsv.ts';
export { alsoRemoved, removalOf, withoutRemoval } from './removal.ts';
export type { RemovableKind, Removal } from './removal.ts';
export { ELEMENT_ID_PLACES, idEditOf, isId, withIdRenamed } from './renaming.ts';
export type { IdEdit } from './renaming.ts';
export { runExport } from './runExport.ts';
export { scenarioFaultLinesOf } from './scenarioFaultLines.ts';
export { analysisOfPart, findingsIn, placeOfView, scenarioViewOf } from './scenarioParts.ts';
export type { PartView, ScenarioView, ViewPlace } from './scenarioParts.ts';
export {
  COLLECTION_OF,
  parseProblemPath,
  pathOfSelection,
  selectionAfterIdEdit,
  selectionOfPath,
} from './selection.ts';
export type { ItemKind, Selection } from './selection.ts';
export { sheetGuideOf } from './sheetGuide.ts';
export type { GuideStep } from './sheetGuide.ts';
export { scaleValue, stepValue } from './stepValue.ts';
export type { StepOptions } from './stepValue.ts';
export {
  darkItemsOf,
  flattenTree,
  rowsOf,
  scenarioRowsOf,
  switchText,
  systemRowsOf,
  systemTreeOf,
} from './systemTree.ts';
export type { DarkItem, SystemRow, SystemTreeOptions, TreeNode } from './systemTree.ts';
export { freeDeviceId, templateChoices } from './templates.ts';
export type { TemplateChoice } from './templates.ts';
