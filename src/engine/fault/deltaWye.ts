import type { Transformer } from '../study/index.ts';
import { reflectAmps } from './reflect.ts';

/** Transformer winding connection, primary first (wye secondaries solidly grounded). */
export type Connection = Transformer['connection'];
/** A bolted secondary fault type. */
export type FaultType = 'threePhase' | 'lineToLine' | 'lineToGround';

/** Per-unit line currents for one connection and secondary fault (REFERENCE §1.8). */
export interface UnbalancedCase {
  /** Secondary line currents (a, b, c), pu of the three-phase fault at the same point. */
  secondary: readonly number[];
  /** Worst transformer winding current, pu. */
  winding: number;
  /** Primary line currents, pu (on the primary after §1.7 scaling). */
  primary: readonly number[];
}

const HALF_ROOT3 = Math.sqrt(3) / 2; // 0.866
const INV_ROOT3 = 1 / Math.sqrt(3); // 0.577

const THREE_PHASE: UnbalancedCase = { secondary: [1, 1, 1], winding: 1, primary: [1, 1, 1] };
const OPEN: UnbalancedCase = { secondary: [0, 0, 0], winding: 0, primary: [0, 0, 0] };

/**
 * REFERENCE §1.8 as data: symmetrical components with Z1 = Z2, bolted faults, L-G at I_LG ≈ I_3φ
 * on solidly grounded wye secondaries (common practice). The Δ–Yg and Δ–Δ rows are from
 * REFERENCE §1.8 (derived by hand there; shift factors per IEEE C37.91 / C57.109 practice, from memory).
 * Y–Δ is worked the same way (computed): the delta secondary's faulted winding carries 2/3 of the
 * line current, 1.0 pu, and the other two 0.5 pu, which the wye primary lines carry unchanged.
 * Delta secondaries are ungrounded, so an L-G fault draws no fault current.
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
 * secondary fault current and the transformer's voltages (REFERENCE §1.8 table, §1.7 scaling).
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
 * Sheet shift factors for a connection (REFERENCE §1.8): the device-coordination multiplier for a
 * secondary L-L fault (1/0.866 = 1.1547 for Δ–Yg, else 1) and the withstand-curve multiplier
 * (0.58 Δ–Yg for L-G, 0.87 Δ–Δ for L-L, else 1; rounded values as the trade uses them).
 *
 * @example shiftFactorsOf('delta-wye') // { lineToLineDeviceShift: 1.1547, withstandShift: 0.58 }
 */
export function shiftFactorsOf(connection: Connection): { lineToLineDeviceShift: number; withstandShift: number } {
  return {
    lineToLineDeviceShift: connection === 'delta-wye' ? 1 / HALF_ROOT3 : 1,
    withstandShift: connection === 'delta-wye' ? 0.58 : connection === 'delta-delta' ? 0.87 : 1,
  };
}

/** Whether the secondary of a connection is a solidly grounded wye (it can carry ground-fault current). @example isGroundedSecondary('delta-delta') // false */
export function isGroundedSecondary(connection: Connection): boolean {
  return connection === 'delta-wye' || connection === 'wye-wye';
}
