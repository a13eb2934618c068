import { sharedBuilders } from '../lazyText.ts';
import type { CurrentRange, Finding } from './finding.ts';

/**
 * A check run again for the item a finding is about, with what it reads (`owner`) and its settings,
 * writing its findings' sentences itself: the findings it makes.
 */
export type Rerun<O extends object, S> = (finding: Finding, owner: O, settings: S) => Finding[];

/** The builders one check shares among the findings it makes in one analysis: the range and the sentences. */
export interface SharedSentences {
  range: (finding: Finding) => CurrentRange;
  explanation: (finding: Finding) => string;
  suggestion: (finding: Finding) => string;
  basis: (finding: Finding) => string;
}

/** Each analysis's shared builders: by what the check reads (its context, or its network), the check and its settings. */
const sharing = new WeakMap<object, Map<Rerun<never, never>, Map<unknown, SharedSentences>>>();

/**
 * Range and sentence builders for a check's findings, shared by every finding it makes from the same
 * `owner` (what it reads: the analysis's context, or its network) and `settings`. When a finding's range
 * or sentence is first read, `rerun` runs the check again on the finding's item, writing its own, and
 * the field is read from the finding there with the same id (its twin). A finding given these keeps no
 * closure of its own, nor the facts its sentences are written from: in a large study those closures
 * kept more than the findings themselves (from a third to a kilobyte per cable, motor or load
 * finding), and the collector copies what an analysis keeps while it runs. Reading costs the item's
 * check once more for a finding's first sentence read (the last twin found is kept for the next); the
 * workbench reads a screenful, a report each once. Checks are pure functions, so the twin's sentence
 * is the finding's own.
 *
 * @example const shared = sharedSentencesOf(context, undefined, ampacityAgain) // then sentencesOf(shared, { … })
 */
export function sharedSentencesOf<O extends object, S>(owner: O, settings: S, rerun: Rerun<O, S>): SharedSentences {
  let byCheck = sharing.get(owner);
  if (!byCheck) sharing.set(owner, (byCheck = new Map()));
  let bySettings = byCheck.get(rerun as Rerun<never, never>);
  if (!bySettings) byCheck.set(rerun as Rerun<never, never>, (bySettings = new Map()));
  let shared = bySettings.get(settings);
  if (!shared) {
    let last: { finding: Finding; twin: Finding } | undefined;
    const twinOf = (finding: Finding): Finding => {
      if (last?.finding === finding) return last.twin;
      const twin = rerun(finding, owner, settings).find((made) => made.id === finding.id);
      if (!twin) throw new Error(`${finding.id}: the check made no such finding when run again`);
      last = { finding, twin };
      return twin;
    };
    shared = {
      range: (finding) => twinOf(finding).range!,
      explanation: (finding) => twinOf(finding).explanation,
      suggestion: (finding) => twinOf(finding).suggestion!,
      basis: (finding) => twinOf(finding).basis!,
    };
    bySettings.set(settings, shared);
  }
  return shared;
}

/**
 * The builders to give a finding: `own` (closures over what the check has at hand) where there are no
 * shared builders, else the shared builders of the same names, one set for every finding given the
 * same names (`sharedBuilders`: a finding whose sentences are never read keeps no state of its own),
 * and `own` is let go.
 *
 * @example withLazyText<Finding>(finding, sentencesOf(shared, { explanation: () => sentence }))
 */
export function sentencesOf<B extends Partial<SharedSentences>>(shared: SharedSentences | undefined, own: B): B {
  if (!shared) return own;
  // The names as a bit each, to find the set without allocating.
  let names = 0;
  for (const key in own) names |= NAME_BITS[key as keyof SharedSentences];
  let sets = subsets.get(shared);
  if (!sets) subsets.set(shared, (sets = []));
  let chosen = sets[names];
  if (!chosen) {
    const picked: Partial<SharedSentences> = {};
    // In the usual order of a finding's fields, which every check gives them in.
    for (const key of FIELD_ORDER) if (names & NAME_BITS[key]) (picked as Record<string, unknown>)[key] = shared[key];
    sets[names] = chosen = sharedBuilders(picked as Record<string, (finding: Finding) => unknown>);
  }
  return chosen as B;
}

const FIELD_ORDER = ['range', 'explanation', 'suggestion', 'basis'] as const;
const NAME_BITS: Record<keyof SharedSentences, number> = { range: 1, explanation: 2, suggestion: 4, basis: 8 };

/** Each shared set's subsets given to findings, by their names' bits. */
const subsets = new WeakMap<SharedSentences, Readonly<Record<string, (finding: Finding) => unknown>>[]>();
