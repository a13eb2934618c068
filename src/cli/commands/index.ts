import type { Command } from '../command.ts';
import { bandCommand } from './band.ts';
import { checkCommand } from './check.ts';
import { faultsCommand } from './faults.ts';
import { pathsCommand } from './paths.ts';
import { plotCommand } from './plot.ts';
import { reportCommand } from './report.ts';
import { transformerCommand } from './transformer.ts';
import { windowCommand } from './window.ts';
import { proposeCommand } from './propose.ts';

export { transformerCommand } from './transformer.ts';
export { faultsCommand } from './faults.ts';
export { bandCommand } from './band.ts';
export { checkCommand } from './check.ts';
export { plotCommand } from './plot.ts';
export { pathsCommand } from './paths.ts';
export { reportCommand } from './report.ts';
export { windowCommand } from './window.ts';
export { proposeCommand } from './propose.ts';

/** Every verb of `discern`, in the order `discern --help` lists them. Adding a verb: one import, one entry. */
export const commands: Command[] = [
  transformerCommand,
  faultsCommand,
  bandCommand,
  checkCommand,
  plotCommand,
  pathsCommand,
  reportCommand,
  windowCommand,
  proposeCommand,
];
