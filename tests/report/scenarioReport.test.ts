import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatAmps, significant } from '../../src/engine/quantity/index.ts';
import { settingWindowOf } from '../../src/engine/window/index.ts';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { studyReportOf, type ReportBlock } from '../../src/report/studyReport.ts';

const report = () =>
  studyReportOf(analyseScenarios(parseStudy(readFileSync('demo/harrowmere-standby-overlap.json', 'utf8'))), {
    date: '2026-12-03',
  });
const section = (id: string) => report().sections.find((s) => s.id === id)!;
const captions = (blocks: ReportBlock[]) => blocks.flatMap((b) => (b.type === 'figure' ? [b.caption] : []));

describe('the report of a study with scenarios (standby demo)', () => {
  it('tabulates each scenario: sources in service, switch positions and what is not energised', () => {
    const table = section('method').blocks.find((b) => b.type === 'table' && b.columns[0] === 'scenario');
    expect(table).toMatchObject({
      rows: [
        ['Normal', 'UTIL', expect.stringContaining('Emergency transfer switch: normal'), 'GEN, ATS-E'],
        ['On generator', 'G1', expect.stringContaining('Emergency transfer switch: emergency'), expect.any(String)],
        ['Dock on the office feeder', 'UTIL', expect.stringContaining('tie (normally open): closed'), 'GEN, ATS-E'],
      ],
    });
  });

  it('says how marked devices are checked, with NFPA 70 (2023) 240.11 for the feeders of a service device', () => {
    const text = section('method')
      .blocks.map((b) => (b.type === 'paragraph' ? b.text : ''))
      .join('\n');
    expect(text).toMatch(/checked for selective coordination with every supply-side device in every scenario/);
    expect(text).toMatch(
      /Following NFPA 70 \(2023\) 240\.11, once a feeder device supplied directly by a service device/,
    );
  });

  it('draws a one-line diagram per scenario', () => {
    expect(captions(section('one-line').blocks)).toEqual([
      'The system as modelled in "Normal", with maximum and minimum fault currents',
      'The system as modelled in "On generator", with maximum and minimum fault currents',
      'The system as modelled in "Dock on the office feeder", with maximum and minimum fault currents',
    ]);
  });

  it("gives the generator scenario's fault currents the engine computes for it", () => {
    const analysis = analyseScenarios(parseStudy(readFileSync('demo/harrowmere-standby-overlap.json', 'utf8')));
    const onGenerator = analysis.scenarios![1].parts[0];
    const blocks = section('faults').blocks;
    const at = blocks.findIndex((b) => b.type === 'paragraph' && b.text === 'Fault currents in "On generator":');
    const table = blocks[at + 1];
    expect(table.type).toBe('table');
    const rows = (table as Extract<ReportBlock, { type: 'table' }>).rows;
    expect(rows.map((r) => r[0])).toEqual(onGenerator.study.buses.map((b) => b.name ?? b.id));
    const gen = onGenerator.faults.buses.get('GEN')!.max.threePhase;
    expect(rows.find((r) => r[0] === 'Generator terminals')![2]).toBe(formatAmps(gen, 3));
  });

  it('draws each view in every scenario that energises its devices, titled with the scenario', () => {
    const sheets = captions(section('sheets').blocks);
    expect(sheets).toContain('Emergency chain at 480 V — Normal');
    expect(sheets).toContain('Emergency chain on the generator at 480 V — On generator');
    // On the generator only the fan breaker of that view is energised; its sheet is still drawn.
    expect(sheets.filter((c) => c.startsWith('Emergency chain at 480 V'))).toEqual([
      'Emergency chain at 480 V — Normal',
      'Emergency chain at 480 V — On generator',
      'Emergency chain at 480 V — Dock on the office feeder',
    ]);
  });
});

type Table = Extract<ReportBlock, { type: 'table' }>;
const overlapStudy = parseStudy(readFileSync('demo/harrowmere-standby-overlap.json', 'utf8'));
const overlap = analyseScenarios(overlapStudy);
const overlapReport = studyReportOf(overlap, { date: '2026-12-03' });
const blocksOf = (id: string, of = overlapReport) => of.sections.find((s) => s.id === id)!.blocks;
const tableWith = (blocks: ReportBlock[], column: string) =>
  blocks.find((b): b is Table => b.type === 'table' && b.columns.includes(column))!;

