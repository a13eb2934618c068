import type { Transformer } from '../study/index.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';

/**
 * A transformer's rated (self-cooled) current in amps at `volts`: `S / (√3 · V)` for three-phase,
 * `S / V` for single-phase (IEEE 141 per-unit method, textbook identity). The per-unit base of its withstand curve.
 *
 * @param transformer `rating` in VA, `phases` 1 or 3.
 * @param volts the winding voltage (V), line-to-line for three-phase.
 * @example transformerRatedAmps({ id: 'T1', rating: 2_500_000, phases: 3 }, 480) // 3007.03 A
 */
export function transformerRatedAmps(
  transformer: Pick<Transformer, 'id' | 'rating' | 'phases'>,
  volts: number,
): number {
  const path = elementPath('transformers', transformer.id);
  const va = requireNumberAbove(`${path}.rating`, transformer.rating, 0, 'a rating in VA');
  const v = requireNumberAbove(`${path}.volts`, volts, 0, 'a winding voltage in V');
  return transformer.phases === 1 ? va / v : va / (Math.sqrt(3) * v);
}
