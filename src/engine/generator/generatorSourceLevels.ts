import { impedanceOfMagnitude, type Impedance } from '../fault/impedance.ts';
import { impedanceStep, num, withLazyWork } from '../fault/workSteps.ts';
import type { WorkStep } from '../work.ts';
import {
  DEFAULT_GENERATOR_XR,
  GENERATOR_X0_FRACTION,
  ratedAmpsOf,
  requireGeneratorRating,
  type GeneratorRating,
} from './rating.ts';

/** One fault figure of a generator as an equivalent source at its bus. */
export interface GeneratorLevel {
  /** Three-phase short-circuit power `√3 · V · I` (VA). */
  va: number;
  /** Three-phase fault current at the generator voltage (A). */
  amps: number;
}

/**
 * A generator as the radial fault engine's equivalent source at the generator bus: the maximum (subtransient)
 * and minimum (sustained) three-phase levels, the X/R, and the zero-sequence ratio for line-to-ground faults.
 */
export interface GeneratorSourceLevels {
  generatorId: string;
  /** Rated voltage (V): the voltage the levels are given at. */
  volts: number;
  /** Rated current (A). */
  ratedAmps: number;
  /** Subtransient level, `E / X″d` with E = 1 pu. */
  maximum: GeneratorLevel;
  /** X/R of the maximum level (X″d / Ra). */
  xr: number;
  /** Equivalent impedance of the maximum level at `volts` (Ω): `|Z| = V² / S″`, split by `xr`. */
  z: Impedance;
  /** Sustained level: the excitation support, or `E / Xd` without it. */
  minimum: GeneratorLevel;
  /** What sets the minimum: `'support'` (the `sustained` multiple) or `'synchronous'` (E / Xd). */
  minimumBasis: 'support' | 'synchronous';
  /** Zero-sequence reactance X0 (pu), given or `GENERATOR_X0_FRACTION × X″d`. */
  x0: number;
  /** `X0 / X1` with X1 = X″d: the ratio the line-to-ground calculation takes. */
  zeroSequenceRatio: number;
  /** The steps, each naming its source; written when first read. */
  readonly work: WorkStep[];
}

/**
 * A generator's fault levels at its own bus, at no load and rated voltage (E = 1 pu):
 * maximum `S″ = √3 · V · I_r / X″d`, minimum `√3 · V · k · I_r` with the support multiple k, or
 * `√3 · V · I_r / Xd` with none; `X0/X1 = X0 / X″d`.
 *
 * @example generatorSourceLevels(g500kVA).maximum.va // 500e3 / 0.12 = 4.1667e6 VA
 */
