import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import type { Command, CommandIO } from '../../src/cli/command.ts';
import { runCli } from '../../src/cli/main.ts';

/** What a command printed and the code it ended with. */
export interface CommandRun {
  code: number;
  stdout: string;
  stderr: string;
  /** Files written through `CommandIO.writeFile`, by path. */
  files: Map<string, string | Uint8Array>;
}

/** A `CommandIO` in memory: output collected, files read from disk, files written to a map. */
export function memoryIO(): CommandIO & { out: string[]; err: string[]; files: Map<string, string | Uint8Array> } {
  const out: string[] = [];
  const err: string[] = [];
  const files = new Map<string, string | Uint8Array>();
  return {
    out,
    err,
    files,
    stdout: (text) => void out.push(text),
    stderr: (text) => void err.push(text),
    readText: (path) => readFileSync(path, 'utf8'),
    writeFile: (path, data) => void files.set(path, data),
    removeFile: (path) => files.delete(path),
  };
}

/**
 * Runs a verb in-process through the dispatcher, as `discern <verb> …` would, mapping thrown
 * `InputError`s to exit 2. Pass `command` to run one `Command` directly instead.
 *
 * @example const { code, stdout } = await runVerb(['transformer', '--kva', '1500', ...])
 */
export async function runVerb(argv: string[], command?: Command): Promise<CommandRun> {
  const io = memoryIO();
  const code = command ? await runCli([command.verb, ...argv], io, [command]) : await runCli(argv, io);
  return { code, stdout: io.out.join(''), stderr: io.err.join(''), files: io.files };
}

/** Spawns the real program (`tsx src/cli/main.ts`), for the few tests that must cross a process boundary. */
export function spawnDiscern(args: string[]): { code: number | null; stdout: string; stderr: string } {
  const result = spawnSync('node_modules/.bin/tsx', ['src/cli/main.ts', ...args], { encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}
