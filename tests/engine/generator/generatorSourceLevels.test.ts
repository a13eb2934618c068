import { describe, expect, it } from 'vitest';
import { formatWork } from '../../../src/engine/work.ts';
import {
  DEFAULT_GENERATOR_XR,
  GENERATOR_X0_FRACTION,
  generatorSourceLevels,
} from '../../../src/engine/generator/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { RATED_AMPS, generatorOf } from './fixtures.ts';

describe('generatorSourceLevels', () => {
  it('has the expected defaults', () => {
    expect(DEFAULT_GENERATOR_XR).toBe(20); // common practice for small standby machines
    expect(GENERATOR_X0_FRACTION).toBe(0.5); // common practice, from memory
    const levels = generatorSourceLevels(generatorOf());
    expect(levels.xr).toBe(20);
    assertInDelta(levels.zeroSequenceRatio, 0.5, 1e-12);
    assertInDelta(levels.x0, 0.06, 1e-12);
    expect(levels.minimumBasis).toBe('synchronous');
  });

  describe('500 kVA 480 V machine worked by hand (IEEE Std 551 generator short-circuit current; S = √3·V·I, IEEE 141)', () => {
    const levels = generatorSourceLevels(generatorOf());

    it('maximum: I″ = 601.4065 A / 0.12 = 5011.72 A, S″ = 500 kVA / 0.12 = 4.16667 MVA', () => {
      assertInDelta(levels.maximum.amps, 5011.72, 1e-6);
      assertInDelta(levels.maximum.va, 4.16667e6, 1e-6);
      assertInDelta(levels.maximum.va, Math.sqrt(3) * 480 * levels.maximum.amps, 1e-12);
    });

    it('equivalent impedance |Z″| = 480² / 4.16667e6 = 0.055296 Ω, split at X/R 20', () => {
      assertInDelta(Math.hypot(levels.z.r, levels.z.x), 0.055296, 1e-9);
      assertInDelta(levels.z.x / levels.z.r, 20, 1e-12);
    });

    it('minimum without support: E/Xd = 0.5 × rated = 300.703 A, 250 kVA', () => {
      assertInDelta(levels.minimum.amps, RATED_AMPS / 2, 1e-12);
      assertInDelta(levels.minimum.amps, 300.703, 1e-5);
      assertInDelta(levels.minimum.va, 250e3, 1e-12);
    });
  });

  it('minimum with excitation support 3 × rated: 1804.22 A, 1.5 MVA', () => {
    const levels = generatorSourceLevels(generatorOf({ sustained: 3 }));
    expect(levels.minimumBasis).toBe('support');
    assertInDelta(levels.minimum.amps, 1804.22, 1e-6);
    assertInDelta(levels.minimum.va, 1.5e6, 1e-12);
  });

  it('a support below E/Xd leaves the minimum at E/Xd', () => {
    const levels = generatorSourceLevels(generatorOf({ sustained: 0.3 }));
    expect(levels.minimumBasis).toBe('synchronous');
    assertInDelta(levels.minimum.va, 250e3, 1e-12);
  });

  it('a support above the subtransient current (X″d 0.3, k 4: 1/0.3 = 3.33 × rated) leaves the minimum at the maximum, 2004.69 A, not above it', () => {
    const levels = generatorSourceLevels(generatorOf({ xdSubtransient: 0.3, xdTransient: 0.35, sustained: 4 }));
    expect(levels.minimumBasis).toBe('support');
    assertInDelta(levels.minimum.amps, RATED_AMPS / 0.3, 1e-12);
    assertInDelta(levels.minimum.amps, levels.maximum.amps, 1e-12);
    assertInDelta(levels.minimum.amps, 2004.69, 1e-6);
    const step = levels.work.find((s) => /sustained fault current with excitation support/.test(s.label))!;
    expect(step.formula).toBe('I_sus = min(k · I_r, I″)');
  });

  it('a given X0 = 0.03 pu gives X0/X1 = 0.03 / 0.12 = 0.25; a given X/R is used', () => {
    const levels = generatorSourceLevels(generatorOf({ x0: 0.03, xr: 12 }));
    assertInDelta(levels.zeroSequenceRatio, 0.25, 1e-12);
    assertInDelta(levels.z.x / levels.z.r, 12, 1e-12);
  });

  it('the work names a source on every step and carries the numbers', () => {
    const { work } = generatorSourceLevels(generatorOf());
    expect(work.length).toBe(7);
    for (const step of work) expect(step.source, step.label).toBeTruthy();
    const text = formatWork(work);
    expect(text).toMatch(/I″ = E · I_r \/ X″d/);
    expect(text).toMatch(/default 20, common practice/);
    expect(text).toMatch(/0\.5 × X″d when not given \(common practice, from memory\)/);
    assertInDelta(work[1].value, 5011.72, 1e-6);
  });

  it('bad input names the field', () => {
    expect(() => generatorSourceLevels(generatorOf({ x0: 0 }))).toThrow(
      /^generators\.G1\.x0: expected a reactance in pu greater than 0, got "0"$/,
    );
    expect(() => generatorSourceLevels(generatorOf({ sustained: -1 }))).toThrow(/^generators\.G1\.sustained: /);
  });
});
