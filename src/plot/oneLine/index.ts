export { oneLineOf, oneLineDefaults } from './oneLine.ts';
export type { OneLine, OneLineOptions, OneLinePlace } from './oneLine.ts';
export { layoutOneLine } from './oneLineLayout.ts';
export type { Continuation, Drop, OneLineLayout, OneLineLayoutOptions, OpenSwitch } from './oneLineLayout.ts';
