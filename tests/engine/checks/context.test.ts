import { describe, it } from 'vitest';
import { rangeOf } from '../../../src/engine/checks/context.ts';
import { assertInDelta } from '../../asserts.ts';

describe('rangeOf', () => {
  it('has the expected defaults: the other voltage by the voltage ratio (turns ratio)', () => {
    const range = rangeOf(9800, 14900, 480, [12470]);
    assertInDelta(range.atVoltages[1].toAmps, (14900 * 480) / 12470, 1e-12);
    assertInDelta(range.atVoltages[0].toAmps, 14900, 0);
  });

  it('a secondary L-L fault across Δ–Y loads one primary line 2/√3 times the ratio (IEEE C37.91 shift factor, exact)', () => {
    const range = rangeOf(9800, 14900, 480, [12470, 480], new Map([[12470, 2 / Math.sqrt(3)]]));
    assertInDelta(range.atVoltages[1].fromAmps, ((9800 * 480) / 12470) * (2 / Math.sqrt(3)), 1e-12);
    assertInDelta(range.atVoltages[0].fromAmps, 9800, 0);
  });
});
