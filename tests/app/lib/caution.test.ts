import { describe, it, expect } from 'vitest';
import { CAUTION } from '../../../src/app/lib/caution.ts';

describe('caution', () => {
  it('has the expected defaults', () => {
    // the cautions in README.md: the line every page carries, word for word.
    expect(CAUTION).toBe(
      "For review by a qualified engineer. Local codes, the AHJ and licensed practice govern; manufacturers' published curves and tested data govern over generic curves. Not an arc-flash study.",
    );
  });
});
