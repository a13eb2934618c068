import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatAmps } from '../../src/engine/quantity/index.ts';
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
