import type { Study } from '../../engine/study/index.ts';

/**
 * What a study changed from the one sent before it: top-level fields replaced whole, and, for a list
 * of the same length, only its changed items. An edited study's reading keeps every parsed list item
 * and field an edit left alone, so comparing by identity finds the edit, and a setting edit in a
 * 2,000-device study sends one device to the checks' worker instead of the whole study.
 */
export interface StudyDelta {
  /** Fields whose value changed, with their new value (a list whose length changed comes whole). */
  fields: Partial<Study>;
  /** For a list of the same length: each changed item's index and its new value. */
  items: Partial<Record<keyof Study, [index: number, item: unknown][]>>;
}

/**
 * The changes from `previous` to `next`, by identity.
 * @example worker.postMessage({ seq, delta: studyDeltaOf(sent, study) })
 */
export function studyDeltaOf(previous: Study, next: Study): StudyDelta {
  const delta: StudyDelta = { fields: {}, items: {} };
  const keys = new Set([...Object.keys(previous), ...Object.keys(next)] as (keyof Study)[]);
  for (const key of keys) {
    const before: unknown = previous[key];
    const after: unknown = next[key];
    if (before === after) continue;
    if (Array.isArray(before) && Array.isArray(after) && before.length === after.length) {
      const changed: [number, unknown][] = [];
      after.forEach((item, i) => {
        if (item !== before[i]) changed.push([i, item]);
      });
      delta.items[key] = changed;
    } else (delta.fields as Record<string, unknown>)[key] = after;
  }
  return delta;
}

/**
 * `previous` with `delta` applied: a new study object sharing every field and list item the delta
 * leaves alone, so what the worker remembers by identity (bands, fault levels) still finds them.
 *
 * @example study = studyWithDelta(study, request.delta)
 */
export function studyWithDelta(previous: Study, delta: StudyDelta): Study {
  const next: Record<string, unknown> = { ...previous };
  for (const [key, value] of Object.entries(delta.fields)) {
    if (value === undefined) delete next[key];
    else next[key] = value;
  }
  for (const [key, changed] of Object.entries(delta.items)) {
    const list = (next[key] as unknown[]).slice();
    for (const [i, item] of changed ?? []) list[i] = item;
    next[key] = list;
  }
  return next as Study;
}
