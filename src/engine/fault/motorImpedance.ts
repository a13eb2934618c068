import type { Motor } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { impedanceOfMagnitude, type Impedance } from './impedance.ts';
import { motorFullLoadAmps } from './motorFullLoad.ts';
import { impedanceStep, num, withLazySteps } from './workSteps.ts';

/** X/R assumed for a motor with none given: LV induction motor groups run a few to ~10 (common practice). */
export const DEFAULT_MOTOR_XR = 6;

/** How a motor is rated, for work steps: "150 hp", "75 kVA" or "nameplate 96 A". @example motorRatingText({ hp: 150 }) // "150 hp" */
export function motorRatingText(motor: Pick<Motor, 'hp' | 'rating' | 'fullLoadAmps'>): string {
  if (motor.fullLoadAmps !== undefined) return `nameplate ${num(motor.fullLoadAmps)} A`;
  if (motor.rating !== undefined) return `${num(motor.rating / 1000)} kVA`;
  return `${num(motor.hp ?? 0)} hp`;
}

/**
 * A motor as a first-cycle source at its bus (IEEE 141 / IEEE 399 first-cycle network):
 * `|Z_M| = V / (√3 · k · I_FL)`, with `k` = `contribution` (default 4 × FLA, common practice) and the
 * motor X/R or `DEFAULT_MOTOR_XR`.
 *
 * @example motorImpedanceOf({ id: 'M1', hp: 150, contribution: 4 }, 480).amps // 4 × FLA
 */
export function motorImpedanceOf(
  motor: Pick<Motor, 'id' | 'hp' | 'rating' | 'fullLoadAmps' | 'contribution' | 'xr'>,
  volts: number,
): { z: Impedance; amps: number; fullLoadAmps: number; readonly steps: WorkStep[] } {
  const fla = motorFullLoadAmps(motor, volts);
  const amps = motor.contribution * fla;
  const xr = motor.xr ?? DEFAULT_MOTOR_XR;
  const magnitude = volts / (Math.sqrt(3) * amps);
  const z = impedanceOfMagnitude(magnitude, xr);
  return withLazySteps({ z, amps, fullLoadAmps: fla }, () => {
    const steps: WorkStep[] = [
      {
        label: `${motor.id} (${motorRatingText(motor)}) first-cycle contribution at ${num(volts)} V`,
        formula: 'I_M = k · I_FL',
        substituted: `I_M = ${num(motor.contribution)} × ${num(fla)} A (I_FL for ${motorRatingText(motor)})`,
        value: amps,
        unit: 'A',
        source: 'contribution multiple common practice (IEEE 141 first-cycle motor data)',
      },
      impedanceStep(
        `${motor.id} first-cycle impedance`,
        '|Z_M| = V / (√3 · I_M)',
        `|Z_M| = ${num(volts)} V / (1.7320508 × ${num(amps)} A) = ${num(magnitude)} Ω; X/R ${num(xr)}${motor.xr === undefined ? ' (default, common practice)' : ''}`,
        z,
        'Ω',
        'motor as a parallel source (IEEE 399 short-circuit chapter)',
      ),
    ];
    return steps;
  });
}
