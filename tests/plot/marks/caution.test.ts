import { describe, expect, it } from 'vitest';
import { caution, cautionDefaults, cautionHeight } from '../../../src/plot/marks/caution.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

describe('caution', () => {
  it('has the expected defaults', () => {
    expect(cautionDefaults).toEqual({ scale: 0.85, maxLines: 3, lineHeight: 1.25 });
    expect(caution('For review by a qualified engineer.', { x: 16, y: 690, width: 900, fontSize: 11 })).toHaveLength(1);
  });

  it('caution wraps to at most three lines within the width', () => {
    const lines = caution('word '.repeat(400), { x: 16, y: 690, width: 600, fontSize: 11 });
    expect(lines).toHaveLength(3);
    for (const l of lines) expect(textWidth(l.text, l.size)).toBeLessThanOrEqual(600);
    expect(cautionHeight('word '.repeat(400), 600, 11)).toBeCloseTo(3 * 11 * 0.85 * 1.25, 9);
  });
});
