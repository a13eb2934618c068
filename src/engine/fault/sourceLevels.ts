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
  /**
   * Whether the minimum takes the maximum's source zero-sequence impedance in ohms: the maximum gives a
   * line-to-ground level and the minimum no zero-sequence data of its own.
   */
  minKeepsMaxZ0: boolean;
  /** How the work steps name the source: "utility", "generator G1". */
  label: string;
}

/**
 * A utility's maximum and minimum as given; a minimum without an X/R or zero-sequence data of its own
 * takes the maximum's X/R and its zero-sequence data (the ratios as entered, or, from a line-to-ground
 * level, the maximum's Z0 in ohms: `minKeepsMaxZ0`). A generator's as an equivalent source at its
 * terminals (`generatorSourceLevels`): maximum the subtransient level, minimum the sustained one,
 * X0/X1 = X0 / X″d.
 *
 * @example sourceLevelsOf(study.source).max?.available.va
 */
export function sourceLevelsOf(source: Source): SourceLevels {
  if (source.kind === 'infinite')
    return { max: undefined, min: undefined, minPath: 'study.source', minKeepsMaxZ0: false, label: 'infinite source' };
  if (source.kind === 'utility') {
    const { max, min: given } = source;
    if (!given) return { max, min: max, minPath: 'study.source.max', minKeepsMaxZ0: false, label: 'utility' };
    // Maximum and minimum differ in the strength of the system behind the utility's grounded-wye
    // transformers. The zero-sequence path at the point of delivery is those transformers and the line
    // from them, which their delta windings isolate from the system behind (zero-sequence network by
    // symmetrical components, IEEE Std 399 short-circuit chapter; IEEE Std 142 system grounding chapter).
    // So the Z0 the maximum's line-to-ground level fixes is kept in ohms, not scaled with Z1, and with
    // the same X/R the minimum line-to-ground fault stays below the maximum.
    const ownZ0 = given.lineToGround !== undefined || given.x0x1 !== undefined || given.r0r1 !== undefined;
    const minKeepsMaxZ0 = !ownZ0 && max.lineToGround !== undefined;
    const min = {
      ...given,
      xr: given.xr ?? max.xr,
      x0x1: given.x0x1 ?? max.x0x1,
      r0r1: given.r0r1 ?? max.r0r1,
    };
    return { max, min, minPath: 'study.source.min', minKeepsMaxZ0, label: 'utility' };
  }
  const levels = generatorSourceLevels(source);
  const level = (va: number): SourceLevel => ({ available: { va }, xr: levels.xr, x0x1: levels.zeroSequenceRatio });
  return {
    max: level(levels.maximum.va),
    min: level(levels.minimum.va),
    minPath: 'study.source',
    minKeepsMaxZ0: false,
    label: `generator ${source.id}`,
  };
}
