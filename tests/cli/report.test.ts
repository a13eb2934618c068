import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pathsCommand } from '../../src/cli/commands/paths.ts';
import { reportCommand } from '../../src/cli/commands/report.ts';
import { nodeIO, runCli } from '../../src/cli/main.ts';
import { readStudy } from '../../src/engine/study/index.ts';
import { memoryIO, runVerb } from './run.ts';

describe('discern report', () => {
  it('has the expected defaults: Markdown with its figures written beside it', async () => {
    const { code, stdout, files } = await runVerb(
      ['demo/harrowmere-fused.json', '--out', 'out/fused.md'],
      reportCommand,
    );
    expect(code).toBe(0);
    expect(stdout).toMatch(/wrote out\/fused\.md\n$/);
    const md = String(files.get('out/fused.md'));
    expect(md).toMatch(/^# Protective device coordination study/);
    for (const heading of ['Scope and method', 'One-line diagram', 'Fault currents', 'Device settings', 'Findings'])
      expect(md).toContain(heading);
    expect(files.get('out/fused-figure-1.svg')).toMatch(/^<svg /);
    expect(md).toContain('(fused-figure-1.svg)');
  });

  it('writes one self-contained HTML page with no script', async () => {
    const { code, files } = await runVerb(
      ['demo/harrowmere-selective.json', '--out', 'out/s.html', '--paper', 'a3', '--orientation', 'landscape'],
      reportCommand,
    );
    expect(code).toBe(0);
    const html = String(files.get('out/s.html'));
    expect(html).toMatch(/^<!DOCTYPE html>/);
    expect(html).toContain('@page { size: 1190.55pt 841.89pt;');
    expect(html).not.toMatch(/<script/i);
  });

  it('leaves the last good report and every figure as they were when one figure cannot be written', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'discern-report-'));
    try {
      writeFileSync(join(folder, 'keep-figure-1.svg'), 'ORIGINAL');
      writeFileSync(join(folder, 'keep.md'), 'LAST GOOD REPORT');
      // A folder where the third figure goes: its write fails after the first two are made.
      mkdirSync(join(folder, 'keep-figure-3.svg'));
      const before = readdirSync(folder).sort();
      // The command line's own file writing, with the streams caught.
      const io = { ...memoryIO(), writeFile: nodeIO.writeFile, writeAll: nodeIO.writeAll };
      const code = await runCli(['report', 'demo/harrowmere-selective.json', '--out', join(folder, 'keep.md')], io);
      expect(code).toBe(2);
      expect(io.err.join('')).toMatch(
        /^[^\n]*keep-figure-3\.svg: expected a file that can be written, got "EISDIR[^\n]*\n$/,
      );
      expect(readFileSync(join(folder, 'keep-figure-1.svg'), 'utf8')).toBe('ORIGINAL');
      expect(readFileSync(join(folder, 'keep.md'), 'utf8')).toBe('LAST GOOD REPORT');
      // No new figure and no temporary is left beside them.
      expect(readdirSync(folder).sort()).toEqual(before);
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('removes the figures a longer earlier report of the same name left beside it, and no others', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'discern-report-'));
    try {
      const io = {
        ...memoryIO(),
        writeFile: nodeIO.writeFile,
        writeAll: nodeIO.writeAll,
        removeFile: nodeIO.removeFile,
      };
      const argv = ['report', 'demo/harrowmere-fused.json', '--out', join(folder, 'study.md')];
      expect(await runCli(argv, io)).toBe(0);
      const figures = readdirSync(folder).filter((name) => name.endsWith('.svg')).length;
      expect(figures).toBeGreaterThan(2);
      // An earlier report had two figures more; a figure after a gap, and another report's, are not its.
      const later = [figures + 1, figures + 2].map((n) => `study-figure-${n}.svg`);
      for (const name of [...later, `study-figure-${figures + 4}.svg`, 'other-figure-99.svg'])
        writeFileSync(join(folder, name), 'EARLIER');
      io.out.length = 0;
      expect(await runCli(argv, io)).toBe(0);
      for (const name of later) expect(readdirSync(folder)).not.toContain(name);
      expect(readdirSync(folder)).toContain(`study-figure-${figures + 4}.svg`);
      expect(readdirSync(folder)).toContain('other-figure-99.svg');
      expect(readdirSync(folder).filter((name) => name.startsWith('study-figure-'))).toHaveLength(figures + 1);
      expect(io.out.join('')).toMatch(
        new RegExp(
          `removed 2 figures of an earlier, longer report: .*study-figure-${figures + 1}\\.svg, .*study-figure-${figures + 2}\\.svg\\n$`,
        ),
      );
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('leaves a figure it may not remove in place and says so, removes those after it, and writes the report', async () => {
    const io = memoryIO();
    const argv = ['report', 'demo/harrowmere-fused.json', '--out', 'out/f.md'];
    expect(await runCli(argv, io)).toBe(0);
    const figures = [...io.files.keys()].filter((path) => path.endsWith('.svg')).length;
    const later = [1, 2, 3].map((k) => `out/f-figure-${figures + k}.svg`);
    for (const path of later) io.files.set(path, 'EARLIER');
    // The second of the three may not be removed (the user made it read-only, say).
    const refused = Object.assign(new Error('permission denied'), { code: 'EACCES' });
    const removeFile = (path: string) => {
      if (path === later[1]) throw refused;
      return io.files.delete(path);
    };
    io.out.length = 0;
    expect(await runCli(argv, { ...io, removeFile })).toBe(0);
    expect([...io.files.keys()].filter((path) => later.includes(path))).toEqual([later[1]]);
    expect(io.err.join('')).toBe(`${later[1]}: left in place (EACCES); it is not a figure of this report\n`);
    expect(io.out.join('')).toMatch(`removed 2 figures of an earlier, longer report: ${later[0]}, ${later[2]}\n`);
  });

  it('refuses a bad paper, orientation or output with a one-line message naming the flag', async () => {
    for (const [args, message] of [
      [['--out', 'x.pdf', '--paper', 'legal'], /^--paper: expected letter, a4, tabloid or a3, got "legal"\n$/],
      [['--out', 'x.pdf', '--orientation', 'sideways'], /^--orientation: expected portrait or landscape/],
      [['--out', 'x.docx'], /^--out: expected a file name ending \.pdf, \.html or \.md/],
      [['--out', 'x.pdf', '--date', '2026-02-30'], /^--date: expected a calendar date \(YYYY-MM-DD\) or other text/],
    ] as const) {
      const { code, stderr } = await runVerb(['demo/harrowmere-fused.json', ...args], reportCommand);
      expect(code).toBe(2);
      expect(stderr).toMatch(message);
    }
  });
});

describe('discern paths', () => {
  it('adds one sheet per protective path to a copy, with the curves of its path, leaving the rest as written', async () => {
    const input = 'demo/harrowmere-full.json';
    const { code, stdout, files } = await runVerb([input, '--out', 'out/paths.json'], pathsCommand);
    expect(code).toBe(0);
    const written = JSON.parse(String(files.get('out/paths.json')));
    const original = JSON.parse(readFileSync(input, 'utf8'));
    const added = written.views.slice(original.views?.length ?? 0);
    expect(stdout).toContain(`${added.length} sheets added`);
    expect(added.length).toBeGreaterThan(3);
    expect({ ...written, views: original.views }).toEqual(original);
    const { study } = readStudy(written);
    expect(study).toBeDefined();
    // Every device appears on some sheet, and a motor's sheet carries its starting curve.
    const shown = new Set(added.flatMap((view: { devices: string[] }) => view.devices));
    for (const device of study!.devices) expect(shown.has(device.id), device.id).toBe(true);
    for (const motor of study!.motors) {
      const feeder = study!.devices.find((d) => d.feeds === motor.id);
      if (!feeder) continue;
      const sheet = added.find((view: { devices: string[] }) => view.devices.includes(feeder.id));
      expect(sheet.motors).toContain(motor.id);
    }
  });

  it('never writes over its input', async () => {
    const { code, stderr } = await runVerb(
      ['demo/harrowmere-full.json', '--out', 'demo/harrowmere-full.json'],
      pathsCommand,
    );
    expect(code).toBe(2);
    expect(stderr).toMatch(/^--out: expected a file other than the input/);
  });
});
