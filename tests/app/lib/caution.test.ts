import { describe, it, expect } from 'vitest';
import { CAUTION } from '../../../src/app/lib/caution.ts';
import { CAUTION as FIGURE_CAUTION } from '../../../src/engine/caution.ts';

describe('caution', () => {
  it('has the expected defaults: the line every figure and report carries, word for word', () => {
    expect(CAUTION).toBe(FIGURE_CAUTION);
    // The three points the README's cautions make, and arc flash left to its own study.
    expect(CAUTION).toMatch(/^For review by a qualified engineer\./);
    expect(CAUTION).toMatch(/licensed practice govern/);
    expect(CAUTION).toMatch(/published curves and tested selectivity data govern over generic curves/);
    expect(CAUTION).toMatch(/Arc flash is a separate study\.$/);
  });
});
