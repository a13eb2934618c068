import { describe, it, expect } from 'vitest';
import { CATEGORY_LIMITS_KVA, transformerCategoryOf } from '../../../src/engine/withstand/transformerCategory.ts';
import { transformerOf } from './fixtures.ts';

describe('transformerCategoryOf', () => {
  it('has the expected defaults', () => {
    // IEEE C57.12.00 category table, IEEE C57.12.00 (confirmed)
    expect(CATEGORY_LIMITS_KVA[3]).toEqual([500, 5000, 30_000]);
    expect(CATEGORY_LIMITS_KVA[1]).toEqual([500, 1667, 10_000]);
    expect(transformerCategoryOf(transformerOf())).toBe('II');
  });

  it('transformerCategoryOf(three-phase) follows the C57.12.00 kVA ranges at every boundary', () => {
    // IEEE C57.12.00, IEEE C57.12.00 (confirmed): I 15–500, II 501–5000, III 5001–30 000, IV above
    const cases: [number, string][] = [
      [15, 'I'],
      [500, 'I'],
      [501, 'II'],
      [2500, 'II'],
      [5000, 'II'],
      [5001, 'III'],
      [30_000, 'III'],
      [30_001, 'IV'],
      [100_000, 'IV'],
    ];
    for (const [kva, category] of cases) {
      expect(transformerCategoryOf(transformerOf({ rating: kva })), `${kva} kVA`).toBe(category);
    }
  });

  it('transformerCategoryOf(single-phase) follows the C57.12.00 kVA ranges at every boundary', () => {
    // IEEE C57.12.00, IEEE C57.12.00 (confirmed): I 5–500, II 501–1667, III 1668–10 000, IV above
    const cases: [number, string][] = [
      [5, 'I'],
      [500, 'I'],
      [501, 'II'],
      [1667, 'II'],
      [1668, 'III'],
      [10_000, 'III'],
      [10_001, 'IV'],
    ];
    for (const [kva, category] of cases) {
      expect(transformerCategoryOf(transformerOf({ rating: kva, phases: 1 })), `${kva} kVA 1φ`).toBe(category);
    }
  });

  it('transformerCategoryOf puts units below the smallest table size and fractional kVA between ranges sensibly', () => {
    expect(transformerCategoryOf(transformerOf({ rating: 3 }))).toBe('I');
    expect(transformerCategoryOf(transformerOf({ rating: 500.5 }))).toBe('II');
    expect(transformerCategoryOf(transformerOf({ rating: '1.5 MVA' }))).toBe('II');
  });

  it('transformerCategoryOf keeps the category the study sets over the one its kVA implies', () => {
    expect(transformerCategoryOf(transformerOf({ rating: 2500, category: 'III' }))).toBe('III');
    expect(transformerCategoryOf(transformerOf({ rating: 300, category: 'II' }))).toBe('II');
  });

  it('transformerCategoryOf rejects a rating that is not a positive number, naming the field', () => {
    const bad = { ...transformerOf(), rating: -5 };
    expect(() => transformerCategoryOf(bad)).toThrow(
      /^transformers\.T1\.rating: expected a rating in VA greater than 0, got "-5"$/,
    );
    const text = { ...transformerOf(), rating: 'big' as unknown as number };
    expect(() => transformerCategoryOf(text)).toThrow(
      /^transformers\.T1\.rating: expected a rating in VA greater than 0, got "big"$/,
    );
  });

  it('transformerCategoryOf rejects an unknown category, naming the field', () => {
    const bad = { ...transformerOf(), category: 'V' as 'IV' };
    expect(() => transformerCategoryOf(bad)).toThrow(
      /^transformers\.T1\.category: expected one of "I", "II", "III", "IV", got "V"$/,
    );
  });
});
