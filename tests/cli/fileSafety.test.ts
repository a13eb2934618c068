import {
  chmodSync,
  copyFileSync,
  existsSync,
  linkSync,
  lstatSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { nodeIO, runCli } from '../../src/cli/main.ts';
import { readTextFile } from '../../src/cli/readTextFile.ts';
import { writeAllWhole } from '../../src/cli/writeAll.ts';

const folders: string[] = [];
function scratch(): string {
  const folder = mkdtempSync(join(tmpdir(), 'discern-safety-'));
  folders.push(folder);
  return folder;
}
afterEach(() => {
  for (const folder of folders.splice(0)) rmSync(folder, { recursive: true, force: true });
});

/** Runs a verb on the real disk, as `discern` does; what it printed on standard error and its code. */
async function run(argv: string[]): Promise<{ code: number; stderr: string }> {
  const err: string[] = [];
  const code = await runCli(argv, { ...nodeIO, stdout: () => undefined, stderr: (text) => void err.push(text) });
  return { code, stderr: err.join('') };
}

/** A copy of the selective demo in a fresh folder. */
function studyCopy(): { folder: string; study: string; text: string } {
  const folder = scratch();
  const study = join(folder, 'study.json');
  copyFileSync('demo/harrowmere-selective.json', study);
  return { folder, study, text: readFileSync(study, 'utf8') };
}

describe('the command line never writes over the study it read', () => {
  it('refuses paths --out naming the input another way', async () => {
    const { study, text } = studyCopy();
    const { code, stderr } = await run(['paths', study, '--out', relative(process.cwd(), study)]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/^--out: expected a file other than the input/);
    expect(readFileSync(study, 'utf8')).toBe(text);
  });

  it('refuses a report written over the study through a symbolic or a hard link to it', async () => {
    const { folder, study, text } = studyCopy();
    const symbolic = join(folder, 'findings.md');
    symlinkSync(study, symbolic);
    const throughLink = await run(['check', study, '--report', symbolic]);
    expect(throughLink.code).toBe(2);
    expect(throughLink.stderr).toBe(
      `${symbolic}: expected a file other than the study read, got ${JSON.stringify(symbolic)}\n`,
    );
    const hard = join(folder, 'copy.md');
    linkSync(study, hard);
    expect((await run(['check', study, '--report', hard])).code).toBe(2);
    expect(readFileSync(study, 'utf8')).toBe(text);
  });
});

describe('reading a study file', () => {
  it('refuses bytes that are not UTF-8, naming the byte and where it stands (RFC 3629)', async () => {
    const { study, text } = studyCopy();
    // "Köln" in Latin-1: the ö is the single byte 0xF6, which no UTF-8 text holds.
    const latin1 = Buffer.from(text.replace('"Harrowmere Cold Store', '"Harrowmere K\u00f6ln Store'), 'latin1');
    writeFileSync(study, latin1);
    const line = latin1.subarray(0, latin1.indexOf(0xf6)).toString('latin1').split('\n').length;
    const { code, stderr } = await run(['check', study]);
    expect(code).toBe(2);
    expect(stderr).toMatch(
      new RegExp(`^.*study\\.json: expected UTF-8 text, got "byte 0xF6 at line ${line}, column \\d+"\\n$`),
    );
  });

  it('refuses a file past the size limit, and a device that never ends', () => {
    const { study } = studyCopy();
    expect(() => readTextFile(study, 1000)).toThrow(/study\.json: expected a file of at most 0\.00095\d* MiB/);
    expect(() => readTextFile('/dev/zero', 2 ** 20)).toThrow('/dev/zero: expected a file of at most 1 MiB');
  });
});

describe('writing a file', () => {
  it('writes through a symbolic link, which stays a link, and keeps the permissions of the file replaced', () => {
    const folder = scratch();
    const target = join(folder, 'findings.md');
    writeFileSync(target, 'OLD');
    chmodSync(target, 0o640);
    const link = join(folder, 'latest.md');
    symlinkSync(target, link);
    writeAllWhole([{ path: link, data: 'NEW' }]);
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readFileSync(target, 'utf8')).toBe('NEW');
    expect(statSync(target).mode & 0o777).toBe(0o640);
  });

  it('writes a file whose name is near the file system limit (255 bytes): the temporary name is short', () => {
    const folder = scratch();
    const path = join(folder, `${'x'.repeat(250)}.svg`);
    writeAllWhole([{ path, data: '<svg/>' }]);
    expect(readdirSync(folder)).toEqual([`${'x'.repeat(250)}.svg`]);
  });

  it('says in one line why a write failed, and leaves no folder it made', async () => {
    const { folder, study } = studyCopy();
    const blocked = join(folder, 'study.json', 'new', 'service.svg');
    const { code, stderr } = await run(['plot', study, '--out', blocked]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/^.*service\.svg: expected a file that can be written, got "ENOTDIR writing .*"\n$/);
    const dangling = join(folder, 'made', 'deeper', `${'y'.repeat(300)}.svg`);
    expect((await run(['plot', study, '--out', dangling])).code).toBe(2);
    expect(existsSync(join(folder, 'made'))).toBe(false);
  });
});
