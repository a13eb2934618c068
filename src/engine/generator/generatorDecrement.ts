import { InputError, expectedGot } from '../errors.ts';
import { magnitudeOf, type Impedance } from '../fault/impedance.ts';
import { significant } from '../quantity/format.ts';
import { requireNumberAbove } from '../withstand/inputs.ts';
import { generatorPath, ratedAmpsOf, requireGeneratorRating, type GeneratorRating } from './rating.ts';

/** Options of `generatorDecrement`. */
export interface GeneratorDecrementOptions {
  /**
   * Impedance from the generator terminals to the fault, in per unit on the generator's own rating and voltage
   * (`Z_pu = Z_Ω · S / V²`, see `baseOhmsOf`). Its reactance adds to X″d, X′d and Xd and its resistance to each.
   * @default { r: 0, x: 0 } (a fault at the terminals); r, x ≥ 0
   */
  external?: Impedance;
  /**
   * Internal voltage behind the reactances (pu). 1 is the machine at no load and rated voltage; a loaded
   * machine runs somewhat higher (about 1.05 to 1.1, common practice).
   * @default 1; range > 0
   */
  internalVoltage?: number;
  /** System frequency (Hz); the sampled curve starts at half a cycle. @default 60; range > 0 */
  frequency?: number;
  /** Time of the last sampled point (s). @default 100; range > half a cycle */
  longestSeconds?: number;
  /** Sampled points per decade of time. @default 20; a whole number ≥ 2 */
  pointsPerDecade?: number;
}

/**
 * The symmetrical rms three-phase fault current of a generator against time (the "decrement"), as a function
 * and as a sampled curve for drawing. Currents in A at the generator voltage; times in s.
 */
export interface GeneratorDecrement {
  generatorId: string;
  /** Voltage the currents are given at (V): the generator's rated voltage. */
  volts: number;
  /** Rated current (A). */
  ratedAmps: number;
  /** Current at t = 0, E / |Z″| (A): the subtransient current. */
  initialAmps: number;
  /** Current the decrement settles to (A): E / |Zd|, or the excitation support's floor where that is higher. */
  sustainedAmps: number;
  /** True when the excitation support sets `sustainedAmps`. */
  supported: boolean;
  /** Current (A) at `seconds` ≥ 0 after the fault; throws a `RangeError` for a negative or NaN time. */
  ampsAt(seconds: number): number;
  /**
   * The most the current may be at `seconds` (A): the same, with the support's floor not held at the
   * start. Where that floor is above the start (far behind a cable or a transformer) the voltage
   * regulator may raise the current toward it over its response time; elsewhere it is `ampsAt`.
   */
  upperAmpsAt(seconds: number): number;
  /** What `upperAmpsAt` settles to (A). */
  upperSustainedAmps: number;
  /** The same in per unit of rated current. */
  perUnitAt(seconds: number): number;
  /** Sampled curve, log-spaced from half a cycle to `longestSeconds`: `seconds[i]`, `amps[i]`. */
  seconds: Float64Array;
  amps: Float64Array;
  /** Model, basis and choices, for the work panel and the report. */
  notes: string[];
}

/**
 * A generator's three-phase short-circuit decrement, from the exponential form of standard machine theory
 * (IEEE Std 551 "Violet Book", synchronous generator short-circuit current; IEC 60909-0 names the same
 * reactances), with E the internal voltage in pu:
 *
 * `i(t) = E · [(1/X″d − 1/X′d) · e^(−t/T″d) + (1/X′d − 1/Xd) · e^(−t/T′d) + 1/Xd]` per unit of rated current.
 *
 * The machine's X/R is that of X″d (`X″d / Ra`): the armature resistance is `Ra = X″d · cos θ`,
 * `tan θ = X/R`, as the fault levels split X″d, and each circuit is `Z = Ra + j√(X² − Ra²)`, so its
 * magnitude at the terminals is X. Behind an external impedance `Ze = Re + jXe` each `1/X` becomes
 * `1/|Z + Ze|`, with the time constants unchanged (an approximation, common practice: strictly they
 * shorten toward the open-circuit values as Xe grows); the current starts at the bus's subtransient
 * fault current from the machine. With excitation support `k` (the sustained multiple at
 * the terminals) the current never falls below a floor (model: `max(decaying term, floor)`): the field
 * at ceiling holds an internal voltage of `k · Xd`, which drives `k · Xd / |Zd + Ze|` through the
 * synchronous reactance and the external impedance, the same sum as the `E/Xd` term (IEEE Std 551-2006,
 * synchronous generator decrement, from memory); and no more than rated terminal voltage drives through
 * `Ze`, `1 / |Ze|` (a simplification: the voltage regulator holds the terminals no higher than rated).
 * The floor is the smaller of the two. It can exceed the start `E / |Z″ + Ze|` (far behind a cable or a
 * transformer, where with E = 1 it always does if the field's bound allows; or with a support multiple
 * above 1/X″d): the regulator then raises the current toward it over its response time, which this
 * model does not follow. So the decrement is read two ways: `ampsAt` holds the floor at most at the
 * start (the downstream device's clearing is read on it, the later reading), `upperAmpsAt` takes the
 * whole floor from the start (the upstream device's operation is read on it, the earlier reading).
 * Both never rise. The manufacturer's decrement curve governs.
 *
 * @example generatorDecrement(g500kVA, {}).perUnitAt(0) // 1 / 0.12 = 8.3333
 */
