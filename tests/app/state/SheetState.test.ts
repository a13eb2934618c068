import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { AnalysisState } from '../../../src/app/state/AnalysisState.svelte.ts';
import { ProbeState } from '../../../src/app/state/ProbeState.svelte.ts';
import { FIGURE_SIZE, SheetState } from '../../../src/app/state/SheetState.svelte.ts';
import { StudyState } from '../../../src/app/state/StudyState.svelte.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { probeAt } from '../../../src/engine/probe.ts';
import { sheetOf } from '../../../src/plot/sheet.ts';
import { svgOf } from '../../../src/plot/svg.ts';
import { viewInputOf } from '../../../src/plot/viewInput.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
) as StudyInput;

function states() {
  const study = new StudyState(demo);
  const probe = new ProbeState();
  const analysis = new AnalysisState(study, { post: () => {}, onreply: undefined });
  return { study, probe, sheet: new SheetState(study, analysis, probe) };
}

describe('SheetState', () => {
  it('has the expected defaults', () => {
    const { sheet } = states();
    expect(sheet.width).toBe(960);
    expect(sheet.probe).toBeUndefined();
    expect(sheet.sheet?.curves.map((c) => c.id)).toEqual(expect.arrayContaining(demo.views![0].devices));
  });

  it('sheet is laid out for the space the region gives it, never below the plot layer minimum', () => {
    const { sheet } = states();
    sheet.width = 700;
    sheet.height = 300;
    expect(sheet.sheet?.width).toBe(700);
    expect(sheet.sheet?.height).toBe(360);
  });

  it('probe is the engine probe at the pointer current on the current view', () => {
    const { sheet, probe } = states();
    probe.moveTo(15_000);
    const expected = probeAt(analyseStudy(states().study.study!), demo.views![0].id, 15_000);
    expect(sheet.probe?.readings).toEqual(expected.readings);
    expect(sheet.probe?.summary).toBe(expected.summary);
    probe.pin();
    expect(sheet.pinned.map((p) => p.amps)).toEqual([15_000]);
  });

  it('figureSvg() is the plot layer SVG at the figure size, as the command line draws it', () => {
    const { sheet, study } = states();
    const analysis = { ...analyseStudy(study.study!), findings: [], pairs: [] };
    // No findings have come back from the checks here, so the figure has no hatched regions either.
    const expected = svgOf(sheetOf(viewInputOf(analysis, demo.views![0].id), { ...FIGURE_SIZE, idPrefix: 'tcc' }));
    expect(sheet.figureSvg()).toBe(expected);
  });

  it('an inverted current range is a problem of the study, naming the field, and the sheet keeps its last drawing', () => {
    const { sheet, study } = states();
    const before = sheet.sheet;
    study.edit(['views', 0, 'currentRange'], [1000, 10], 'current range');
    expect(study.problems.map((p) => p.path)).toEqual(['study.views[0].currentRange[1]']);
    expect(study.problems[0].message).toMatch(/^expected a value above 1000 A, got "10"$/);
    expect(sheet.sheet).toBeDefined();
    expect(sheet.sheet?.title).toBe(before?.title);
  });

  it('figureSvg() refuses plainly when the study has no view', () => {
    const { sheet, study } = states();
    study.newStudy();
    expect(() => sheet.figureSvg()).toThrow(/^there is no sheet to export: the study has no view$/);
  });
});
