// The project's root folder, found from wherever the benchmarks run: the sources in bench/, or their
// bundle in node_modules/.cache/ (see bench/build.config.ts).
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The nearest folder at or above this module that holds the project (package.json beside src/engine). */
function rootOf(start: string): string {
  for (let dir = start; ; dir = dirname(dir)) {
    if (existsSync(join(dir, 'package.json')) && existsSync(join(dir, 'src', 'engine'))) return dir;
    if (dirname(dir) === dir) throw new Error(`no project folder above ${start}`);
  }
}

/** Absolute path of the project root, ending in a slash. */
export const ROOT = `${rootOf(dirname(fileURLToPath(import.meta.url)))}/`;
