import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { JSDOM } from 'jsdom';
import { plotCommand } from '../../src/cli/commands/plot.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { pagesOf, readPdf, textRunsOf } from '../plot/pdf/pdfReader.ts';
import { runVerb } from './run.ts';

const standby = 'demo/harrowmere-standby.json';

describe('discern plot', () => {
  it('has the expected defaults: the first view, as a standalone SVG carrying the caution', async () => {
    const { code, stdout, files } = await runVerb(
      ['demo/harrowmere-selective.json', '--out', 'out/x.svg'],
      plotCommand,
    );
    expect(code).toBe(0);
    expect(stdout).toBe('service: wrote out/x.svg\n');
    const svg = String(files.get('out/x.svg'));
    const doc = new new JSDOM('').window.DOMParser().parseFromString(svg, 'image/svg+xml');
    expect(doc.getElementsByTagName('parsererror')).toHaveLength(0);
    expect(doc.documentElement.getAttribute('width')).toBe('960');
    expect(doc.documentElement.textContent?.replace(/\s+/g, ' ')).toContain(CAUTION.slice(0, 40));
  });

  it('writes PNG and PDF bytes for a chosen view and size', async () => {
    const png = await runVerb(
      ['demo/harrowmere-fused.json', '--view', 'primary', '--out', 'out/x.png', '--scale', '1'],
      plotCommand,
    );
    expect(Array.from((png.files.get('out/x.png') as Uint8Array).slice(0, 4))).toEqual([0x89, 0x50, 0x4e, 0x47]);
    const pdf = await runVerb(
      ['demo/harrowmere-fused.json', '--view', 'primary', '--out', 'out/x.pdf', '--paper', 'a4'],
      plotCommand,
    );
    expect(new TextDecoder().decode((pdf.files.get('out/x.pdf') as Uint8Array).slice(0, 5))).toBe('%PDF-');
  });

  it('prints the PDF from the sheet itself: one page whose text reads back as the sheet wrote it, caution included', async () => {
    const { code, files } = await runVerb(['demo/harrowmere-selective.json', '--out', 'out/x.pdf'], plotCommand);
    expect(code).toBe(0);
    const file = readPdf(files.get('out/x.pdf') as Uint8Array);
    const pages = pagesOf(file);
    expect(pages).toHaveLength(1);
    const runs = textRunsOf(file, pages[0]);
    expect(runs).toContain('Time in seconds');
    expect(runs.join(' ')).toContain(CAUTION.slice(0, 40));
    // The y axis title is turned a quarter turn: its text matrix is [0 -1 -1 0 x y].
    expect(pages[0].content).toMatch(/0 -1 -1 0 [\d.]+ [\d.]+ Tm <[0-9A-F]+> Tj/);
  });

  it('prints on the paper and orientation chosen, as the workbench does: A3 portrait is 297 × 420 mm (ISO 216)', async () => {
    const pdf = await runVerb(
      ['demo/harrowmere-selective.json', '--out', 'out/x.pdf', '--paper', 'a3', '--orientation', 'portrait'],
      plotCommand,
    );
    const text = new TextDecoder('latin1').decode(pdf.files.get('out/x.pdf') as Uint8Array);
    const [, width, height] = /\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/.exec(text)!;
    expect(Number(width)).toBeCloseTo((297 / 25.4) * 72, 0);
    expect(Number(height)).toBeCloseTo((420 / 25.4) * 72, 0);
  });

  it('exits 2 naming the flag for a bad format, view, size or paper', async () => {
    const cases: [string[], RegExp][] = [
      [['--out', 'x.gif'], /^--out: expected a file name ending \.svg, \.png or \.pdf, got "x\.gif"\n$/],
      [
        ['--out', 'x.svg', '--view', 'nowhere'],
        /^--view: expected one of service, primary, office, emergency, got "nowhere"\n$/,
      ],
      [['--out', 'x.svg', '--width', '-3'], /^--width: expected a number greater than 0, got "-3"\n$/],
      [['--out', 'x.svg', '--width', '100'], /^--width: expected a width in px of at least 480, got "100"\n$/],
      [['--out', 'x.svg', '--height', '99999'], /^--height: expected a height in px of at least 360, got "99999"\n$/],
      [['--out', 'x.png', '--scale', '100'], /^--scale: expected a zoom from 0\.1 to 10, got "100"\n$/],
      [['--out', 'x.svg', '--width', '0x400'], /^--width: expected a number greater than 0, got "0x400"\n$/],
      // Each flag within its bounds, the image past what memory holds: 20,000² px at 10 × is 4·10¹⁰ pixels.
      [
        ['--out', 'x.png', '--width', '20000', '--height', '20000', '--scale', '10'],
        /^--scale: expected a PNG of at most 100 million pixels \(width × height × scale²\), got "10"\n$/,
      ],
      [
        ['--out', 'x.png', '--width', '12000', '--height', '9000'],
        /^--height: expected a PNG of at most 100 million pixels \(width × height × scale²\), got "9000"\n$/,
      ],
      [['--out', 'x.pdf', '--paper', 'legal'], /^--paper: expected letter, a4, tabloid or a3, got "legal"\n$/],
      [['--out', 'x.pdf', '--orientation', 'up'], /^--orientation: expected portrait or landscape, got "up"\n$/],
    ];
    for (const [args, message] of cases) {
      const { code, stderr } = await runVerb(['demo/harrowmere-selective.json', ...args], plotCommand);
      expect(code).toBe(2);
      expect(stderr).toMatch(message);
    }
  });

  it('notes on standard error, exit 0, a curve the figure leaves undrawn: the generator cable short-circuit limit lies off the axes', async () => {
    const { code, stdout, stderr, files } = await runVerb(
      [standby, '--scenario', 'on-generator', '--view', 'emergency-generator', '--out', 'out/g.svg'],
      plotCommand,
    );
    expect(code).toBe(0);
    expect(stdout).toBe('emergency-generator (On generator): wrote out/g.svg\n');
    const notes = stderr.split('\n').filter(Boolean);
    expect(notes.every((line) => line.startsWith('note: '))).toBe(true);
    const undrawn = notes.find((line) => /short-circuit limit/.test(line));
    expect(undrawn).toMatch(/^note: Generator cable short-circuit limit .* is not drawn$/);
    // The figure itself names it nowhere: the note is the reader's only word of it.
    expect(String(files.get('out/g.svg'))).not.toContain('short-circuit limit');
  });

  it("names on standard error, in SVG, PNG and PDF alike, each curve a small figure's key counts but cannot name", async () => {
    const small = [standby, '--scenario', 'on-generator', '--view', 'emergency-generator', '--width', '480'];
    const runs = await Promise.all(
      ['out/s.svg', 'out/s.png', 'out/s.pdf'].map((out) =>
        runVerb([...small, '--height', '360', '--out', out, '--scale', '1'], plotCommand),
      ),
    );
    const [svgRun] = runs;
    const svg = String(svgRun.files.get('out/s.svg'));
    const more = /\+ (\d+) more curves? not named in this key/.exec(svg);
    expect(more, 'the key ends with a count of what it leaves out').not.toBeNull();
    expect(svg).not.toMatch(/drawing notes/);
    const unnamed = svgRun.stderr.split('\n').filter((line) => /has no room on the plot or in its key/.test(line));
    expect(unnamed).toHaveLength(Number(more![1]));
    for (const line of unnamed) {
      const name = /^note: "(.*)" has no room/.exec(line)![1];
      expect(svg).not.toContain(name);
    }
    for (const run of runs) {
      expect(run.code).toBe(0);
      expect(run.stderr).toBe(svgRun.stderr);
    }
  });

  it('exits 2 naming study.views for a study with no view to plot', async () => {
    const study = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    const path = join(mkdtempSync(join(tmpdir(), 'discern-plot-')), 'no-views.json');
    writeFileSync(path, JSON.stringify({ ...study, views: [] }));
    const { code, stderr } = await runVerb([path, '--out', 'x.svg'], plotCommand);
    expect(code).toBe(2);
    expect(stderr).toBe('study.views: expected at least one view to plot, got "none"\n');
  });

  it('plots a study whose revision mark is as long as the schema allows: the stamp is shortened, the title kept', async () => {
    const study = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    const revision = 'rev '.repeat(50).trim();
    const path = join(mkdtempSync(join(tmpdir(), 'discern-plot-')), 'long-revision.json');
    writeFileSync(path, JSON.stringify({ ...study, revisions: [{ revision, date: '2026-01-01', by: 'J. E.' }] }));
    const { code, files } = await runVerb([path, '--view', 'service', '--out', 'x.svg'], plotCommand);
    expect(code).toBe(0);
    const svg = String(files.get('x.svg'));
    expect(svg).toMatch(/>Rev rev rev[^<]*… {2}· {2}\d{4}-\d{2}-\d{2}</);
  });
});
