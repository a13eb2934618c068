import { describe, expect, it } from 'vitest';
import {
  CABLE_ZERO_SEQUENCE_MULTIPLE,
  cableZeroSequenceOf,
  neutralImpedanceOf,
  sourceZeroSequenceOf,
} from '../../../src/engine/fault/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { deltaWyeInput } from './sequenceReference.ts';

describe('zero-sequence elements', () => {
  it('has the expected defaults: cable Z0 = 3 · Z1 in every conduit (common practice), solid grounding adds nothing', () => {
    expect(CABLE_ZERO_SEQUENCE_MULTIPLE).toEqual({ steel: 3, aluminium: 3, pvc: 3 });
    expect(neutralImpedanceOf({ kind: 'solid' })).toEqual({ r: 0, x: 0 });
    expect(neutralImpedanceOf(undefined)).toEqual({ r: 0, x: 0 });
    expect(parseStudy(deltaWyeInput()).transformers[0].grounding).toEqual({ kind: 'solid' });
  });

  it('a neutral resistor or reactor is R or jX; an ungrounded neutral has no path', () => {
    expect(neutralImpedanceOf({ kind: 'resistance', ohms: 1.39 })).toEqual({ r: 1.39, x: 0 });
    expect(neutralImpedanceOf({ kind: 'reactance', ohms: 0.4 })).toEqual({ r: 0, x: 0.4 });
    expect(neutralImpedanceOf({ kind: 'ungrounded' })).toBeUndefined();
  });

  it('a resistance grounding without ohms is refused, naming the field', () => {
    const input = deltaWyeInput();
    input.transformers![0].grounding = { kind: 'resistance' };
    expect(() => parseStudy(input)).toThrow(/transformers\[0\]\.grounding\.ohms/);
  });

  it('source: Z0 from the ratios, plus 3·Zn; with no data Z0 = Z1 (solidly grounded, common practice)', () => {
    const z1 = { r: 0.1, x: 1.2 };
    expect(sourceZeroSequenceOf(undefined, z1, 12470, { kind: 'solid' }).z0).toEqual(z1);
    const level = { available: { va: 250e6 }, xr: 12, x0x1: 3, r0r1: 2 };
    const { z0 } = sourceZeroSequenceOf(level, z1, 12470, { kind: 'resistance', ohms: 5 });
    assertInDelta(z0!.r, 2 * 0.1 + 3 * 5, 1e-12);
    assertInDelta(z0!.x, 3 * 1.2, 1e-12);
    expect(sourceZeroSequenceOf(level, z1, 12470, { kind: 'ungrounded' }).z0).toBeUndefined();
  });

  it('source: a line-to-ground level gives |2·Z1 + Z0| = √3·V / I_LG at the angle of Z1', () => {
    const z1 = { r: 0.05, x: 0.6 };
    const level = { available: { va: 250e6 }, lineToGround: { amps: 9000 } };
    const { z0 } = sourceZeroSequenceOf(level, z1, 12470, { kind: 'solid' });
    const loop = { r: 2 * z1.r + z0!.r, x: 2 * z1.x + z0!.x };
    assertInDelta(Math.hypot(loop.r, loop.x), (Math.sqrt(3) * 12470) / 9000, 1e-12);
    assertInDelta(z0!.x / z0!.r, 12, 1e-12);
  });

  it('source: a line-to-ground level is the current available at the bus, grounding included, so 3·Zn is not added again', () => {
    // 4.16 kV, 6 Ω neutral resistor, 400 A available line to ground: |2·Z1 + Z0| = √3 · 4160 V / 400 A = 18.0133 Ω
    // (symmetrical components, IEEE 399 short-circuit chapter), not that plus 3 × 6 Ω.
    const z1 = { r: 0.0199, x: 0.199 };
    const level = { available: { amps: 12000 }, xr: 10, lineToGround: { amps: 400 } };
    const { z0, steps } = sourceZeroSequenceOf(level, z1, 4160, { kind: 'resistance', ohms: 6 });
    const loop = { r: 2 * z1.r + z0!.r, x: 2 * z1.x + z0!.x };
    assertInDelta(Math.hypot(loop.r, loop.x), (Math.sqrt(3) * 4160) / 400, 1e-12);
    expect(steps.some((s) => /3·Zn/.test(s.formula))).toBe(false);
    // Without the level, the resistor is added three times to the source's own Z0 = Z1.
    const ratios = sourceZeroSequenceOf({ ...level, lineToGround: undefined }, z1, 4160, {
      kind: 'resistance',
      ohms: 6,
    });
    assertInDelta(ratios.z0!.r, z1.r + 18, 1e-12);
  });

  it('cable: entered R0/X0 per 1000 ft over the length and sets, else the multiple of Z1', () => {
    const cable = parseStudy(deltaWyeInput()).cables[0];
    const z1 = { r: 0.00145, x: 0.0024 };
    assertInDelta(cableZeroSequenceOf(cable, z1).z0.x, 3 * 0.0024, 1e-12);
    const entered = { ...cable, zeroSequence: { resistance: 0.2, reactance: 0.1 } };
    const { z0 } = cableZeroSequenceOf(entered, z1);
    assertInDelta(z0.r, (0.2 * 100) / 1000 / 2, 1e-9);
    assertInDelta(z0.x, (0.1 * 100) / 1000 / 2, 1e-9);
  });
});
