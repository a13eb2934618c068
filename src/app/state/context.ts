import { getContext, setContext } from 'svelte';
import type { StudyState } from './StudyState.svelte.ts';
import type { AnalysisState } from './AnalysisState.svelte.ts';
import type { ProbeState } from './ProbeState.svelte.ts';
import type { SheetState } from './SheetState.svelte.ts';
import type { StudyAsker } from './StudyAsker.ts';
import type { SettingsAnswer, SettingsQuestion } from '../worker/settingsQuestions.ts';
import type { ReportAnswer, ReportQuestion } from '../worker/reportQuestions.ts';
import type { OneLineAnswer, OneLineQuestion } from '../worker/oneLineQuestions.ts';

/** Everything the workbench's components share: the study, its analysis, the probe, the sheet, and where windows, proposals, one-line diagrams and reports are worked out. */
export interface StudyContext {
  study: StudyState;
  analysis: AnalysisState;
  probe: ProbeState;
  sheet: SheetState;
  /** Setting windows and proposals, worked out in their worker. */
  settings: StudyAsker<SettingsQuestion, SettingsAnswer>;
  /** One-line diagrams, drawn in their worker. */
  oneLine: StudyAsker<OneLineQuestion, OneLineAnswer>;
  /** Study reports, written in their worker. */
  reports: StudyAsker<ReportQuestion, ReportAnswer>;
}

const KEY = Symbol('discern.study');

/** Makes the workbench state available to every component below. @example setStudyContext({ study, analysis, probe, sheet, settings, oneLine, reports }) */
export function setStudyContext(context: StudyContext): StudyContext {
  return setContext(KEY, context);
}

/** The workbench state set by the App. @example const { study } = getStudyContext() */
export function getStudyContext(): StudyContext {
  const context = getContext<StudyContext | undefined>(KEY);
  if (!context) throw new Error('getStudyContext: expected the App to set the study context, got none');
  return context;
}
