import type { Transformer } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { impedanceOfMagnitude, type Impedance } from './impedance.ts';
import { impedanceStep, num, withLazySteps } from './workSteps.ts';

/** Fraction of nameplate %Z used for maximum duty when `impedanceTolerance` is on (IEEE C57.12.00 −7.5 % impedance tolerance; verify against the edition you work to). */
export const IMPEDANCE_TOLERANCE = 0.925;

/** The transformer fields a fault calculation needs. */
export type TransformerData = Pick<Transformer, 'id' | 'rating' | 'primary' | 'secondary' | 'impedance' | 'phases'> &
  Partial<Pick<Transformer, 'xr' | 'impedanceTolerance'>>;

/**
 * Full-load current of a winding in amps: `S / (√3 · V)` three-phase, `S / V` single-phase
 * (textbook identity, IEEE 141).
 *
 * @example fullLoadAmpsOf(1.5e6, 480, 3) // 1804.22
 */
export function fullLoadAmpsOf(va: number, volts: number, phases: 1 | 3 = 3): number {
  return phases === 3 ? va / (Math.sqrt(3) * volts) : va / volts;
}

/**
 * The per-unit impedance used: nameplate %Z / 100, times 0.925 when `toleranced` (maximum duty with
 * `impedanceTolerance`, common practice).
 *
 * @example effectivePerUnit({ impedance: 5.75, impedanceTolerance: true }, true) // 0.0531875
 */
export function effectivePerUnit(t: Pick<TransformerData, 'impedance' | 'impedanceTolerance'>, toleranced: boolean) {
  return (t.impedance / 100) * (toleranced && t.impedanceTolerance ? IMPEDANCE_TOLERANCE : 1);
}

/**
 * The transformer's impedance in ohms referred to its secondary: `|Z_T| = Z_pu · V_sec² / S_T`, split
 * by its X/R (all reactance when omitted). This is the per-unit method's
 * `Z_pu · (S_base / S_T) · (kV_rated / kV_base)²` expressed in ohms (IEEE 141 / IEEE 399).
 *
 * @example transformerImpedanceOf(t1500, { toleranced: false }).z // { r: 0.0014519, x: 0.0087115 } Ω at 480 V
 */
export function transformerImpedanceOf(
  t: TransformerData,
  { toleranced = false }: { toleranced?: boolean } = {},
): { z: Impedance; perUnit: number; readonly steps: WorkStep[] } {
  const perUnit = effectivePerUnit(t, toleranced);
  const usedTolerance = perUnit !== t.impedance / 100;
  const base = (t.secondary * t.secondary) / t.rating;
  const magnitude = perUnit * base;
  const z = impedanceOfMagnitude(magnitude, t.xr);
  return withLazySteps({ z, perUnit }, () => {
    const steps: WorkStep[] = [];
    if (usedTolerance)
      steps.push({
        label: `${t.id} impedance with the −7.5 % test tolerance`,
        formula: 'Z_pu = 0.925 · %Z / 100',
        substituted: `Z_pu = 0.925 × ${num(t.impedance)} % / 100`,
        value: perUnit,
        unit: 'pu',
        source:
          'IEEE C57.12.00 −7.5 % impedance tolerance (verify against the edition you work to); applied for maximum duty, common practice',
      });
    const split = t.xr === undefined ? 'all reactance (no X/R given)' : `X/R ${num(t.xr)}`;
    steps.push(
      impedanceStep(
        `${t.id} impedance referred to ${num(t.secondary)} V`,
        '|Z_T| = Z_pu · V_sec² / S_T',
        `|Z_T| = ${num(perUnit)} pu × (${num(t.secondary)} V)² / ${num(t.rating)} VA = ${num(magnitude)} Ω; ${split}`,
        z,
        'Ω',
        'per-unit method (IEEE 141 / IEEE 399)',
      ),
    );
    return steps;
  });
}
