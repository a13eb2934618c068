export { parseQuantity, parsePercent, DIMENSIONS } from './parse.ts';
export type { Dimension, ParseQuantityOptions } from './parse.ts';
export { formatAmps, formatVolts, formatSeconds, formatSI, significant } from './format.ts';
