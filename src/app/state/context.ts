import { getContext, setContext } from 'svelte';
import type { StudyState } from './StudyState.svelte.ts';
import type { AnalysisState } from './AnalysisState.svelte.ts';
import type { ProbeState } from './ProbeState.svelte.ts';
import type { SheetState } from './SheetState.svelte.ts';
import type { SettingsAsker } from './SettingsAsker.ts';

/** Everything the workbench's components share: the study, its analysis, the probe, the sheet, and where setting windows are worked out. */
export interface StudyContext {
  study: StudyState;
  analysis: AnalysisState;
  probe: ProbeState;
  sheet: SheetState;
  settings: SettingsAsker;
}

const KEY = Symbol('discern.study');

/** Makes the workbench state available to every component below. @example setStudyContext({ study, analysis, probe, sheet, settings }) */
export function setStudyContext(context: StudyContext): StudyContext {
  return setContext(KEY, context);
}

/** The workbench state set by the App. @example const { study } = getStudyContext() */
export function getStudyContext(): StudyContext {
  const context = getContext<StudyContext | undefined>(KEY);
  if (!context) throw new Error('getStudyContext: expected the App to set the study context, got none');
  return context;
}
