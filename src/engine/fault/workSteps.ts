import { withLazyFields } from '../lazyText.ts';
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
 * Adds the property `key` to `result`, holding work steps that are written only when first read,
 * then kept. Large studies compute thousands of elements whose work is seldom opened; the numbers
 * stay eager. `build` is given `result`, so one builder can serve many results. The property is
 * enumerable, so `JSON.stringify` writes it like any other field.
 *
 * @example const bus = withLazy({ busId: 'SWBD' }, 'work', () => steps) // bus.work is built on first read
 */
export function withLazy<T extends object, K extends string>(
  result: T,
  key: K,
  build: (result: T) => WorkStep[],
): T & { readonly [P in K]: WorkStep[] } {
  return withLazyFields(result, { [key]: build }) as T & { readonly [P in K]: WorkStep[] };
}

/** `withLazy(result, 'steps', build)`: an element's impedance steps. */
export function withLazySteps<T extends object>(result: T, build: (result: T) => WorkStep[]) {
  return withLazy(result, 'steps', build);
}

/** `withLazy(result, 'work', build)`: a bus's or transformer's worked calculation. */
export function withLazyWork<T extends object>(result: T, build: (result: T) => WorkStep[]) {
  return withLazy(result, 'work', build);
}
