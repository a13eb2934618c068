import { describe, expect, it } from 'vitest';
import { cableImpedanceOf, resistanceAtTemperature } from '../../../src/engine/conductors/index.ts';
import { assertInDelta } from '../../asserts.ts';

const feet = (ft: number) => ft * 0.3048;
const cable = {
  id: 'C',
  size: '500 kcmil',
  material: 'copper' as const,
  conduit: 'steel' as const,
  length: feet(100),
  sets: 2,
  resistance: undefined,
  reactance: undefined,
};

describe('cableImpedanceOf', () => {
  it('has the expected defaults', () => {
    // 75 °C, Table 9 values, one step of work.
    const { steps } = cableImpedanceOf(cable);
    expect(steps).toHaveLength(1);
    expect(steps[0].source).toBe('NEC Ch. 9 Table 9, copper in steel conduit');
  });

  it('100 ft of 2 sets 500 kcmil Cu in steel is 0.00145 + j0.00240 Ω (NFPA 70 Ch. 9 Table 9, computed by hand)', () => {
    const { z } = cableImpedanceOf(cable);
    assertInDelta(z.r, 0.00145, 1e-9);
    assertInDelta(z.x, 0.0024, 1e-9);
  });

  it('metres are converted: 30.48 m equals 100 ft', () => {
    const { z } = cableImpedanceOf({ ...cable, length: 30.48, sets: 1 });
    assertInDelta(z.r, 0.0029, 1e-9);
  });

  it('minimum fault at 90 °C raises copper R by (234.5 + 90)/309.5, NEC Ch. 9 Table 8 note coefficients (from memory), common practice', () => {
    const { z, steps } = cableImpedanceOf(cable, { temperature: 90 });
    assertInDelta(z.r, (0.00145 * 324.5) / 309.5, 1e-9);
    assertInDelta(z.x, 0.0024, 1e-9);
    expect(steps[0].label).toBe('C resistance at 90 °C');
  });

  it('resistanceAtTemperature for aluminium uses (228 + T)/303', () => {
    assertInDelta(resistanceAtTemperature(0.043, 'aluminium', 90), (0.043 * 318) / 303, 1e-12);
    assertInDelta(resistanceAtTemperature(0.043, 'aluminium', 75), 0.043, 1e-12);
  });

  it('the study override per 1000 ft replaces Table 9 and is used as entered at any temperature', () => {
    const mv = { ...cable, size: '500 kcmil MV', resistance: 0.026, reactance: 0.035, sets: 1, length: feet(1000) };
    const hot = cableImpedanceOf(mv, { temperature: 90 });
    expect(hot.z).toEqual({ r: 0.026, x: 0.035 });
    expect(hot.steps[0].source).toBe('cable data');
  });

  it('a size outside Table 9 with no override names the field', () => {
    expect(() => cableImpedanceOf({ ...cable, size: '900 kcmil' }, { path: 'study.cables[1]' })).toThrow(
      /^study\.cables\[1\]\.size: expected a size in NEC Table 9 \(14 AWG to 1000 kcmil\), or "resistance" and "reactance" per 1000 ft, got "900 kcmil"$/,
    );
    expect(() =>
      cableImpedanceOf({ ...cable, size: '14 AWG', material: 'aluminium' }, { path: 'study.cables[1]' }),
    ).toThrow(
      /^study\.cables\[1\]\.size: expected a size NEC Table 9 lists in aluminium, or "resistance" per 1000 ft, got "14 AWG"$/,
    );
    expect(() => cableImpedanceOf({ ...cable, size: 'huge' }, { path: 'study.cables[1]' })).toThrow(
      /^study\.cables\[1\]\.size: expected a conductor size such as "4\/0", "12 AWG" or "500 kcmil", got "huge"$/,
    );
  });

  it('accepts 600 kcmil: 250 ft, copper in PVC, one set is (0.023 + j0.039) × 0.25 Ω (NFPA 70 Ch. 9 Table 9)', () => {
    const { z } = cableImpedanceOf({ ...cable, size: '600 kcmil', conduit: 'pvc', length: feet(250), sets: 1 });
    assertInDelta(z.r, 0.00575, 1e-9);
    assertInDelta(z.x, 0.00975, 1e-9);
    const kcmil1000 = cableImpedanceOf({
      ...cable,
      size: '1000 kcmil',
      material: 'aluminium',
      length: feet(1000),
      sets: 1,
    });
    assertInDelta(kcmil1000.z.r, 0.025, 1e-9); // aluminium in steel conduit
    assertInDelta(kcmil1000.z.x, 0.046, 1e-9);
  });

  it('takes the reactance alone from Table 9 when only resistance is overridden', () => {
    const { z } = cableImpedanceOf({ ...cable, resistance: 0.05, sets: 1 });
    assertInDelta(z.r, 0.005, 1e-12);
    assertInDelta(z.x, 0.0048, 1e-12);
  });
});
