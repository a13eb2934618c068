import { faultLevelsOf } from '../../engine/fault/index.ts';
import { networkOf } from '../../engine/network/index.ts';
import { hasScenarios, scenariosOf } from '../../engine/scenario/index.ts';
import type { Study } from '../../engine/study/index.ts';
import type { Edges } from '../../plot/inkBounds.ts';
import { oneLineBaseOf, type OneLineBase } from '../../plot/oneLine/index.ts';
import { screenInksOf } from '../lib/oneLineView.ts';
import { scenarioViewOf } from '../lib/scenarioParts.ts';

/** What the One-line panel asks: the diagram of each tree, for a study that can be switched in one scenario. */
export interface OneLineQuestion {
  kind: 'one-line';
  /** The scenario whose energised trees are drawn (the study's first when absent or unknown). */
  scenarioId?: string;
}

/**
 * Each tree's diagram without its finding marks (the page puts on the marks of the findings it has),
 * with the ink of every item of each layer, which the panel culls by: in the order the page's scenario
 * view lists the trees, the study's own source first.
 */
export interface OneLineAnswer {
  kind: 'one-line';
  parts: { base: OneLineBase; inks: Edges[][] }[];
}

/**
 * Draws the bases the One-line panel shows: a 2,000-device site's takes about 40 ms to draw and as long
 * again to measure, work kept off the page's thread.
 *
 * @example oneLineBasesOf(study, { kind: 'one-line' }).parts[0].base.markSpots.length
 */
export function oneLineBasesOf(study: Study, question: OneLineQuestion): OneLineAnswer {
  const trees = hasScenarios(study)
    ? scenarioViewOf(study, scenarioOf(study, question.scenarioId)).parts
    : [treeOf(study)];
  return {
    kind: 'one-line',
    parts: trees.map((tree) => {
      const base = oneLineBaseOf(tree);
      return { base, inks: base.drawing.layers.map((layer) => screenInksOf(layer.items)) };
    }),
  };
}

// Accepts a study and a scenario id; that scenario, as the page picks it (the first when the id is unknown).
function scenarioOf(study: Study, id: string | undefined) {
  const scenarios = scenariosOf(study);
  return scenarios.find((scenario) => scenario.id === id) ?? scenarios[0];
}

// Accepts a study that cannot be switched; its one tree, with the fault levels the base labels its buses with.
function treeOf(study: Study) {
  const network = networkOf(study);
  return { study, network, faults: faultLevelsOf(network) };
}
