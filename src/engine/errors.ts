/**
 * A problem with what the user gave us (a study file, a flag, a CSV row). The CLI maps it to exit code 2.
 * The message is one line shaped `path: expected …, got "…"` so the user can find the field at once.
 *
 * @example throw new InputError('study.transformers[1].impedance', expectedGot('a percentage greater than 0', '-5'))
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  readonly path: string;
  /** The message without its path: `expected …, got "…"`. */
  readonly reason: string;

  constructor(path: string, message: string) {
    super(`${escapedControls(path)}: ${message}`);
    this.path = path;
    this.reason = message;
  }
}

// Accepts a path (a file name may hold a line break); it with each control character written as \uXXXX,
// so that the message stays on one line.
function escapedControls(path: string): string {
  // eslint-disable-next-line no-control-regex
  return path.replace(/[\u0000-\u001f\u007f]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** The `expected …, got "…"` half of an error message. */
export function expectedGot(expected: string, got: unknown): string {
  return `expected ${expected}, got ${quoteGot(got)}`;
}

/** Renders the offending value as the user typed it: strings quoted, objects as compact JSON. */
export function quoteGot(got: unknown): string {
  // Long text is cut so the message stays one readable line; JSON quoting escapes control characters.
  if (typeof got === 'string') return JSON.stringify(got.length > 60 ? `${got.slice(0, 57)}...` : got);
  if (got === undefined) return 'nothing';
  if (typeof got === 'number') return `"${got}"`;
  const text = JSON.stringify(got) ?? String(got);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}
