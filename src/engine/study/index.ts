export { createStudySchema, studySchema, STUDY_VERSION } from './schema.ts';
export type {
  Study,
  StudyInput,
  Source,
  Bus,
  Transformer,
  Cable,
  Motor,
  Device,
  View,
  CoordinationSettings,
  Revision,
  Generator,
  Switch,
  Scenario,
} from './schema.ts';
export { readStudy, parseStudy, formatProblem, formatPath } from './parse.ts';
export type { StudyProblem, StudyReading } from './parse.ts';
export { readEditableStudy, readStudyEdit } from './readStudyEdit.ts';
export type { EditableReading } from './readStudyEdit.ts';
export { structureProblems } from './structure.ts';
export { quantityField, percentField, availableFaultField, idField, positiveNumber } from './fields.ts';
