import { scaleImpedance, type Impedance } from './impedance.ts';

/**
 * Moves a balanced (three-phase) current across a transformer by the inverse voltage ratio:
 * `I_to = I_from · V_from / V_to` (turns ratio). The same rule puts a current on a sheet's
 * reference voltage.
 *
 * @example reflectAmps(10000, 208, 480) // 4333.33 A
 */
export function reflectAmps(amps: number, fromVolts: number, toVolts: number): number {
  return (amps * fromVolts) / toVolts;
}

/**
 * Moves an impedance in ohms across a transformer by the square of the voltage ratio:
 * `Z_to = Z_from · (V_to / V_from)²` (per-unit method, IEEE 141 / IEEE 399).
 *
 * @example reflectImpedance({ r: 0, x: 0.622 }, 12470, 480) // { r: 0, x: 0.00092161 }
 */
export function reflectImpedance(z: Impedance, fromVolts: number, toVolts: number): Impedance {
  const ratio = toVolts / fromVolts;
  return scaleImpedance(z, ratio * ratio);
}
