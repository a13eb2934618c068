export { oneLineBaseOf, oneLineOf, oneLineDefaults, oneLineWithMarks, sameOneLineBase } from './oneLine.ts';
export type { OneLine, OneLineBase, OneLineOptions, OneLinePlace } from './oneLine.ts';
export { layoutOneLine } from './oneLineLayout.ts';
export type { Continuation, Drop, OneLineLayout, OneLineLayoutOptions, OpenSwitch } from './oneLineLayout.ts';