describe('the findings of a study with scenarios say where each holds (standby overlap demo)', () => {
  it("tells the fan breaker's two interrupting-duty rows apart by a scenarios column: 16.6 kA on the utility, 4020 A on the generator", () => {
    const table = tableWith(blocksOf('findings'), 'worst margin');
    expect(table.columns).toEqual(['severity', 'finding', 'current range', 'worst margin', 'scenarios']);
    const duty = table.rows.filter((r) => r[1].startsWith('Exhaust fan breaker 50 A: rated 22 kA, duty'));
    const where = (title: string) => overlap.findings.find((f) => f.title === title)!.scenarios!.join('; ');
    expect(duty.map((r) => [r[1], r[4]])).toEqual(duty.map((r) => [r[1], where(r[1])]));
    expect(duty.find((r) => r[1].endsWith('duty 4020 A'))![4]).toBe('On generator');
    expect(duty.find((r) => r[1].endsWith('duty 16.6 kA'))![4]).toBe('Normal; Dock on the office feeder');
  });

  it('says the NFPA 70 700.32 failure of the fan breaker holds only on the generator, in its written-out entry', () => {
    const entry = blocksOf('findings').find(
      (b) => b.type === 'list' && b.items[0].startsWith('fail: Exhaust fan breaker 50 A: NFPA 70 700.32'),
    );
    expect(entry).toMatchObject({ items: expect.arrayContaining(['Holds in: On generator']) });
  });

  it('counts the findings of each scenario: a finding holding in two scenarios counts in both', () => {
    const list = blocksOf('findings').find((b) => b.type === 'list' && b.items[0].startsWith('Normal: '));
    if (list?.type !== 'list') throw new Error('no per-scenario counts');
    const counted = list.items.map((item) => {
      const [, label, fail, warning] = /^(.+): (\d+) failing, (\d+) warnings?, /.exec(item)!;
      return { label, fail: Number(fail), warning: Number(warning) };
    });
    expect(counted).toEqual(
      overlap.scenarios!.map(({ label }) => {
        const here = overlap.findings.filter((f) => f.scenarios!.includes(label));
        const n = (severity: string) => here.filter((f) => f.severity === severity).length;
        return { label, fail: n('fail'), warning: n('warning') };
      }),
    );
    expect(counted[1]).toMatchObject({ label: 'On generator', fail: 2 });
  });
});

describe('the one-line diagrams of a study with scenarios', () => {
  it("mark the exhaust fan breaker's NFPA 70 700.32 warning (illustrative curves) in every scenario it holds in (standby demo)", () => {
    const standby = analyseScenarios(parseStudy(readFileSync('demo/harrowmere-standby.json', 'utf8')));
    const code = standby.findings.find((f) => f.id === 'code-selectivity:EM-BR')!;
    expect(code).toMatchObject({ severity: 'warning', subjects: ['EM-BR'] });
    // The finding is added after the scenarios' own findings are merged: no tree's own list has it.
    expect(standby.scenarios!.flatMap((s) => s.parts).some((p) => p.findings.some((f) => f.id === code.id))).toBe(
      false,
    );
    const figures = blocksOf('one-line', studyReportOf(standby)).filter((b) => b.type === 'figure');
    expect(figures).toHaveLength(code.scenarios!.length);
    for (const figure of figures) {
      const marks = figure.drawing.layers.find((layer) => layer.name === 'findings')!.items;
      expect(
        marks.some((m) => m.dataId === 'EM-BR' && m.type === 'text' && m.text === '?'),
        figure.caption,
      ).toBe(true);
    }
  });
});

describe('the setting windows of a study with scenarios', () => {
  it("works Main's short-time pickup out in each scenario: its window opens lower with the dock on the office feeder", () => {
    const table = tableWith(blocksOf('settings'), 'binding constraints');
    expect(table.columns.at(-1)).toBe('scenarios');
    const rows = table.rows.filter((r) => r[0] === 'Main 2000 A' && r[1] === 'short-time pickup');
    // The lower edge of the window as the engine's `window --scenario` works it out.
    const windowIn = (scenario: string) =>
      significant(
        settingWindowOf(overlapStudy, 'MAIN', { scenario, maps: false, remedies: false }).settings.find(
          (s) => s.label === 'short-time pickup',
        )!.intervals[0].from,
        4,
      );
    expect(windowIn('normal')).not.toBe(windowIn('tie-closed'));
    expect(rows.map((r) => r.at(-1))).toEqual(['Normal', 'Dock on the office feeder']);
    expect(rows[0][3].startsWith(`${windowIn('normal')}–`)).toBe(true);
    expect(rows[1][3].startsWith(`${windowIn('tie-closed')}–`)).toBe(true);
  });

  it('with --scenario on-generator, leaves out the T1 primary relay the generator does not energise and names the scenario in each row', () => {
    const onGenerator = studyReportOf(analyseScenarios(overlapStudy, { only: 'on-generator' }));
    const blocks = blocksOf('settings', onGenerator);
    expect(tableWith(blocks, 'location').rows.find((r) => r[0] === 'T1 primary relay')![1]).toBe('not energised');
    const windows = tableWith(blocks, 'binding constraints');
    expect(windows.rows.map((r) => r[0])).not.toContain('T1 primary relay');
    expect(new Set(windows.rows.map((r) => r[0]))).toEqual(new Set(['Generator breaker 600 A']));
    expect(new Set(windows.rows.map((r) => r.at(-1)))).toEqual(new Set(['On generator']));
  });

  it("does not say a recommendation keeps every constraint, and lists the generator breaker's damage curve it misses", () => {
    const blocks = blocksOf('settings');
    const text = blocks.flatMap((b) => (b.type === 'paragraph' ? [b.text] : [])).join('\n');
    expect(text).not.toMatch(/setting that keeps every constraint/);
    const missed = settingWindowOf(overlapStudy, 'GEN-CB', { scenario: 'on-generator' })
      .recommendation!.margins.filter((m) => m.result.margin < 0)
      .map((m) => m.label);
    expect(missed).toContainEqual(expect.stringMatching(/^clear below Standby generator .*'s damage curve/));
    const item = blocks
      .flatMap((b) => (b.type === 'list' ? b.items : []))
      .find((i) => i.startsWith('Generator breaker 600 A (On generator): '))!;
    for (const label of missed) expect(item).toContain(label);
  });
});
