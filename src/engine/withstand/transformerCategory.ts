import type { Transformer } from '../study/index.ts';
import { InputError, expectedGot } from '../errors.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';

/** IEEE C57.12.00 through-fault category (IEEE C57.12.00), as the study schema spells it. */
export type TransformerCategory = NonNullable<Transformer['category']>;

const CATEGORIES: readonly string[] = ['I', 'II', 'III', 'IV'];

/**
 * Upper kVA limit of Categories I, II and III by phase count, IEEE C57.12.00 (confirmed): single-phase 500 / 1667 / 10 000 kVA, three-phase 500 / 5000 / 30 000 kVA.
 * Anything above the Category III limit is Category IV.
 */
export const CATEGORY_LIMITS_KVA: Readonly<Record<1 | 3, readonly [number, number, number]>> = {
  1: [500, 1667, 10_000],
  3: [500, 5000, 30_000],
};

/**
 * The through-fault category of a transformer: the study's `category` when set, otherwise inferred
 * from its self-cooled rating and phase count by IEEE C57.12.00. Units below the
 * table's smallest sizes (5 kVA single-phase, 15 kVA three-phase) are put in Category I.
 *
 * @param transformer `rating` in VA (self-cooled), `phases` 1 or 3, optional `category`.
 * @example transformerCategoryOf({ id: 'T1', rating: 2_500_000, phases: 3 }) // 'II'
 */
export function transformerCategoryOf(
  transformer: Pick<Transformer, 'id' | 'rating' | 'phases' | 'category'>,
): TransformerCategory {
  const path = elementPath('transformers', transformer.id);
  if (transformer.category !== undefined) {
    if (!CATEGORIES.includes(transformer.category)) {
      throw new InputError(`${path}.category`, expectedGot('one of "I", "II", "III", "IV"', transformer.category));
    }
    return transformer.category;
  }
  const va = requireNumberAbove(`${path}.rating`, transformer.rating, 0, 'a rating in VA');
  const [limitI, limitII, limitIII] = CATEGORY_LIMITS_KVA[transformer.phases === 1 ? 1 : 3];
  const kva = va / 1000;
  // The table's ranges are whole kVA (…500, 501…); anything above a range's upper limit is in the next category.
  if (kva <= limitI) return 'I';
  if (kva <= limitII) return 'II';
  if (kva <= limitIII) return 'III';
  return 'IV';
}
