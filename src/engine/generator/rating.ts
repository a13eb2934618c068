import { InputError, expectedGot } from '../errors.ts';
import { requireNumberAbove } from '../withstand/inputs.ts';

/**
 * A standby or emergency generator's nameplate and machine data (NFPA 70 Articles 700, 701 and 708 sources).
 * Reactances are per unit on the machine's own rating; times in seconds; `rating` in VA, `voltage` in V.
 *
 * @example { id: 'G1', rating: 500e3, voltage: 480, powerFactor: 0.8, xdSubtransient: 0.12, xdTransient: 0.2,
 *   xd: 2.0, tdSubtransient: 0.015, tdTransient: 0.4 }
 */
export interface GeneratorRating {
  id: string;
  name?: string;
  /** Rated apparent power (VA, i.e. kVA × 1000); > 0. */
  rating: number;
  /** Rated line-to-line voltage (V); > 0. */
  voltage: number;
  /** Rated power factor, e.g. 0.8; in (0, 1]. */
  powerFactor: number;
  /** Direct-axis subtransient reactance X″d (pu on rating); > 0 and at most X′d. */
  xdSubtransient: number;
  /** Direct-axis transient reactance X′d (pu); at least X″d and at most Xd. */
  xdTransient: number;
  /** Direct-axis synchronous reactance Xd (pu); at least X′d. */
  xd: number;
  /** Zero-sequence reactance X0 (pu). @default GENERATOR_X0_FRACTION × X″d */
  x0?: number;
  /** Direct-axis subtransient short-circuit time constant T″d (s); > 0 and at most T′d. */
  tdSubtransient: number;
  /** Direct-axis transient short-circuit time constant T′d (s); > 0. */
  tdTransient: number;
  /** X/R at the subtransient reactance (X″d / Ra). @default DEFAULT_GENERATOR_XR */
  xr?: number;
  /**
   * Excitation support (a permanent-magnet pilot exciter or series boost): the sustained short-circuit current
   * as a multiple of rated current, e.g. 3. Omitted: no support, the current decays toward E / Xd.
   */
  sustained?: number;
}

/** X/R of a generator with none given (X″d / Ra): 20, common practice for small standby machines. */
export const DEFAULT_GENERATOR_XR = 20;

/**
 * X0 as a fraction of X″d when X0 is not given: 0.5, common practice (from memory: salient-pole standby
 * machines run about 0.3 to 0.7 of X″d; the manufacturer's X0 governs).
 */
export const GENERATOR_X0_FRACTION = 0.5;

/**
 * Rated current `I_r = S / (√3 · V)` in A (textbook identity).
 * @example ratedAmpsOf({ rating: 500e3, voltage: 480 }) // 601.4065
 */
export function ratedAmpsOf(gen: Pick<GeneratorRating, 'rating' | 'voltage'>): number {
  return gen.rating / (Math.sqrt(3) * gen.voltage);
}

/**
 * Base impedance `Z_base = V² / S` in Ω, to turn ohms at the generator voltage into per unit on its rating.
 * @example baseOhmsOf({ rating: 500e3, voltage: 480 }) // 0.4608
 */
export function baseOhmsOf(gen: Pick<GeneratorRating, 'rating' | 'voltage'>): number {
  return (gen.voltage * gen.voltage) / gen.rating;
}

/** `generators.<id>`, the path prefix of a generator's fields in messages. */
export function generatorPath(gen: Pick<GeneratorRating, 'id'>): string {
  return `generators.${gen.id}`;
}

/**
 * Checks every number of a rating and returns it with the defaults filled in, or throws an `InputError`
 * naming the field: `generators.G1.xdTransient: expected X′d of at least X″d (0.12), got "0.1"`.
 *
 * @example requireGeneratorRating(gen).xr // 20 when omitted
 */
export function requireGeneratorRating(
  gen: GeneratorRating,
): Required<Omit<GeneratorRating, 'name' | 'sustained'>> & Pick<GeneratorRating, 'name' | 'sustained'> {
  if (gen === null || typeof gen !== 'object') throw new InputError('generators', expectedGot('a generator', gen));
  if (typeof gen.id !== 'string' || gen.id === '')
    throw new InputError('generators[].id', expectedGot('a non-empty id', gen.id));
  const path = generatorPath(gen);
  const field = (name: keyof GeneratorRating, what: string, min = 0) =>
    requireNumberAbove(`${path}.${name}`, gen[name], min, what);
  const rating = field('rating', 'a rating in VA');
  const voltage = field('voltage', 'a voltage in V');
  const powerFactor = field('powerFactor', 'a power factor');
  if (powerFactor > 1)
    throw new InputError(`${path}.powerFactor`, expectedGot('a power factor of at most 1', powerFactor));
  const xdSubtransient = field('xdSubtransient', 'a reactance in pu');
  const xdTransient = field('xdTransient', 'a reactance in pu');
  const xd = field('xd', 'a reactance in pu');
  // The decrement terms (1/X″d − 1/X′d) and (1/X′d − 1/Xd) must not be negative.
  if (xdTransient < xdSubtransient)
    throw new InputError(`${path}.xdTransient`, expectedGot(`X′d of at least X″d (${xdSubtransient})`, xdTransient));
  if (xd < xdTransient) throw new InputError(`${path}.xd`, expectedGot(`Xd of at least X′d (${xdTransient})`, xd));
  const tdSubtransient = field('tdSubtransient', 'a time in s');
  const tdTransient = field('tdTransient', 'a time in s');
  if (tdSubtransient > tdTransient)
    throw new InputError(
      `${path}.tdSubtransient`,
      expectedGot(`T″d of at most T′d (${tdTransient} s)`, tdSubtransient),
    );
  const x0 = gen.x0 === undefined ? GENERATOR_X0_FRACTION * xdSubtransient : field('x0', 'a reactance in pu');
  const xr = gen.xr === undefined ? DEFAULT_GENERATOR_XR : field('xr', 'an X/R ratio');
  const sustained = gen.sustained === undefined ? undefined : field('sustained', 'a multiple of rated current');
  return {
    id: gen.id,
    ...(gen.name === undefined ? {} : { name: gen.name }),
    rating,
    voltage,
    powerFactor,
    xdSubtransient,
    xdTransient,
    xd,
    x0,
    tdSubtransient,
    tdTransient,
    xr,
    ...(sustained === undefined ? {} : { sustained }),
  };
}
