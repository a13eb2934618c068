import { generatorSourceLevels } from '../generator/index.ts';
import type { Source } from '../study/index.ts';
import type { SourceLevel } from './sourceImpedance.ts';

/** The equivalent source levels of any source kind, as the radial fault engine uses them. */
export interface SourceLevels {
  /** For interrupting duty and coordination; undefined for an infinite bus. */
  max: SourceLevel | undefined;
  /** For sensitivity; undefined for an infinite bus. */
  min: SourceLevel | undefined;
  /** The field the minimum comes from, for messages. */
  minPath: string;
  /** How the work steps name the source: "utility", "generator G1". */
  label: string;
}

/**
 * A utility's maximum and minimum as given (the minimum keeps the maximum's zero-sequence ratios when
 * it has none); a generator's as an equivalent source at its terminals (`generatorSourceLevels`):
 * maximum the subtransient level, minimum the sustained one, X0/X1 = X0 / X″d.
 *
 * @example sourceLevelsOf(study.source).max?.available.va
 */
export function sourceLevelsOf(source: Source): SourceLevels {
  if (source.kind === 'infinite')
    return { max: undefined, min: undefined, minPath: 'study.source', label: 'infinite source' };
  if (source.kind === 'utility') {
    const min = source.min
      ? { ...source.min, x0x1: source.min.x0x1 ?? source.max.x0x1, r0r1: source.min.r0r1 ?? source.max.r0r1 }
      : source.max;
    return { max: source.max, min, minPath: source.min ? 'study.source.min' : 'study.source.max', label: 'utility' };
  }
  const levels = generatorSourceLevels(source);
  const level = (va: number): SourceLevel => ({ available: { va }, xr: levels.xr, x0x1: levels.zeroSequenceRatio });
  return {
    max: level(levels.maximum.va),
    min: level(levels.minimum.va),
    minPath: 'study.source',
    label: `generator ${source.id}`,
  };
}
