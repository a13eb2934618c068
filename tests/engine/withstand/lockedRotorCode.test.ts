import { describe, it, expect } from 'vitest';
import { LOCKED_ROTOR_KVA_PER_HP, lockedRotorAmpsFromCode } from '../../../src/engine/withstand/lockedRotorCode.ts';
import { assertInDelta } from '../../asserts.ts';

describe('lockedRotorAmpsFromCode', () => {
  it('has the expected defaults', () => {
    // NEC Table 430.7(B), NFPA 70 Article 430 (from memory)
    expect(LOCKED_ROTOR_KVA_PER_HP.G).toEqual([5.6, 6.29]);
    expect(Object.keys(LOCKED_ROTOR_KVA_PER_HP)).toHaveLength(19);
    expect(LOCKED_ROTOR_KVA_PER_HP.V[1]).toBe(Infinity);
  });

  it('lockedRotorAmpsFromCode(G, 100 hp, 460 V) is 789.46 A at the upper value', () => {
    // hand-worked NFPA 70 Table 430.7(B) case: 6.29 · 100 · 1000 / (√3 · 460) = 789.46 A (NEC 430.7(B), from memory; computed)
    assertInDelta(lockedRotorAmpsFromCode('G', 100, 460), 789.46, 1e-5);
    assertInDelta(lockedRotorAmpsFromCode(' g ', 100, 460, 'lower'), (5.6 * 100_000) / (Math.sqrt(3) * 460), 1e-12);
  });

  it('lockedRotorAmpsFromCode rejects an unknown letter and letter V, which has no upper value', () => {
    expect(() => lockedRotorAmpsFromCode('I', 100, 460)).toThrow(
      /^codeLetter: expected an NEC 430\.7\(B\) code letter A–V \(no I, O or Q\), got "I"$/,
    );
    expect(() => lockedRotorAmpsFromCode('V', 100, 460)).toThrow(
      /^codeLetter: expected a letter with an upper kVA\/hp value/,
    );
    assertInDelta(lockedRotorAmpsFromCode('V', 100, 460, 'lower'), (22.4 * 100_000) / (Math.sqrt(3) * 460), 1e-12);
    expect(() => lockedRotorAmpsFromCode('G', 0, 460)).toThrow(/^hp: expected a horsepower greater than 0, got "0"$/);
  });
});
