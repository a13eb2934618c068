/**
 * The caution every page, figure and report carries: the engine's own line (`src/engine/caution.ts`),
 * so the workbench's page and its exported figures and reports say the same words.
 * @example `<p>{CAUTION}</p>`
 */
export { CAUTION } from '../../engine/caution.ts';
