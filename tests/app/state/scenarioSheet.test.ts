import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { AnalysisState } from '../../../src/app/state/AnalysisState.svelte.ts';
import { findingsAnalysisOf } from '../../../src/app/lib/runExport.ts';
import { csvReport, markdownReport } from '../../../src/engine/report/index.ts';
import { ProbeState } from '../../../src/app/state/ProbeState.svelte.ts';
import { SheetState } from '../../../src/app/state/SheetState.svelte.ts';
import { StudyState } from '../../../src/app/state/StudyState.svelte.ts';
import type { AnalyseReply } from '../../../src/app/worker/protocol.ts';
import { ChangeTracker } from '../../../src/app/worker/changes.ts';
import { checksOf } from '../../../src/app/worker/checks.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import { faultLevelsOf, largestFaultOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { scenarioPartsOf, scenariosOf } from '../../../src/engine/scenario/index.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

const readDemo = (name: string) =>
  JSON.parse(readFileSync(new URL(`../../../demo/${name}`, import.meta.url), 'utf8')) as StudyInput;
const standby = readDemo('harrowmere-standby-overlap.json');
const selective = readDemo('harrowmere-selective.json');

// The checks answered at once on this thread, as the worker would.
function states(document: StudyInput) {
  const study = new StudyState(document);
  const probe = new ProbeState();
  const memo = new AnalysisMemo();
  const tracker = new ChangeTracker();
  const runner = {
    onreply: undefined as ((reply: AnalyseReply) => void) | undefined,
    post(request: { seq: number; study: NonNullable<StudyState['study']> }) {
      runner.onreply?.({ seq: request.seq, ok: true, changes: tracker.changesOf(checksOf(request.study, memo)) });
    },
  };
  const analysis = new AnalysisState(study, runner);
  analysis.request();
  return { study, analysis, sheet: new SheetState(study, analysis, probe) };
}

