import { readFileSync, realpathSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expectedGot, InputError } from '../engine/errors.ts';
import type { Command, CommandIO } from './command.ts';
import { commands } from './commands/index.ts';
import { makeFolders, writeAllWhole, type WholeWritingIO } from './writeAll.ts';

/** The process's streams and file system as a `CommandIO`, writing several files all or nothing. */
export const nodeIO: WholeWritingIO = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
  readText: (path) => readFileSync(path, 'utf8'),
  writeFile: (path, data) => writeFileWhole(path, data),
  writeAll: (outputs) => writeAllWhole(outputs),
};

/**
 * Writes a figure or report whole or not at all: the parent folder is created when missing (the
 * README's `--out out/service.pdf` on a fresh clone), the data goes to a temporary file beside the
 * target and is renamed over it only when complete, so an existing file is never left half-written.
 * Throws `InputError` naming the path when the file cannot be written.
 *
 * @example writeFileWhole('out/findings.md', markdown)
 */
export function writeFileWhole(path: string, data: string | Uint8Array): void {
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.partial`);
  try {
    makeFolders(dirname(path));
    writeFileSync(temporary, data);
    renameSync(temporary, path);
  } catch (error) {
    rmSync(temporary, { force: true });
    const reason = (error as NodeJS.ErrnoException).code ?? 'an error';
    throw new InputError(path, expectedGot('a file that can be written', `${reason} writing ${path}`));
  }
}

/** `discern --help`: the verbs and their summaries. @example io.stdout(usageOf(commands)) */
export function usageOf(list: readonly Command[]): string {
  const width = Math.max(...list.map((c) => c.verb.length));
  return [
    'discern — selective-coordination time-current workbench',
    '',
    'usage: discern <verb> [arguments]   (discern <verb> --help for its flags)',
    '',
    ...list.map((c) => `  ${c.verb.padEnd(width)}  ${c.summary}`),
    '',
    'Exit codes: 0 done; 1 a check found an overlap or protection failure; 2 bad input.',
    '',
  ].join('\n');
}

/**
 * Dispatches `argv` (without node and the script) to its verb and resolves to the exit code. Bad
 * input (`InputError`) prints its one-line message and gives 2; any other error prints one line and
 * gives 2 as well.
 *
 * @example process.exitCode = await runCli(['transformer', '--kva', '1500', ...], nodeIO)
 */
export async function runCli(argv: readonly string[], io: CommandIO, list: readonly Command[] = commands) {
  const [verb, ...args] = argv;
  if (verb === '--help' || verb === '-h' || verb === 'help') {
    io.stdout(usageOf(list));
    return 0;
  }
  if (verb === undefined) {
    io.stderr(usageOf(list));
    return 2;
  }
  const command = list.find((c) => c.verb === verb);
  if (!command) {
    io.stderr(`verb: ${expectedGot(`one of ${list.map((c) => c.verb).join(', ')}`, verb)}\n`);
    return 2;
  }
  try {
    return await command.run(args, io);
  } catch (error) {
    const message =
      error instanceof InputError
        ? error.message
        : `discern ${verb}: ${(error instanceof Error ? error.message : String(error)).split('\n')[0]}`;
    io.stderr(`${message}\n`);
    return 2;
  }
}

/** True when this module is the program being run (`tsx src/cli/main.ts` or `bin/discern.js`). */
function isEntry(): boolean {
  const script = process.argv[1];
  if (!script) return false;
  let real: string;
  try {
    real = realpathSync(script);
  } catch {
    return false;
  }
  return real === fileURLToPath(import.meta.url) || /[\\/]bin[\\/]discern\.js$/.test(real);
}

if (isEntry()) {
  // A reader that stops early (`discern check study.json | head`) closes the pipe: end quietly, as other
  // command-line tools do, not with a stack trace.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'EPIPE') throw error;
    process.exit(process.exitCode ?? 0);
  });
  process.exitCode = await runCli(process.argv.slice(2), nodeIO);
}