export function generatorSourceLevels(gen: GeneratorRating): GeneratorSourceLevels {
  const machine = requireGeneratorRating(gen);
  const volts = machine.voltage;
  const ratedAmps = ratedAmpsOf(machine);
  const subtransientAmps = ratedAmps / machine.xdSubtransient;
  const maximum = { va: Math.sqrt(3) * volts * subtransientAmps, amps: subtransientAmps };
  const synchronousAmps = ratedAmps / machine.xd;
  const supportAmps = machine.sustained === undefined ? 0 : machine.sustained * ratedAmps;
  const minimumBasis = supportAmps > synchronousAmps ? 'support' : 'synchronous';
  // No more than the fault starts at: the minimum is never above the maximum (a support multiple above
  // 1/X″d is reached, if at all, only as the regulator raises the current over its response time).
  const minimumAmps = Math.min(Math.max(supportAmps, synchronousAmps), subtransientAmps);
  const minimum = { va: Math.sqrt(3) * volts * minimumAmps, amps: minimumAmps };
  const magnitude = (volts * volts) / maximum.va;
  const z = impedanceOfMagnitude(magnitude, machine.xr);
  const zeroSequenceRatio = machine.x0 / machine.xdSubtransient;

  return withLazyWork(
    {
      generatorId: machine.id,
      volts,
      ratedAmps,
      maximum,
      xr: machine.xr,
      z,
      minimum,
      minimumBasis,
      x0: machine.x0,
      zeroSequenceRatio,
    } satisfies Omit<GeneratorSourceLevels, 'work'>,
    () => {
      const rated = `${num(machine.rating)} VA`;
      const steps: WorkStep[] = [
        {
          label: `${machine.id} rated current`,
          formula: 'I_r = S / (√3 · V)',
          substituted: `I_r = ${rated} / (1.7320508 × ${num(volts)} V)`,
          value: ratedAmps,
          unit: 'A',
          source: 'textbook identity',
        },
        {
          label: `${machine.id} subtransient fault current (no load, E = 1 pu)`,
          formula: 'I″ = E · I_r / X″d',
          substituted: `I″ = 1 × ${num(ratedAmps)} A / ${num(machine.xdSubtransient)}`,
          value: subtransientAmps,
          unit: 'A',
          source: 'IEEE Std 551 generator short-circuit current; IEC 60909-0 uses X″d the same way',
        },
        {
          label: `${machine.id} maximum short-circuit power`,
          formula: 'S″ = √3 · V · I″',
          substituted: `S″ = 1.7320508 × ${num(volts)} V × ${num(subtransientAmps)} A`,
          value: maximum.va,
          unit: 'VA',
          source: 'S = √3 · V · I (IEEE 141)',
        },
        impedanceStep(
          `${machine.id} equivalent source impedance at ${num(volts)} V`,
          '|Z″| = V² / S″',
          `|Z″| = (${num(volts)} V)² / ${num(maximum.va)} VA = ${num(magnitude)} Ω; X/R ${num(machine.xr)}` +
            (gen.xr === undefined ? ` (default ${DEFAULT_GENERATOR_XR}, common practice)` : ''),
          z,
          'Ω',
          'ohmic method (IEEE 141 / IEEE 399)',
        ),
        minimumBasis === 'support'
          ? {
              label: `${machine.id} sustained fault current with excitation support`,
              formula: supportAmps > subtransientAmps ? 'I_sus = min(k · I_r, I″)' : 'I_sus = k · I_r',
              substituted:
                supportAmps > subtransientAmps
                  ? `I_sus = min(${num(machine.sustained!)} × ${num(ratedAmps)} A, ${num(subtransientAmps)} A)`
                  : `I_sus = ${num(machine.sustained!)} × ${num(ratedAmps)} A`,
              value: minimumAmps,
              unit: 'A',
              source: 'excitation-support multiple as given (manufacturer’s data)',
            }
          : {
              label: `${machine.id} sustained fault current without excitation support`,
              formula: 'I_sus = E · I_r / Xd',
              substituted: `I_sus = 1 × ${num(ratedAmps)} A / ${num(machine.xd)}`,
              value: minimumAmps,
              unit: 'A',
              source: 'steady-state term of the decrement (IEEE Std 551; standard machine theory)',
            },
        {
          label: `${machine.id} minimum short-circuit power`,
          formula: 'S_min = √3 · V · I_sus',
          substituted: `S_min = 1.7320508 × ${num(volts)} V × ${num(minimumAmps)} A`,
          value: minimum.va,
          unit: 'VA',
          source: 'S = √3 · V · I (IEEE 141)',
        },
        {
          label: `${machine.id} zero-sequence to positive-sequence ratio`,
          formula: 'X0/X1 = X0 / X″d',
          substituted:
            gen.x0 === undefined
              ? `X0/X1 = (${GENERATOR_X0_FRACTION} × ${num(machine.xdSubtransient)}) / ${num(machine.xdSubtransient)}`
              : `X0/X1 = ${num(machine.x0)} / ${num(machine.xdSubtransient)}`,
          value: zeroSequenceRatio,
          unit: '',
          source:
            gen.x0 === undefined
              ? `X0 = ${GENERATOR_X0_FRACTION} × X″d when not given (common practice, from memory)`
              : 'X0 as given',
        },
      ];
      return steps;
    },
  );
}
