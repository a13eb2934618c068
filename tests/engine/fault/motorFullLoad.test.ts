import { describe, expect, it } from 'vitest';
import { motorFullLoadAmps } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('motorFullLoadAmps', () => {
  it('has the expected defaults', () => {
    // Nameplate wins over everything else.
    expect(motorFullLoadAmps({ fullLoadAmps: 124, hp: 100, rating: undefined }, 460)).toBe(124);
  });

  it('100 hp at 460 V is 125.5 A by 1 hp ≈ 1 kVA (common practice); NEC Table 430.250 lists 124 A (from memory)', () => {
    const amps = motorFullLoadAmps({ hp: 100, rating: undefined, fullLoadAmps: undefined }, 460);
    assertInDelta(amps, 125.51, 1e-4);
    expect(Math.abs(amps - 124) / 124).toBeLessThan(0.02);
  });

  it('from a kVA rating, S / (√3 · V)', () => {
    assertInDelta(motorFullLoadAmps({ rating: 150e3, hp: undefined, fullLoadAmps: undefined }, 480), 180.422, 1e-5);
  });
});
