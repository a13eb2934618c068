import { bandOf, type Band } from '../../engine/band.ts';
import type { Finding } from '../../engine/checks/finding.ts';
import type { Study } from '../../engine/study/index.ts';

/**
 * Every device's band at its own voltage, by device id (the engine's `bandOf`; closures stay on
 * this thread).
 * @example bandsOf(study).get('MAIN')?.minTime(20_000)
 */
export function bandsOf(study: Study): Map<string, Band> {
  return new Map(study.devices.map((device) => [device.id, bandOf(device.characteristic)]));
}

/** How many findings name a device: all of them, and those that fail or warn. */
export interface FindingCount {
  all: number;
  problems: number;
}

/**
 * Per device id, how many findings name it (for the tree's badges).
 * @example findingCountsOf(findings).get('MAIN') // { all: 6, problems: 2 }
 */
export function findingCountsOf(findings: readonly Finding[]): ReadonlyMap<string, FindingCount> {
  const counts = new Map<string, FindingCount>();
  for (const finding of findings) {
    for (const id of finding.subjects) {
      const count = counts.get(id) ?? { problems: 0, all: 0 };
      count.all++;
      if (finding.severity === 'fail' || finding.severity === 'warning') count.problems++;
      counts.set(id, count);
    }
  }
  return counts;
}

/**
 * A lookup from ids to a value, built once (curve colours by id, and the like).
 * @example lookupOf(sheet.curves, (c) => c.id, (c) => c.colour).get('MAIN') // '#E69F00'
 */
export function lookupOf<T, V>(
  items: readonly T[],
  key: (item: T) => string,
  value: (item: T) => V,
): ReadonlyMap<string, V> {
  return new Map(items.map((item) => [key(item), value(item)]));
}

/**
 * An immutable set of ids.
 * @example idSetOf(['MAIN', 'FDR-MCC']).has('MAIN') // true
 */
export function idSetOf(ids: readonly string[]): ReadonlySet<string> {
  return new Set(ids);
}
