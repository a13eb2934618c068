import { significant } from '../quantity/format.ts';
import { requireNumberAbove } from './inputs.ts';
import type { WithstandCurve } from './withstand.ts';

/** Options of `scaleWithstand`. */
export interface ScaleWithstandOptions {
  /** The voltage base to draw the curve on (V): a current I at the curve's `volts` moves to `I · volts / toVolts`. */
  toVolts: number;
  /**
   * Connection factor for unbalanced faults (IEEE C37.91 / IEEE C57.109 delta–wye shift factors): 0.58 for a Δ–Yg transformer's secondary
   * L-G fault seen by the primary device, 0.87 for a Δ–Δ secondary L-L fault.
   * @default 1; range > 0
   */
  factor?: number;
}

/**
 * A withstand curve moved to another voltage base and, optionally, shifted by a connection factor,
 * so it can be compared with a device drawn on that base (voltage-ratio reflection, IEEE 242).
 *
 * @example scaleWithstand(curve480V, { toVolts: 13_800, factor: 0.58 }) // for the 13.8 kV primary device, secondary L-G fault
 */
export function scaleWithstand(curve: WithstandCurve, options: ScaleWithstandOptions): WithstandCurve {
  const toVolts = requireNumberAbove('options.toVolts', options.toVolts, 0, 'a voltage in V');
  const factor = requireNumberAbove('options.factor', options.factor ?? 1, 0, 'a connection factor');
  const ratio = (curve.volts / toVolts) * factor;
  if (ratio === 1 && toVolts === curve.volts) return curve;
  const { timeAt } = curve;
  return {
    ...curve,
    volts: toVolts,
    label: factor === 1 ? curve.label : `${curve.label} × ${significant(factor, 3)}`,
    amps: curve.amps.map((amps) => amps * ratio),
    seconds: curve.seconds.slice(),
    timeAt: (amps) => timeAt(amps / ratio),
    notes: [
      ...curve.notes,
      `drawn at ${significant(toVolts, 6)} V: currents × ${significant(curve.volts, 6)}/${significant(toVolts, 6)}` +
        (factor === 1 ? '' : ` × connection factor ${significant(factor, 3)}`),
    ],
  };
}
