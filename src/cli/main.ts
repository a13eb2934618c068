import { accessSync, constants, lstatSync, realpathSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expectedGot, InputError } from '../engine/errors.ts';
import type { Command, CommandIO } from './command.ts';
import { commands } from './commands/index.ts';
import { readTextFile } from './readTextFile.ts';
import { fileIdentity } from './sameFile.ts';
import { writeAllWhole, type Output, type WholeWritingIO } from './writeAll.ts';

/** The files this process has read, by what they are on the disk (`fileIdentity`). */
const filesRead = new Set<string>();

/**
 * The process's streams and file system as a `CommandIO`: text read strictly as UTF-8, files written
 * whole (several all or nothing), and never over a file this run has read, however the path is spelled,
 * so no verb can replace the user's study with its output.
 */
export const nodeIO: WholeWritingIO = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
  readText: (path) => {
    const text = readTextFile(path);
    const identity = fileIdentity(path);
    if (identity !== undefined) filesRead.add(identity);
    return text;
  },
  writeFile: (path, data) => writeNotOverInputs([{ path, data }]),
  writeAll: (outputs) => writeNotOverInputs(outputs),
  removeFile: (path) => {
    // Only a file or a link (the link itself) is removed: never a folder, never a file this run read, and
    // never one the user may not write, which a write refuses as well.
    const stat = lstatSync(path, { throwIfNoEntry: false });
    if (!stat) return false;
    if (stat.isDirectory()) throw Object.assign(new Error(`${path} is a folder`), { code: 'EISDIR' });
    const identity = fileIdentity(path);
    if (identity !== undefined && filesRead.has(identity))
      throw new InputError(path, expectedGot('a file other than the study read', path));
    if (!stat.isSymbolicLink()) accessSync(path, constants.W_OK);
    rmSync(path);
    return true;
  },
};

function writeNotOverInputs(outputs: readonly Output[]): void {
  for (const { path } of outputs) {
    const identity = fileIdentity(path);
    if (identity !== undefined && filesRead.has(identity))
      throw new InputError(path, expectedGot('a file other than the study read', path));
  }
  writeAllWhole(outputs);
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