describe('the sheet, the findings and the tree in a scenario', () => {
  it('has the expected defaults: a study without scenarios has none, and a standby study starts in its first', () => {
    const plain = states(selective);
    expect(plain.study.scenarios).toEqual([]);
    expect(plain.study.scenario).toBeUndefined();
    expect(plain.analysis.scenario).toBeUndefined();
    expect(plain.analysis.scenarioFindings).toBe(plain.analysis.findings);
    expect(plain.sheet.sheet?.title).toBe(plain.sheet.input.input?.title);
    expect(plain.sheet.input.input?.title).not.toMatch(/—/);
    const { study, sheet } = states(standby);
    expect(study.scenarios.map((s) => s.id)).toEqual(['normal', 'on-generator', 'tie-closed']);
    expect(study.scenario?.id).toBe('normal');
    expect(sheet.input.input?.title).toMatch(/ — Normal$/);
  });

  it('the generator\'s sheet draws the generator\'s tree and its fault current in "On generator"', () => {
    const { study, analysis, sheet } = states(standby);
    study.viewId = 'emergency-generator';
    study.scenarioId = 'on-generator';
    const input = sheet.input.input!;
    expect(input.bands.map((b) => b.id)).toEqual(['GEN-CB', 'EM-BR']);
    // The fault line is the generator tree's own level at the bus, worked out by the engine: the larger of
    // its three-phase and line-to-ground faults (a solidly grounded machine gives more to the latter).
    const doc = study.study!;
    const part = scenarioPartsOf(doc, scenariosOf(doc)[1])[0];
    const faults = faultLevelsOf(networkOf(part.study));
    expect(input.faultLines.length).toBeGreaterThan(0);
    for (const line of input.faultLines)
      expect(line.ownAmps).toBe(largestFaultOf(faults.buses.get(line.busId)!.max, false));
    expect(sheet.left).toEqual([]);
    // The generator breaker's overlap is hatched on it, and it holds only on the generator.
    const region = input.regions.find((r) => r.findingId.startsWith('coordination:GEN-CB/EM-BR'));
    expect(region).toBeDefined();
    expect(analysis.findings.find((f) => f.id === region!.findingId)?.scenarios).toEqual(['On generator']);
  });

  it('a sheet whose devices are all de-energised says so instead of drawing', () => {
    const { study, sheet } = states(standby);
    study.viewId = 'service';
    study.scenarioId = 'on-generator';
    expect(sheet.input.input).toBeUndefined();
    expect(sheet.dark).toMatch(/^Every device on this sheet is de-energised in the scenario "On generator"\.$/);
    expect(sheet.sheet).toBeUndefined();
    // Exporting it says why there is nothing to export, not that the study has no view.
    expect(() => sheet.figureSvg()).toThrow(
      /^there is no sheet to export: every device on this sheet is de-energised in the scenario "On generator"\.$/,
    );
  });

  it("a sheet partly energised draws what is, and lists the rest in the figure's notes", () => {
    const { study, sheet } = states(standby);
    study.viewId = 'emergency';
    study.scenarioId = 'on-generator';
    expect(sheet.input.input?.bands.map((b) => b.id)).toEqual(['EM-BR']);
    expect(sheet.left).toEqual(['MAIN', 'FDR-EM']);
    // Said once, by the engine's part of the scenario: names, and the cable with the devices.
    expect(sheet.input.input?.notes).toBe(
      'Not energised in "On generator", so not drawn: Main 2000 A, Emergency feeder, Emergency feeder cable.',
    );
  });

  it('findings in a scenario are those holding in it; opening another study goes back to the first scenario', () => {
    const { study, analysis } = states(standby);
    const generatorOnly = (ids: string[]) => ids.filter((id) => id.includes('GEN-CB'));
    expect(generatorOnly(analysis.scenarioFindings.map((f) => f.id))).toEqual([]);
    study.scenarioId = 'on-generator';
    expect(generatorOnly(analysis.scenarioFindings.map((f) => f.id)).length).toBeGreaterThan(0);
    expect(analysis.scenarioFindings.every((f) => f.scenarios?.includes('On generator'))).toBe(true);
    study.load(standby, 'again.json');
    expect(study.scenario?.id).toBe('normal');
  });

  it('the findings files of a switched study name each scenario and where each finding holds, whichever is shown', () => {
    const { study, analysis } = states(standby);
    study.scenarioId = 'on-generator';
    const markdown = markdownReport(findingsAnalysisOf({ study, analysis }));
    expect(markdown).toMatch(/\*\*Scenarios analysed:\*\* Normal \(`normal`\): \d+ fail/);
    expect(markdown).toMatch(/\| severity \| check \| finding \| current range \| worst margin \| scenarios \|/);
    const csv = csvReport(findingsAnalysisOf({ study, analysis }));
    expect(csv.split('\r\n')[0]).toMatch(/,scenarios$/);
    expect(csv).toMatch(/On generator/);
  });

  it('the fault lines of every scenario are drawn at once, each headed by its scenarios', () => {
    const { study, sheet } = states(standby);
    study.viewId = 'emergency';
    sheet.everyScenario = true;
    const lines = sheet.input.input!.faultLines;
    const scenarios = lines.map((f) => f.scenario!);
    // Every scenario is named once per bus it energises; the utility's two scenarios share their level.
    expect(scenarios.flatMap((s) => s.split(', ')).filter((s) => s === 'On generator').length).toBeGreaterThan(0);
    expect(lines.every((f) => f.scenario !== undefined)).toBe(true);
    expect(sheet.sheet?.layers.flatMap((l) => l.items).some((i) => 'text' in i && /^On generator: /.test(i.text))).toBe(
      true,
    );
  });

  it('the worked calculation follows the scenario: the generator bus has its fault current on the generator only', () => {
    const { study, analysis } = states(standby);
    expect(analysis.workFor({ kind: 'bus', id: 'GEN' })).toBeUndefined();
    study.scenarioId = 'on-generator';
    expect(analysis.workFor({ kind: 'bus', id: 'GEN' })?.title).toBe('Bus GEN: available fault current');
    expect(analysis.workFor({ kind: 'generator', id: 'G1' })?.title).toBe('Bus GEN: available fault current');
  });
});
