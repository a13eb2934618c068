import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { isAbsolute, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { CommandIO } from '../../src/cli/command.ts';
import { runCli } from '../../src/cli/main.ts';
import { writeAllWhole } from '../../src/cli/writeAll.ts';

/** Every `npm run discern -- …` line of the README's tour, with the exit code its comment documents. */
function tourCommands(): { line: string; argv: string[]; codes: number[] }[] {
  const readme = readFileSync('README.md', 'utf8');
  const tour = readme.slice(readme.indexOf('## A short tour'));
  const block = /```sh\n([\s\S]*?)```/.exec(tour)?.[1] ?? '';
  const commands: { line: string; argv: string[]; codes: number[] }[] = [];
  let comment = '';
  for (const line of block.split('\n')) {
    if (line.startsWith('#')) comment = line;
    const match = /^npm run discern -- (.*)$/.exec(line.trim());
    if (!match) continue;
    const documented = /exit (\d)/.exec(comment);
    commands.push({ line, argv: words(match[1]), codes: [0, ...(documented ? [Number(documented[1])] : [])] });
  }
  return commands;
}

/** Shell words: spaces split, double quotes group. */
function words(text: string): string[] {
  return [...text.matchAll(/"([^"]*)"|(\S+)/g)].map((m) => m[1] ?? m[2]);
}

/** The process's file system, rooted at `root` as if the commands ran there from a fresh clone. */
function rootedIO(root: string): CommandIO & { err: string[] } {
  const at = (path: string) => (isAbsolute(path) ? path : join(root, path));
  const err: string[] = [];
  return {
    err,
    stdout: () => undefined,
    stderr: (text) => void err.push(text),
    readText: (path) => readFileSync(at(path), 'utf8'),
    writeFile: (path, data) => writeAllWhole([{ path: at(path), data }]),
  };
}

describe("README's tour", () => {
  const root = mkdtempSync(join(tmpdir(), 'discern-tour-'));
  cpSync('demo', join(root, 'demo'), { recursive: true });
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  const commands = tourCommands();

  it('has the expected defaults: the tour shows at least the five first verbs', () => {
    expect(commands.map((c) => c.argv[0])).toEqual(
      expect.arrayContaining(['transformer', 'faults', 'band', 'check', 'plot']),
    );
  });

  it.each(commands)('runs on a fresh copy: $line', async ({ argv, codes }) => {
    const io = rootedIO(root);
    const code = await runCli(argv, io);
    expect(io.err.join('')).toBe('');
    expect(codes).toContain(code);
    for (const flag of ['--out', '--report']) {
      const i = argv.indexOf(flag);
      if (i >= 0)
        expect(existsSync(join(root, argv[i + 1])) && statSync(join(root, argv[i + 1])).size).toBeGreaterThan(0);
    }
  });
});
