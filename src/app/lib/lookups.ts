import { bandOf, type Band } from '../../engine/band.ts';
import { lazyBandsOf } from '../../engine/bandCache.ts';
import type { Finding } from '../../engine/checks/finding.ts';
import type { Device, Study } from '../../engine/study/index.ts';

/**
 * Every device's band at its own voltage, by device id (the engine's `bandOf`; closures stay on
 * this thread).
 * @example bandsOf(study).get('MAIN')?.minTime(20_000)
 */
export function bandsOf(study: Study): Map<string, Band> {
  return new Map(study.devices.map((device) => [device.id, bandOf(device.characteristic)]));
}

/**
 * Each device's band by id, read through a lookup of devices by id that already exists (the
 * network's `devices`) and built only when first asked for (the engine's `lazyBandsOf`).
 *
 * @example bandsByDevice(network.devices).get('MAIN')?.minTime(20_000)
 */
export function bandsByDevice(devices: ReadonlyMap<string, Pick<Device, 'characteristic'>>): Map<string, Band> {
  return lazyBandsOf(devices);
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
 * `counts` (the `findingCountsOf` some findings) after `gone` left those findings and `added` joined
 * them, without counting the rest again: a reply of the checks after an edit changes a handful of a
 * large study's thousands of findings. A new map; the counts it is given are left as they were.
 *
 * @example counts = findingCountsWith(counts, [oldFinding], [newFinding])
 */
export function findingCountsWith(
  counts: ReadonlyMap<string, FindingCount>,
  gone: readonly Finding[],
  added: readonly Finding[],
): ReadonlyMap<string, FindingCount> {
  const next = new Map(counts);
  const change = (finding: Finding, step: 1 | -1) => {
    const problem = finding.severity === 'fail' || finding.severity === 'warning' ? step : 0;
    for (const id of finding.subjects) {
      const count = next.get(id) ?? { all: 0, problems: 0 };
      const all = count.all + step;
      if (all === 0) next.delete(id);
      else next.set(id, { all, problems: count.problems + problem });
    }
  };
  for (const finding of gone) change(finding, -1);
  for (const finding of added) change(finding, 1);
  return next;
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
