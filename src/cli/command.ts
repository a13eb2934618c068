/**
 * What a command may touch: text out, text in, files written. The CLI passes the process's streams
 * and file system; tests pass memory.
 *
 * @example const io: CommandIO = { stdout: (t) => out.push(t), stderr: (t) => err.push(t), readText, writeFile }
 */
export interface CommandIO {
  /** Writes text to standard output as given (commands end their lines with "\n"). */
  stdout(text: string): void;
  /** Writes text to standard error as given. */
  stderr(text: string): void;
  /** Reads a UTF-8 text file; throws when it cannot. */
  readText(path: string): string;
  /** Writes a file (figures, reports). */
  writeFile(path: string, data: string | Uint8Array): void;
  /**
   * Removes a file an earlier run wrote (a figure of a longer earlier report); false when nothing stands
   * there. Throws when something does and may not be removed. Optional: an io without it removes nothing.
   */
  removeFile?(path: string): boolean;
}

/**
 * One `discern <verb>`: its name, a one-line summary for `discern --help`, its own help text, and
 * `run`, which resolves to the exit code (DEVELOPERS.md, command line: 0 done, 1 a check failed, 2 bad input). Bad input
 * is thrown as `InputError`; the dispatcher prints its one-line message and exits 2.
 *
 * @example const code = await transformerCommand.run(['--kva', '1500', ...], io)
 */
export interface Command {
  verb: string;
  summary: string;
  help: string;
  run(args: string[], io: CommandIO): Promise<number>;
}
