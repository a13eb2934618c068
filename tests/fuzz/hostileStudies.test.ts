import { describe, expect, it } from 'vitest';
import { readStudy } from '../../src/engine/study/index.ts';
import { hostileStudies } from './hostileStudies.ts';
import { echoedWords, outcomeOf, outcomeProblem } from './outcome.ts';

/** Fixed so the suite is deterministic; `npm run fuzz -- --seed N` explores others out of process. */
const SEED = 20_261_202;
const COUNT = 1_000;

describe('hostile studies', () => {
  const cases = hostileStudies(SEED, COUNT);

  it('has the expected defaults: the same seed gives the same cases', () => {
    expect(cases).toHaveLength(COUNT);
    expect(hostileStudies(SEED, 5).map((c) => c.text)).toEqual(cases.slice(0, 5).map((c) => c.text));
  });

  it(
    `each of ${COUNT} is refused on one line naming a field, or analysed and drawn without NaN or Infinity`,
    { timeout: 180_000 },
    () => {
      const failures: string[] = [];
      const kinds = { refused: 0, analysed: 0, crashed: 0 };
      for (const hostile of cases) {
        const outcome = outcomeOf(hostile.text);
        kinds[outcome.kind]++;
        const problem = outcomeProblem(outcome, echoedWords(hostile.text));
        if (problem) failures.push(`#${hostile.index} ${hostile.mutation} (${hostile.base}): ${problem}`);
      }
      expect(failures.slice(0, 10)).toEqual([]);
      // The corpus exercises both paths: most inputs are refused, and some survive to be analysed.
      expect(kinds.refused).toBeGreaterThan(COUNT / 4);
      expect(kinds.analysed).toBeGreaterThan(COUNT / 20);
    },
  );

  it('a cable loop with per-pair margins, a 250-level chain and a byte-order mark are each handled', () => {
    const byMutation = (name: string) => cases.filter((c) => c.mutation === name);
    for (const loop of byMutation('cable loop with per-pair margins'))
      expect(readStudy(loop.text).problems.length + (readStudy(loop.text).study ? 1 : 0)).toBeGreaterThan(0);
    expect(byMutation('deep chain').some((c) => readStudy(c.text).study)).toBe(true);
    expect(byMutation('byte-order mark').every((c) => c.text.startsWith('\uFEFF') && readStudy(c.text).study)).toBe(
      true,
    );
  });
});
