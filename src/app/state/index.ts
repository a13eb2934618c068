export { AnalysisState } from './AnalysisState.svelte.ts';
export type { CheckRunner } from './AnalysisState.svelte.ts';
export { getStudyContext, setStudyContext } from './context.ts';
export type { StudyContext } from './context.ts';
export { History } from './History.svelte.ts';
export type { CommitOptions } from './History.svelte.ts';
export { ProbeState } from './ProbeState.svelte.ts';
export { FIGURE_SIZE, SheetState } from './SheetState.svelte.ts';
export { StudyState } from './StudyState.svelte.ts';
