export { relayCurveSet, relayCurveSetSchema, tripUnitRangesSchema, tripUnitSettingRanges } from './curveData.ts';
export {
  curveTemplateById,
  curveTemplateFileSchema,
  curveTemplates,
  readCurveTemplates,
  TEMPLATE_FILES,
  type CurveTemplate,
} from './curveTemplates.ts';
