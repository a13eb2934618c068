import { describe, expect, it } from 'vitest';
import {
  faultLevelsOf,
  HALF_WINDING_MULTIPLIERS,
  primaryConnectionOf,
  secondaryWindingOf,
} from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { singlePhaseInput } from './sequenceReference.ts';

const unit = () => parseStudy(singlePhaseInput()).transformers[0];

describe('single-phase transformer connections', () => {
  it('has the expected defaults: half winding 1.5 × R and 1.2 × X (common practice), 240 V centre-tapped', () => {
    expect(HALF_WINDING_MULTIPLIERS).toEqual({ r: 1.5, x: 1.2 });
    expect(secondaryWindingOf(unit())).toBe('centre-tapped');
    expect(secondaryWindingOf({ ...unit(), secondary: 480 })).toBe('two-wire');
    expect(secondaryWindingOf({ ...unit(), secondaryWinding: 'two-wire' })).toBe('two-wire');
  });

  it('the primary connection follows the rated voltage: 12.47 kV across two lines, 7.2 kV line to neutral', () => {
    expect(primaryConnectionOf(unit(), 12470)).toBe('line-to-line');
    expect(primaryConnectionOf({ ...unit(), primary: 7200 }, 12470)).toBe('line-to-neutral');
    expect(primaryConnectionOf({ ...unit(), primary: 7200, primaryConnection: 'line-to-line' }, 12470)).toBe(
      'line-to-line',
    );
  });

  it('refuses a line-to-neutral unit on a primary with no grounded neutral, naming the field', () => {
    const input = singlePhaseInput();
    input.transformers![0].primary = '7.2 kV';
    input.source = { ...input.source, kind: 'utility', grounding: { kind: 'ungrounded' } } as typeof input.source;
    expect(() => faultLevelsOf(networkOf(parseStudy(input)))).toThrow(
      /^study\.transformers\[0\]\.primaryConnection: expected "line-to-line" on MV, which has no grounded neutral/,
    );
  });
});
