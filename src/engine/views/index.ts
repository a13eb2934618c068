export { pathViewsOf } from './pathViews.ts';
export type { PathView } from './pathViews.ts';
