import { expectedGot, InputError } from '../errors.ts';

const STRICT = new TextDecoder('utf-8', { fatal: true });

/**
 * A file's bytes as text, refusing bytes that are not UTF-8 (RFC 3629): read leniently, a Latin-1
 * "Köln" becomes "K" and a replacement character and "ln", and a study written back from it keeps the damage. Throws `InputError` under
 * `path` with the first bad byte and where it stands.
 *
 * @example utf8TextOf(readFileSync('study.json'), 'study.json')
 */
export function utf8TextOf(bytes: Uint8Array, path: string): string {
  try {
    return STRICT.decode(bytes);
  } catch {
    const at = firstBadByte(bytes);
    const before = bytes.subarray(0, at);
    const line = before.filter((b) => b === 0x0a).length + 1;
    const column = at - before.lastIndexOf(0x0a);
    const hex = (bytes[at] ?? 0).toString(16).toUpperCase().padStart(2, '0');
    throw new InputError(path, expectedGot('UTF-8 text', `byte 0x${hex} at line ${line}, column ${column}`));
  }
}

/**
 * Where the first sequence that breaks UTF-8 starts. The shortest prefix that fails to decode (a
 * sequence cut off at its end waits for more) is found by halving, since every prefix of a good prefix
 * is good; its last byte broke it, or the lead byte of the unfinished sequence just before it.
 */
function firstBadByte(bytes: Uint8Array): number {
  let good = 0;
  let bad = bytes.length;
  while (bad - good > 1) {
    const middle = (good + bad) >>> 1;
    if (decodes(bytes.subarray(0, middle))) good = middle;
    else bad = middle;
  }
  const last = bad - 1;
  let lead = last - 1;
  while (lead >= 0 && last - lead <= 3 && (bytes[lead] & 0xc0) === 0x80) lead--;
  return lead >= 0 && last - lead <= 3 && bytes[lead] >= 0xc0 && decodes(bytes.subarray(0, lead)) ? lead : last;
}

function decodes(prefix: Uint8Array): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(prefix, { stream: true });
    return true;
  } catch {
    return false;
  }
}
