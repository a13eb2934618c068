import { statSync } from 'node:fs';
import { resolve } from 'node:path';

/**
 * What a path leads to on the disk (device and inode, through any symbolic link), so that two spellings,
 * a link or a hard link of one file are known as one; `undefined` where nothing is there yet.
 *
 * @example fileIdentity('demo/harrowmere-selective.json') // "2049:1835" (device:inode)
 */
export function fileIdentity(path: string): string | undefined {
  try {
    const { dev, ino } = statSync(path);
    return `${dev}:${ino}`;
  } catch {
    return undefined;
  }
}

/**
 * Whether two paths name one file: the same file on the disk, or, where neither exists yet, the same
 * absolute path.
 *
 * @example isSameFile('study.json', './study.json') // true
 */
export function isSameFile(a: string, b: string): boolean {
  const [first, second] = [fileIdentity(a), fileIdentity(b)];
  return first !== undefined || second !== undefined ? first === second : resolve(a) === resolve(b);
}
