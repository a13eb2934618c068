import {
  accessSync,
  chmodSync,
  constants,
  copyFileSync,
  existsSync,
  linkSync,
  lstatSync,
  mkdirSync,
  readlinkSync,
  realpathSync,
  renameSync,
  rmdirSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { expectedGot, InputError } from '../engine/errors.ts';
import type { CommandIO } from './command.ts';

/** One file of a command's output: where it goes and what it holds. */
export interface Output {
  path: string;
  data: string | Uint8Array;
}

/** A `CommandIO` that can also write several files all or nothing (`writeAllWhole` on the disk). */
export interface WholeWritingIO extends CommandIO {
  /** Writes every output or none; throws `InputError` naming the file that could not be written. */
  writeAll(outputs: readonly Output[]): void;
}

/**
 * Writes a command's outputs through `io`: all or nothing when the io can (`WholeWritingIO`), else one
 * `writeFile` each (the in-memory io of the tests, where a write cannot half-fail).
 *
 * @example writeOutputs(io, [{ path: 'out/s-figure-1.svg', data: svg }, { path: 'out/s.md', data: text }])
 */
export function writeOutputs(io: CommandIO, outputs: readonly Output[]): void {
  if (isWholeWriting(io)) io.writeAll(outputs);
  else for (const { path, data } of outputs) io.writeFile(path, data);
}

/**
 * Writes several files whole or not at all: each goes to a temporary file beside its target first, and
 * only when every one is written are they renamed into place. A target that is a folder stops the
 * write before anything is renamed; a rename that fails part way puts back the files already replaced.
 * On any failure the temporaries (and the folders made for them) are removed, so every existing file
 * is left as it was. A file the user may not write is refused, not replaced; a file replaced keeps its
 * permissions; a symbolic link is written through, to the file it names, and stays a link. Throws
 * `InputError` naming the file that could not be written.
 *
 * @example writeAllWhole([{ path: 'out/s-figure-1.svg', data: svg }, { path: 'out/s.md', data: text }])
 */
export function writeAllWhole(outputs: readonly Output[]): void {
  const made: string[] = [];
  const staged: { path: string; temporary: string }[] = [];
  const kept: { path: string; copy: string | undefined }[] = [];
  let at = outputs[0]?.path ?? '';
  try {
    // Stage every output beside its target, so the renames below stay on one file system.
    for (const output of outputs) {
      at = output.path;
      const path = linkedFileOf(output.path);
      // A rename would replace a read-only file: refuse it as writing into it would be refused.
      if (existsSync(path)) accessSync(path, constants.W_OK);
      made.push(...makeFolders(dirname(path)));
      const temporary = siblingOf(path, 'partial');
      staged.push({ path, temporary });
      writeFileSync(temporary, output.data);
      if (existsSync(path)) chmodSync(temporary, statSync(path).mode & 0o7777);
    }
    // A folder in a target's place would fail its rename: stop before any file is replaced.
    for (const { path } of staged) {
      at = path;
      if (isFolder(path)) throw Object.assign(new Error('a folder'), { code: 'EISDIR' });
    }
    // Rename into place, keeping a link to each replaced file until every rename is done.
    for (const { path, temporary } of staged) {
      at = path;
      const copy = existsSync(path) ? keepCopy(path) : undefined;
      kept.push({ path, copy });
      renameSync(temporary, path);
    }
  } catch (error) {
    restore(kept, staged);
    for (const { temporary } of staged) quietly(() => rmSync(temporary, { force: true }));
    for (const folder of made.reverse()) quietly(() => rmdirSync(folder));
    const reason = (error as NodeJS.ErrnoException).code ?? 'an error';
    throw new InputError(at, expectedGot('a file that can be written', `${reason} writing ${at}`));
  }
  for (const { copy } of kept) if (copy) quietly(() => rmSync(copy, { force: true }));
}

// Accepts any io; true when it offers the all-or-nothing write.
function isWholeWriting(io: CommandIO): io is WholeWritingIO {
  return typeof (io as Partial<WholeWritingIO>).writeAll === 'function';
}

let siblings = 0;

// Accepts a target path; a hidden name beside it that this process alone uses, short whatever the
// target's name (a name near the file system's limit leaves no room for more).
function siblingOf(path: string, kind: 'partial' | 'previous'): string {
  return join(dirname(path), `.discern-${process.pid}-${++siblings}.${kind}`);
}

// Accepts a target path; the file a symbolic link there names (a link to a missing file: the path it
// holds), else the path itself.
function linkedFileOf(path: string): string {
  try {
    if (!lstatSync(path).isSymbolicLink()) return path;
  } catch {
    return path;
  }
  try {
    return realpathSync(path);
  } catch {
    return resolve(dirname(path), readlinkSync(path));
  }
}

// Accepts a path; true when a folder stands there (a rename replaces a file or a link, never a folder).
function isFolder(path: string): boolean {
  try {
    return lstatSync(path).isDirectory();
  } catch {
    return false;
  }
}

// Accepts an existing file; a hard link to it (a copy where links are refused) to put back on failure.
function keepCopy(path: string): string {
  const copy = siblingOf(path, 'previous');
  rmSync(copy, { force: true });
  try {
    linkSync(path, copy);
  } catch {
    copyFileSync(path, copy);
  }
  return copy;
}

// Accepts the targets reached so far and their temporaries. A target whose temporary was renamed gets
// its previous file back (or is removed when it had none); one whose rename failed still holds its file.
function restore(kept: { path: string; copy: string | undefined }[], staged: { temporary: string }[]): void {
  kept.forEach(({ path, copy }, i) => {
    const replaced = !existsSync(staged[i].temporary);
    if (copy) quietly(() => (replaced ? renameSync(copy, path) : rmSync(copy, { force: true })));
    else if (replaced) quietly(() => rmSync(path, { force: true }));
  });
}

// Accepts a clean-up step; a failure there must not hide the error being reported.
function quietly(step: () => void): void {
  try {
    step();
  } catch {
    // The first error is the one the user needs.
  }
}

/**
 * Creates a folder and its missing parents, one level at a time (Node's recursive mkdir can spin on
 * file systems that refuse folders, such as /proc); the folders it made, outermost first.
 */
export function makeFolders(folder: string): string[] {
  const missing: string[] = [];
  for (let at = folder; !existsSync(at) && dirname(at) !== at; at = dirname(at)) missing.push(at);
  missing.reverse();
  for (const at of missing) mkdirSync(at);
  return missing;
}
