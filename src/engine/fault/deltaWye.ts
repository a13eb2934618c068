import type { Transformer } from '../study/index.ts';
import { reflectAmps } from './reflect.ts';

/** Transformer winding connection, primary first (wye secondaries solidly grounded). */
export type Connection = Transformer['connection'];
/** A bolted secondary fault type. */
export type FaultType = 'threePhase' | 'lineToLine' | 'lineToGround';

/** Per-unit line currents for one connection and secondary fault (symmetrical components, IEEE 399). */
export interface UnbalancedCase {
  /** Secondary line currents (a, b, c), pu of the three-phase fault at the same point. */
  secondary: readonly number[];
  /** Worst transformer winding current, pu. */
  winding: number;
  /** Primary line currents, pu (on the primary, after scaling by the voltage ratio). */
  primary: readonly number[];
}

const HALF_ROOT3 = Math.sqrt(3) / 2; // 0.866
const INV_ROOT3 = 1 / Math.sqrt(3); // 0.577

const THREE_PHASE: UnbalancedCase = { secondary: [1, 1, 1], winding: 1, primary: [1, 1, 1] };
const OPEN: UnbalancedCase = { secondary: [0, 0, 0], winding: 0, primary: [0, 0, 0] };

/**
 * Per-unit line currents for bolted secondary faults by symmetrical components with Z1 = Z2 (IEEE 399
 * short-circuit chapter; the patterns behind the IEEE C37.91 / C57.109 shift factors). The L-G rows
 * take I_LG = I_3φ (Z0 = Z1, a solidly grounded wye at the terminals); `faultLevelsOf` computes the
 * actual L-G current from the zero-sequence network. Y–Δ is worked the same way: the delta secondary's
 * faulted winding carries 2/3 of the line current, 1.0 pu, and the other two 0.5 pu, which the wye
 * primary lines carry unchanged. Delta secondaries are ungrounded, so an L-G fault draws no fault current.
 *
 * @example DELTA_WYE_TABLE['delta-wye'].lineToGround.primary // [0.57735, 0.57735, 0]
 */
export const DELTA_WYE_TABLE: Readonly<Record<Connection, Readonly<Record<FaultType, UnbalancedCase>>>> = {
  'delta-wye': {
    threePhase: THREE_PHASE,
    lineToLine: { secondary: [HALF_ROOT3, HALF_ROOT3, 0], winding: HALF_ROOT3, primary: [1, 0.5, 0.5] },
    lineToGround: { secondary: [1, 0, 0], winding: 1, primary: [INV_ROOT3, INV_ROOT3, 0] },
  },
  'delta-delta': {
    threePhase: THREE_PHASE,
    lineToLine: { secondary: [HALF_ROOT3, HALF_ROOT3, 0], winding: 1, primary: [HALF_ROOT3, HALF_ROOT3, 0] },
    lineToGround: OPEN,
  },
  'wye-wye': {
    threePhase: THREE_PHASE,
    lineToLine: { secondary: [HALF_ROOT3, HALF_ROOT3, 0], winding: HALF_ROOT3, primary: [HALF_ROOT3, HALF_ROOT3, 0] },
    lineToGround: { secondary: [1, 0, 0], winding: 1, primary: [1, 0, 0] },
  },
  'wye-delta': {
    threePhase: THREE_PHASE,
    lineToLine: { secondary: [HALF_ROOT3, HALF_ROOT3, 0], winding: 1, primary: [1, 0.5, 0.5] },
    lineToGround: OPEN,
  },
};

/** Line currents for one secondary fault, per unit and in amps. */
export interface UnbalancedCurrents extends UnbalancedCase {
  /** Secondary line currents in amps at the secondary voltage. */
  secondaryAmps: number[];
  /** Primary line currents in amps at the primary voltage. */
  primaryAmps: number[];
}

/**
 * The secondary and primary line currents for a bolted secondary fault, from the three-phase
 * secondary fault current and the transformer's voltages (`DELTA_WYE_TABLE`, voltage-ratio scaling).
 *
 * @example unbalancedLineCurrents('delta-wye', 'lineToGround', 8921.97, 208, 480).primaryAmps // [2232.14, 2232.14, 0]
 */
export function unbalancedLineCurrents(
  connection: Connection,
  fault: FaultType,
  threePhaseSecondaryAmps: number,
  secondaryVolts: number,
  primaryVolts: number,
): UnbalancedCurrents {
  const row = DELTA_WYE_TABLE[connection][fault];
  const reflected = reflectAmps(threePhaseSecondaryAmps, secondaryVolts, primaryVolts);
  return {
    ...row,
    secondaryAmps: row.secondary.map((pu) => pu * threePhaseSecondaryAmps),
    primaryAmps: row.primary.map((pu) => pu * reflected),
  };
}

/**
 * Sheet shift factors for a connection (the IEEE C37.91 / C57.109 practice, exact values): the
 * device-coordination multiplier for a secondary L-L fault, `2/√3` for Δ–Y and Y–Δ (a primary line
 * carries 1.0 pu while the secondary lines carry √3/2), else 1; and the withstand-curve multiplier,
 * `1/√3` for Δ–Yg with a secondary L-G fault, `√3/2` for Δ–Δ with a secondary L-L fault, else 1 (the
 * trade rounds these to 1.15, 0.58 and 0.87). A single-phase unit has none.
 *
 * @example shiftFactorsOf('delta-wye') // { lineToLineDeviceShift: 1.1547005, withstandShift: 0.5773503 }
 */
export function shiftFactorsOf(
  connection: Connection,
  phases: 1 | 3 = 3,
): { lineToLineDeviceShift: number; withstandShift: number } {
  if (phases === 1) return { lineToLineDeviceShift: 1, withstandShift: 1 };
  return {
    lineToLineDeviceShift: isPhaseShifting(connection) ? 2 / Math.sqrt(3) : 1,
    withstandShift: connection === 'delta-wye' ? INV_ROOT3 : connection === 'delta-delta' ? HALF_ROOT3 : 1,
  };
}

/** Whether a connection shifts the phase by 30° (Δ–Y or Y–Δ), so that a secondary L-L fault loads one primary line fully. @example isPhaseShifting('wye-delta') // true */
export function isPhaseShifting(connection: Connection): boolean {
  return connection === 'delta-wye' || connection === 'wye-delta';
}

/** Whether the secondary of a connection is a wye (grounded as its `grounding` says; it can carry ground-fault current). @example isGroundedSecondary('delta-delta') // false */
export function isGroundedSecondary(connection: Connection): boolean {
  return connection === 'delta-wye' || connection === 'wye-wye';
}
