import { describe, expect, it } from 'vitest';
import {
  DELTA_WYE_TABLE,
  isGroundedSecondary,
  shiftFactorsOf,
  unbalancedLineCurrents,
} from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('delta–wye per-unit table', () => {
  it('has the expected defaults', () => {
    // A three-phase fault is 1.0 pu everywhere, whatever the connection (symmetrical components, IEEE 399).
    for (const row of Object.values(DELTA_WYE_TABLE)) expect(row.threePhase.primary).toEqual([1, 1, 1]);
  });

  it('Δ–Yg rows match symmetrical components (IEEE 399; the IEEE C37.91 shift-factor patterns): L-L 1.0/0.5/0.5 on the primary, L-G 0.577 in two lines', () => {
    const row = DELTA_WYE_TABLE['delta-wye'];
    assertInDelta(row.lineToLine.secondary[0], 0.866, 1e-3);
    expect(row.lineToLine.primary).toEqual([1, 0.5, 0.5]);
    assertInDelta(row.lineToGround.primary[0], 0.577, 1e-3);
    expect(row.lineToGround.primary[2]).toBe(0);
  });

  it('Δ–Δ L-L: winding 1.0 pu, primary lines 0.866, symmetrical components (IEEE 399; the IEEE C37.91 shift-factor patterns)', () => {
    const row = DELTA_WYE_TABLE['delta-delta'].lineToLine;
    expect(row.winding).toBe(1);
    assertInDelta(row.primary[0], 0.866, 1e-3);
  });

  it('unbalancedLineCurrents for 112.5 kVA 480Δ–208Y/120, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const ll = unbalancedLineCurrents('delta-wye', 'lineToLine', 8921.97, 208, 480);
    assertInDelta(ll.secondaryAmps[0], 7726.65, 1e-5);
    assertInDelta(ll.primaryAmps[0], 3866.18, 1e-5);
    assertInDelta(ll.primaryAmps[1], 1933.09, 1e-5);
    const lg = unbalancedLineCurrents('delta-wye', 'lineToGround', 8921.97, 208, 480);
    assertInDelta(lg.secondaryAmps[0], 8921.97, 1e-9);
    assertInDelta(lg.primaryAmps[0], 2232.14, 1e-5);
    expect(lg.primaryAmps[2]).toBe(0);
  });

  it('unbalancedLineCurrents: 28 421 A secondary L-G on the demo transformer is 631.62 A on the primary, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(
      unbalancedLineCurrents('delta-wye', 'lineToGround', 28421.1, 480, 12470).primaryAmps[0],
      631.62,
      1e-5,
    );
  });

  it('shiftFactorsOf: exactly 2/√3 for Δ–Y and Y–Δ, 1/√3 withstand for Δ–Yg, √3/2 for Δ–Δ (IEEE C37.91 shift factors, exact)', () => {
    // A Δ–Y secondary L-L fault puts 1.0 pu in one primary line against √3/2 in the secondary lines.
    const dy = shiftFactorsOf('delta-wye');
    expect(dy.lineToLineDeviceShift).toBe(2 / Math.sqrt(3));
    expect(dy.withstandShift).toBe(1 / Math.sqrt(3));
    expect(shiftFactorsOf('wye-delta').lineToLineDeviceShift).toBe(2 / Math.sqrt(3));
    expect(shiftFactorsOf('delta-delta')).toEqual({ lineToLineDeviceShift: 1, withstandShift: Math.sqrt(3) / 2 });
    expect(shiftFactorsOf('wye-wye')).toEqual({ lineToLineDeviceShift: 1, withstandShift: 1 });
    expect(shiftFactorsOf('delta-wye', 1)).toEqual({ lineToLineDeviceShift: 1, withstandShift: 1 });
  });

  it('delta secondaries carry no ground-fault current', () => {
    expect(isGroundedSecondary('delta-delta')).toBe(false);
    expect(isGroundedSecondary('wye-delta')).toBe(false);
    expect(isGroundedSecondary('delta-wye')).toBe(true);
    expect(unbalancedLineCurrents('delta-delta', 'lineToGround', 1000, 480, 4160).primaryAmps).toEqual([0, 0, 0]);
  });
});
