import * as fs from 'node:fs';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { CommandIO } from '../../src/cli/command.ts';
import { type WholeWritingIO, writeAllWhole, writeOutputs } from '../../src/cli/writeAll.ts';

// One rename can be made to fail, as a folder appearing in a target's place after the check would.
const failing = vi.hoisted(() => ({ renameTo: '' }));
vi.mock('node:fs', async (original) => {
  const real = await original<typeof import('node:fs')>();
  return {
    ...real,
    renameSync: (from: fs.PathLike, to: fs.PathLike) => {
      if (to === failing.renameTo) throw Object.assign(new Error('refused'), { code: 'EPERM' });
      real.renameSync(from, to);
    },
  };
});

const folders: string[] = [];
function scratch(): string {
  const folder = mkdtempSync(join(tmpdir(), 'discern-write-'));
  folders.push(folder);
  return folder;
}
afterEach(() => {
  failing.renameTo = '';
  for (const folder of folders.splice(0)) rmSync(folder, { recursive: true, force: true });
});

/** Every entry of a folder, hidden temporaries included, each file with its text. */
function contentsOf(folder: string): Record<string, string> {
  return Object.fromEntries(
    readdirSync(folder, { withFileTypes: true }).map((e) => [
      e.name,
      e.isDirectory() ? '(folder)' : readFileSync(join(folder, e.name), 'utf8'),
    ]),
  );
}

describe('writeAllWhole', () => {
  it('has the expected defaults: writes every file, makes the missing folder, leaves no temporary', () => {
    const folder = join(scratch(), 'out');
    writeAllWhole([
      { path: join(folder, 'study-figure-1.svg'), data: '<svg>1</svg>' },
      { path: join(folder, 'study.md'), data: new TextEncoder().encode('# Study\n') },
    ]);
    expect(contentsOf(folder)).toEqual({ 'study-figure-1.svg': '<svg>1</svg>', 'study.md': '# Study\n' });
  });

  it('replaces nothing when the third of four targets is a folder, and says so in one line naming it', () => {
    const folder = scratch();
    writeFileSync(join(folder, 'keep-figure-1.svg'), 'ORIGINAL');
    writeFileSync(join(folder, 'keep.md'), 'LAST GOOD REPORT');
    mkdirSync(join(folder, 'keep-figure-3.svg'));
    const before = contentsOf(folder);
    const blocked = join(folder, 'keep-figure-3.svg');
    expect(() =>
      writeAllWhole(
        ['keep-figure-1.svg', 'keep-figure-2.svg', 'keep-figure-3.svg', 'keep.md'].map((name) => ({
          path: join(folder, name),
          data: `NEW ${name}`,
        })),
      ),
    ).toThrow(new RegExp(`^${blocked.replace(/[.\\/]/g, '\\$&')}: expected a file that can be written, got "EISDIR`));
    // keep-figure-2.svg is not left behind either: the folder holds exactly what it held.
    expect(contentsOf(folder)).toEqual(before);
  });

  it('puts back the files already replaced when a later rename fails, and removes the ones it added', () => {
    const folder = scratch();
    writeFileSync(join(folder, 'keep-figure-1.svg'), 'ORIGINAL');
    writeFileSync(join(folder, 'keep.md'), 'LAST GOOD REPORT');
    const before = contentsOf(folder);
    failing.renameTo = join(folder, 'keep.md');
    // Figures 1 and 2 are renamed into place before the report's own rename is refused.
    expect(() =>
      writeAllWhole(
        ['keep-figure-1.svg', 'keep-figure-2.svg', 'keep.md'].map((name) => ({
          path: join(folder, name),
          data: `NEW ${name}`,
        })),
      ),
    ).toThrow(/keep\.md: expected a file that can be written, got "EPERM writing /);
    expect(contentsOf(folder)).toEqual(before);
  });

  it('removes the folders it made for a write that failed', () => {
    const root = scratch();
    writeFileSync(join(root, 'file'), 'not a folder');
    // "out/deep" can be made, but nothing can be written under "file/".
    expect(() =>
      writeAllWhole([
        { path: join(root, 'out', 'deep', 'a.svg'), data: 'a' },
        { path: join(root, 'file', 'b.svg'), data: 'b' },
      ]),
    ).toThrow(/b\.svg: expected a file that can be written, got "ENOTDIR writing /);
    expect(contentsOf(root)).toEqual({ file: 'not a folder' });
  });
});

describe('writeOutputs', () => {
  it('hands the outputs to an io that writes all or nothing, else writes them one at a time', () => {
    const written: string[] = [];
    const io: CommandIO = {
      stdout: () => undefined,
      stderr: () => undefined,
      readText: () => '',
      writeFile: (path) => void written.push(`file ${path}`),
    };
    const outputs = [
      { path: 'a.svg', data: 'a' },
      { path: 'a.md', data: 'b' },
    ];
    writeOutputs(io, outputs);
    const whole: WholeWritingIO = { ...io, writeAll: (all) => void written.push(`all ${all.length}`) };
    writeOutputs(whole, outputs);
    expect(written).toEqual(['file a.svg', 'file a.md', 'all 2']);
  });
});
