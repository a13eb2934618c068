import type { Source } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { impedanceOfMagnitude, type Impedance } from './impedance.ts';
import { impedanceStep, num, withLazySteps } from './workSteps.ts';

/** One available-fault figure of a utility source, as parsed from the study. */
export type SourceLevel = Extract<Source, { kind: 'utility' }>['max'];

/**
 * The utility's three-phase short-circuit power in VA: the given MVA, or `S = √3 · V · I` when the
 * figure is a current at the source bus voltage `volts` (IEEE 141 / IEEE 399).
 *
 * @example sourcePowerOf({ available: { amps: 11574.8 } }, 12470) // ≈ 250e6 VA
 */
export function sourcePowerOf(level: Pick<SourceLevel, 'available'>, volts: number): number {
  return level.available.va ?? Math.sqrt(3) * volts * level.available.amps!;
}

/**
 * The utility impedance in ohms at `volts` (ohmic method, IEEE 141 / IEEE 399): `|Z_U| = V² / S_sc`, split by
 * the source X/R (all reactance when X/R is omitted), with the steps that produce it.
 *
 * @example sourceImpedanceOf({ available: { va: 250e6 }, xr: 12 }, 480).z // { r: 7.6581e-5, x: 9.1897e-4 }
 */
export function sourceImpedanceOf(
  level: SourceLevel,
  volts: number,
  label = 'utility',
): { z: Impedance; readonly steps: WorkStep[] } {
  const power = sourcePowerOf(level, volts);
  const magnitude = (volts * volts) / power;
  const z = impedanceOfMagnitude(magnitude, level.xr);
  return withLazySteps({ z }, () => {
    const steps: WorkStep[] = [];
    if (level.available.amps !== undefined)
      steps.push({
        label: `${label} short-circuit power from its fault current`,
        formula: 'S_sc = √3 · V · I_sc',
        substituted: `S_sc = 1.7320508 × ${num(volts)} V × ${num(level.available.amps)} A`,
        value: sourcePowerOf(level, volts),
        unit: 'VA',
        source: 'S = √3 · V · I (IEEE 141)',
      });
    const split =
      level.xr === undefined
        ? 'all reactance (no X/R given)'
        : `R = |Z| / √(1 + ${num(level.xr)}²), X = ${num(level.xr)} · R`;
    steps.push(
      impedanceStep(
        `${label} impedance at ${num(volts)} V`,
        '|Z_U| = V² / S_sc',
        `|Z_U| = (${num(volts)} V)² / ${num(power)} VA = ${num(magnitude)} Ω; ${split}`,
        z,
        'Ω',
        'ohmic method (IEEE 141 / IEEE 399)',
      ),
    );
    return steps;
  });
}
