import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { screenInksOf } from '../../../src/app/lib/oneLineView.ts';
import { analysisOfPart, scenarioViewOf } from '../../../src/app/lib/scenarioParts.ts';
import { oneLineBasesOf } from '../../../src/app/worker/oneLineQuestions.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { analyseScenarios, scenariosOf } from '../../../src/engine/scenario/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { oneLineOf, oneLineWithMarks } from '../../../src/plot/oneLine/index.ts';
import { svgOf } from '../../../src/plot/svg.ts';

const demo = (name: string) => parseStudy(readFileSync(new URL(`../../../demo/${name}.json`, import.meta.url), 'utf8'));

describe('oneLineBasesOf', () => {
  it("draws a study's one tree: with the findings' marks put on, the diagram oneLineOf draws, and each layer's inks", () => {
    const study = demo('harrowmere-full');
    const analysis = analyseStudy(study);
    // As the page receives it, across a thread.
    const answer = structuredClone(oneLineBasesOf(study, { kind: 'one-line' }));
    expect(answer.parts).toHaveLength(1);
    const [{ base, inks }] = answer.parts;
    expect(svgOf(oneLineWithMarks(base, analysis.findings))).toBe(svgOf(oneLineOf(analysis)));
    expect(inks).toEqual(base.drawing.layers.map((layer) => screenInksOf(layer.items)));
  });

  it("draws each tree of the chosen scenario in the page's order, the first scenario's when the id is unknown", () => {
    const study = demo('harrowmere-standby');
    const findings = analyseScenarios(study).findings;
    for (const [id, scenario] of [
      ['on-generator', scenariosOf(study)[1]],
      ['no-such-scenario', scenariosOf(study)[0]],
    ] as const) {
      const parts = scenarioViewOf(study, scenario).parts;
      const answer = oneLineBasesOf(study, { kind: 'one-line', scenarioId: id });
      expect(
        answer.parts.map((p) => svgOf(oneLineWithMarks(p.base, findings))),
        id,
      ).toEqual(parts.map((part) => svgOf(oneLineOf(analysisOfPart(part, [], findings)))));
    }
    expect(scenariosOf(study)[1].id).toBe('on-generator');
  });
});
