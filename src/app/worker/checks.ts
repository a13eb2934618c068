import { analyseStudy, type Analysis } from '../../engine/analysis.ts';
import type { PairCheck } from '../../engine/checks/coordination.ts';
import type { AnalysisMemo } from '../../engine/incremental.ts';
import { analyseScenarios, hasScenarios } from '../../engine/scenario/index.ts';
import type { Study } from '../../engine/study/index.ts';

/**
 * Every check of a study, as the worker sends it. A study that cannot be switched goes through
 * `analyseStudy` with the memo kept from the previous edit (only what changed is worked out again);
 * one with generators, switches or scenarios through `analyseScenarios`, every scenario at once, its
 * findings each listing the scenarios they hold in, and the pair checks of every scenario's trees
 * (the first scenario's reading of a pair that appears in several), so a sheet of any scenario finds
 * how its pairs' fault cases were shifted. A study marking devices as part of an emergency or other
 * system also goes through `analyseScenarios`, which adds the code's selective-coordination findings.
 *
 * @example tracker.changesOf(checksOf(study, memo))
 */
export function checksOf(study: Study, memo: AnalysisMemo): Pick<Analysis, 'findings' | 'pairs' | 'counts'> {
  if (!hasScenarios(study) && !study.devices.some((d) => d.system !== undefined)) return analyseStudy(study, memo);
  const analysis = analyseScenarios(study);
  if (!analysis.scenarios) return analysis;
  const pairs = new Map<string, PairCheck>();
  for (const scenario of analysis.scenarios ?? [])
    for (const part of scenario.parts)
      for (const pair of part.pairs) {
        const key = `${pair.upstream}/${pair.downstream}`;
        if (!pairs.has(key)) pairs.set(key, pair);
      }
  return { findings: analysis.findings, counts: analysis.counts, pairs: [...pairs.values()] };
}
