import type { WorkStep } from '../work.ts';
import { formatImpedance, magnitudeOf, type Impedance } from './impedance.ts';

/** A number as it is written in work steps: six significant figures, no trailing zeros. @example num(0.0575) // "0.0575" */
export function num(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(digits)));
}

/**
 * A work step whose result is a complex impedance: the substituted text ends with `r + jx` and the
 * step's value is the magnitude `|Z|`.
 *
 * @example impedanceStep('utility', 'Z = V² / S', 'Z = 480² / 250e6', { r: 0, x: 0.0009216 }, 'Ω')
 */
export function impedanceStep(
  label: string,
  formula: string,
  substituted: string,
  z: Impedance,
  unit: 'Ω' | 'pu',
  source?: string,
): WorkStep {
  return {
    label,
    formula,
    substituted: `${substituted} → ${formatImpedance(z)} ${unit}; |Z|`,
    value: magnitudeOf(z),
    unit,
    ...(source ? { source } : {}),
  };
}

/**
 * Adds a `steps` property to `result` that writes the work only when first read, then keeps it.
 * Large studies compute thousands of elements whose work is seldom opened; the numbers stay eager.
 *
 * @example const { z, steps } = withLazySteps({ z }, () => [impedanceStep(...)])
 */
export function withLazySteps<T extends object>(
  result: T,
  build: () => WorkStep[],
): T & { readonly steps: WorkStep[] } {
  let cached: WorkStep[] | undefined;
  return Object.defineProperty(result, 'steps', {
    enumerable: true,
    get: () => (cached ??= build()),
  }) as T & { readonly steps: WorkStep[] };
}

/**
 * Adds a `work` property to `result` that is written when first read, then kept (as `withLazySteps`).
 * The property is enumerable, so `JSON.stringify` writes the work like any other field.
 *
 * @example const bus = withLazyWork({ busId: 'SWBD' }, () => steps) // bus.work is built on first read
 */
export function withLazyWork<T extends object>(result: T, build: () => WorkStep[]): T & { readonly work: WorkStep[] } {
  let cached: WorkStep[] | undefined;
  return Object.defineProperty(result, 'work', {
    enumerable: true,
    get: () => (cached ??= build()),
  }) as T & { readonly work: WorkStep[] };
}
