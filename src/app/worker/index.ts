export { checksOf } from './checks.ts';
export { inlineRunner, workerRunner } from './runners.ts';
export type { AnalyseReply, AnalyseRequest } from './protocol.ts';
