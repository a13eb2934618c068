import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { expectedGot, InputError } from '../engine/errors.ts';
import { utf8TextOf } from '../engine/study/utf8Text.ts';

/** The largest file the command line reads (64 MiB): a study of about 150,000 devices (8,000 take 3.3 MB). */
export const LARGEST_TEXT_FILE_BYTES = 64 * 2 ** 20;

const CHUNK_BYTES = 2 ** 20;

/**
 * Reads a file as UTF-8 text, whole, refusing what would otherwise go wrong quietly or take the machine
 * down: bytes that are not UTF-8 (`utf8TextOf`), and more than `largest` bytes (a huge file, or a device
 * such as /dev/zero that never ends). Those throw `InputError` naming the file; a file that cannot be
 * opened or read throws the file system's error.
 *
 * @example const text = readTextFile('demo/harrowmere-selective.json')
 */
export function readTextFile(path: string, largest = LARGEST_TEXT_FILE_BYTES): string {
  const descriptor = openSync(path, 'r');
  try {
    // A device or a pipe says 0 bytes: it is read in chunks up to the limit like any other file.
    if (fstatSync(descriptor).size > largest) throw tooLarge(path, largest);
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(CHUNK_BYTES);
      const read = readSync(descriptor, chunk, 0, CHUNK_BYTES, null);
      if (read === 0) break;
      total += read;
      if (total > largest) throw tooLarge(path, largest);
      chunks.push(chunk.subarray(0, read));
    }
    return utf8TextOf(Buffer.concat(chunks, total), path);
  } finally {
    closeSync(descriptor);
  }
}

function tooLarge(path: string, largest: number): InputError {
  return new InputError(path, expectedGot(`a file of at most ${largest / 2 ** 20} MiB`, 'a larger one'));
}