export function generatorDecrement(gen: GeneratorRating, options: GeneratorDecrementOptions = {}): GeneratorDecrement {
  const machine = requireGeneratorRating(gen);
  const { external = { r: 0, x: 0 }, internalVoltage = 1, frequency = 60, pointsPerDecade = 20 } = options;
  const e = requireNumberAbove('options.internalVoltage', internalVoltage, 0, 'a voltage in pu');
  requireNumberAbove('options.frequency', frequency, 0, 'a frequency in Hz');
  const halfCycle = 1 / (2 * frequency);
  const { longestSeconds = 100 } = options;
  requireNumberAbove('options.longestSeconds', longestSeconds, halfCycle, 'a time in s');
  if (!Number.isInteger(pointsPerDecade) || pointsPerDecade < 2)
    throw new InputError('options.pointsPerDecade', expectedGot('a whole number of at least 2', pointsPerDecade));
  const re = requireNumberAbove('options.external.r', external?.r, 0, 'a resistance in pu', true);
  const xe = requireNumberAbove('options.external.x', external?.x, 0, 'a reactance in pu', true);

  // The three admittance magnitudes of the subtransient, transient and steady-state circuits: one
  // armature resistance, from X″d's X/R, and each circuit's magnitude its reactance at the terminals.
  const ra = machine.xdSubtransient / Math.hypot(1, machine.xr);
  const behind = (x: number) => 1 / Math.hypot(ra + re, Math.sqrt(x * x - ra * ra) + xe);
  const ySubtransient = behind(machine.xdSubtransient);
  const yTransient = behind(machine.xdTransient);
  const ySynchronous = behind(machine.xd);
  const externalMagnitude = magnitudeOf({ r: re, x: xe });
  // At the terminals both bounds give k; behind Ze the ceiling voltage k·Xd also drops across Xd.
  const upperFloor =
    machine.sustained === undefined
      ? 0
      : Math.min(machine.sustained * machine.xd * ySynchronous, 1 / externalMagnitude);
  // Held at most at the start: the regulator's slower rise toward the whole floor is not followed.
  const floor = Math.min(upperFloor, e * ySubtransient);

  const { tdSubtransient, tdTransient } = machine;
  const decayingAt = (seconds: number): number => {
    if (!(seconds >= 0)) throw new RangeError(`seconds: expected a time of at least 0, got "${seconds}"`);
    return (
      e *
      ((ySubtransient - yTransient) * Math.exp(-seconds / tdSubtransient) +
        (yTransient - ySynchronous) * Math.exp(-seconds / tdTransient) +
        ySynchronous)
    );
  };
  const perUnitAt = (seconds: number) => Math.max(decayingAt(seconds), floor);
  const ratedAmps = ratedAmpsOf(machine);
  const ampsAt = (seconds: number) => perUnitAt(seconds) * ratedAmps;
  const upperAmpsAt = (seconds: number) => Math.max(decayingAt(seconds), upperFloor) * ratedAmps;

  // Log-spaced samples, half a cycle to the longest time, both ends included.
  const decades = Math.log10(longestSeconds / halfCycle);
  const count = Math.max(2, Math.ceil(decades * pointsPerDecade) + 1);
  const seconds = new Float64Array(count);
  for (let i = 0; i < count; i++) seconds[i] = halfCycle * 10 ** ((decades * i) / (count - 1));
  seconds[count - 1] = longestSeconds;
  const amps = seconds.map(ampsAt);

  const steady = e * ySynchronous;
  const supported = floor > steady;
  const path = generatorPath(machine);
  const externalText =
    externalMagnitude === 0
      ? 'fault at the generator terminals'
      : `fault behind Ze = ${significant(re, 5)} + j${significant(xe, 5)} pu on the generator base (time constants unchanged, common practice)`;
  return {
    generatorId: machine.id,
    volts: machine.voltage,
    ratedAmps,
    initialAmps: ampsAt(0),
    sustainedAmps: Math.max(steady, floor) * ratedAmps,
    supported,
    ampsAt,
    upperAmpsAt,
    upperSustainedAmps: Math.max(steady, upperFloor) * ratedAmps,
    perUnitAt,
    seconds,
    amps,
    notes: [
      'i(t) = E·[(1/X″d − 1/X′d)·e^(−t/T″d) + (1/X′d − 1/Xd)·e^(−t/T′d) + 1/Xd] pu, symmetrical rms (IEEE Std 551; standard machine theory)',
      `${path}: X″d ${machine.xdSubtransient}, X′d ${machine.xdTransient}, Xd ${machine.xd} pu, X/R ${significant(machine.xr, 4)} (Ra = ${significant(ra, 4)} pu); T″d ${machine.tdSubtransient} s, T′d ${machine.tdTransient} s; E = ${significant(e, 4)} pu` +
        (options.internalVoltage === undefined ? ' (no load, rated voltage)' : ''),
      externalText,
      machine.sustained === undefined
        ? `no excitation support: the current decays toward E/Xd = ${significant(steady * ratedAmps, 5)} A`
        : `excitation support holds at least ${significant(floor * ratedAmps, 5)} A (${significant(floor, 4)} × rated; model max(decaying term, support))` +
          (upperFloor > floor
            ? `, held at the start; the regulator may raise it toward ${significant(upperFloor * ratedAmps, 5)} A, on which the upstream device is read`
            : ''),
      'dc offset not included; the manufacturer’s decrement curve governs',
    ],
  };
}
