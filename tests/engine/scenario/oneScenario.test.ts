import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { radialStudy } from '../../../bench/radialStudy.ts';
import { analyseStudy, type Analysis } from '../../../src/engine/analysis.ts';
import { analyseScenarios, scenariosOf, splitScenario } from '../../../src/engine/scenario/index.ts';
import { parseStudy, type Study } from '../../../src/engine/study/index.ts';

const DEMOS = ['harrowmere-full', 'harrowmere-fused', 'harrowmere-overlap', 'harrowmere-selective'];
const demo = (name: string) => parseStudy(readFileSync(`demo/${name}.json`, 'utf8'));

// What an engineer reads of an analysis: findings (without the scenario list), pairs and fault levels.
const results = (analysis: Analysis) => ({
  findings: analysis.findings.map(({ scenarios: _scenarios, ...finding }) => finding),
  pairs: analysis.pairs,
  faults: [...analysis.faults.buses.values()],
});

// Accepts a study without switching; the same study declaring its one scenario explicitly.
const declared = (study: Study): Study => ({ ...study, scenarios: [{ id: 'normal', switches: {}, outOfService: [] }] });

describe('a study with one scenario', () => {
  it.each(DEMOS)('%s: splitting its one scenario gives exactly its own results', (name) => {
    const study = demo(name);
    const parts = splitScenario(study, scenariosOf(study)[0]);
    expect(parts).toHaveLength(1);
    expect(results(analyseStudy(parts[0].study))).toEqual(results(analyseStudy(study)));
  });

  it.each(DEMOS)('%s: declaring the scenario changes no finding, pair or fault level', (name) => {
    const study = demo(name);
    expect(results(analyseScenarios(declared(study)))).toEqual(results(analyseStudy(study)));
  });

  it('holds for generated radial studies of any size (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 40 }), (devices) => {
        const study = parseStudy(radialStudy(devices));
        expect(results(analyseScenarios(declared(study)))).toEqual(results(analyseStudy(study)));
      }),
      { numRuns: 12, seed: 20261203 },
    );
  });
});
