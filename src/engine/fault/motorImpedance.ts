import type { Motor } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { impedanceOfMagnitude, type Impedance } from './impedance.ts';
import { motorFullLoadAmps } from './motorFullLoad.ts';
import { impedanceStep, num, withLazySteps } from './workSteps.ts';

/** X/R assumed for a motor with none given: LV induction motor groups run a few to ~10 (REFERENCE §1.5, common practice). */
export const DEFAULT_MOTOR_XR = 6;

/**
 * A motor as a first-cycle source at its bus (REFERENCE §1.5): `|Z_M| = V / (√3 · k · I_FL)`, with
 * `k` = `contribution` (default 4 × FLA, common practice) and the motor X/R or `DEFAULT_MOTOR_XR`.
 *
 * @example motorImpedanceOf({ id: 'M1', hp: 150, contribution: 4 }, 480).amps // 4 × 180.42 = 721.69 A
 */
export function motorImpedanceOf(
  motor: Pick<Motor, 'id' | 'hp' | 'rating' | 'fullLoadAmps' | 'contribution' | 'xr'>,
  volts: number,
): { z: Impedance; amps: number; readonly steps: WorkStep[] } {
  const fla = motorFullLoadAmps(motor, volts);
  const amps = motor.contribution * fla;
  const xr = motor.xr ?? DEFAULT_MOTOR_XR;
  const magnitude = volts / (Math.sqrt(3) * amps);
  const z = impedanceOfMagnitude(magnitude, xr);
  return withLazySteps({ z, amps }, () => {
    const flaText =
      motor.fullLoadAmps !== undefined
        ? 'nameplate'
        : motor.rating !== undefined
          ? 'S / (√3 · V)'
          : '1 hp ≈ 1 kVA, common practice';
    const steps: WorkStep[] = [
      {
        label: `${motor.id} full-load current (${flaText})`,
        formula: 'I_FL',
        substituted: `I_FL(${motor.id})`,
        value: fla,
        unit: 'A',
      },
      impedanceStep(
        `${motor.id} first-cycle impedance`,
        '|Z_M| = V / (√3 · k · I_FL)',
        `|Z_M| = ${num(volts)} / (1.7320508 × ${num(motor.contribution)} × ${num(fla)}) = ${num(magnitude)} Ω; X/R ${num(xr)}${motor.xr === undefined ? ' (default, common practice)' : ''}`,
        z,
        'Ω',
        'REFERENCE §1.5, contribution multiple common practice',
      ),
    ];
    return steps;
  });
}
