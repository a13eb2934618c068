import { InputError, expectedGot } from '../errors.ts';
import { significant } from '../quantity/format.ts';
import { requireNumberAbove } from '../withstand/inputs.ts';
import type { WithstandCurve } from '../withstand/withstand.ts';
import { generatorPath, ratedAmpsOf, requireGeneratorRating, type GeneratorRating } from './rating.ts';

/**
 * The armature short-time thermal constant: `(I² − 1) · t = 37.5`, I in per unit of rated current, t in s
 * (IEEE C50.13 armature short-time thermal capability, from memory; IEC 60034-1 clause 9.3.2's 1.5 × rated
 * for 30 s, also from memory, is one point of it: (1.5² − 1) × 30 = 37.5). A tabulated form recalled for the
 * same capability (226 / 154 / 130 / 116 % at 10 / 30 / 60 / 120 s) works out nearer 41; the lower constant is
 * kept as the conservative one. The machine's own data, given as damage points, replace it.
 */
export const ARMATURE_THERMAL_CONSTANT = 37.5;

/** Times (s) the armature curve covers: 10 s to 120 s, the range the short-time capability is stated over. */
export const ARMATURE_THERMAL_SECONDS = { shortest: 10, longest: 120 } as const;

/** A withstand curve of a generator: the `WithstandCurve` shape with `kind: 'generator'`. */
export type GeneratorWithstandCurve = WithstandCurve & { kind: 'generator' };

/** One user-given damage point: current in A at the generator voltage, time in s. */
export interface DamagePoint {
  amps: number;
  seconds: number;
}

/** Options of `generatorDamageCurve`. */
export interface GeneratorDamageCurveOptions {
  /**
   * The manufacturer's damage points, in place of the armature curve: at least two, current rising and time
   * falling. Drawn and evaluated as straight lines in log-log between points.
   * @default the IEEE C50.13 armature curve
   */
  points?: DamagePoint[];
  /** Points drawn on the armature curve (it bends in log-log near rated current). @default 16; a whole number ≥ 2 */
  drawnPoints?: number;
}

/**
 * A generator's armature short-time thermal capability as a withstand curve:
 * `I = I_r · √(1 + 37.5 / t)`, drawn from 120 s (1.146 × rated) to 10 s (2.179 × rated), or the user's damage
 * points. `timeAt` is `Infinity` below the lowest current. Beyond the highest it does not hold the last
 * time, as the transformer and cable curves do, since a generator's fault current runs well past 2.18 × rated:
 * the armature curve goes on by its own formula (1.56 s at 5 × rated), and given points go on at constant
 * I²t from the last one (adiabatic heating, common practice), each shorter than a held time would be.
 *
 * @example generatorDamageCurve(g500kVA).timeAt(1.5 * 601.4065) // 30 s
 */
export function generatorDamageCurve(
  gen: GeneratorRating,
  options: GeneratorDamageCurveOptions = {},
): GeneratorWithstandCurve {
  const machine = requireGeneratorRating(gen);
  const ratedAmps = ratedAmpsOf(machine);
  const name = machine.name ?? machine.id;
  if (options.points !== undefined) return fromPoints(machine.id, name, machine.voltage, options.points);

  const { drawnPoints = 16 } = options;
  if (!Number.isInteger(drawnPoints) || drawnPoints < 2)
    throw new InputError('options.drawnPoints', expectedGot('a whole number of at least 2', drawnPoints));
  const { shortest, longest } = ARMATURE_THERMAL_SECONDS;
  const c = ARMATURE_THERMAL_CONSTANT;
  const ampsAt = (t: number) => ratedAmps * Math.sqrt(1 + c / t);
  // Time falls as current rises, so the polyline runs from the longest time to the shortest.
  const seconds = new Float64Array(drawnPoints);
  for (let i = 0; i < drawnPoints; i++) seconds[i] = longest * (shortest / longest) ** (i / (drawnPoints - 1));
  seconds[drawnPoints - 1] = shortest;
  const amps = seconds.map(ampsAt);
  const lowestAmps = amps[0];
  const highestAmps = amps[drawnPoints - 1];
  return {
    elementId: machine.id,
    kind: 'generator',
    label: `${name} armature short-time thermal capability`,
    volts: machine.voltage,
    amps,
    seconds,
    timeAt(current) {
      if (!(current >= lowestAmps)) return Infinity;
      const perUnit = current / ratedAmps;
      return Math.min(longest, c / (perUnit * perUnit - 1));
    },
    notes: [
      '(I² − 1)·t = 37.5, I in per unit of rated current, stated for 10 s ≤ t ≤ 120 s and read by the same formula at higher currents (IEEE C50.13 armature short-time thermal capability, from memory)',
      'cross-check: 1.5 × rated for 30 s (IEC 60034-1 clause 9.3.2, from memory) lies on the curve',
      `I_r = ${significant(ratedAmps, 6)} A at ${significant(machine.voltage, 6)} V; ` +
        `${significant(lowestAmps, 6)} A at ${longest} s to ${significant(highestAmps, 6)} A at ${shortest} s`,
      `${generatorPath(machine)}: the manufacturer’s damage curve governs where it differs`,
    ],
  };
}

/** A damage curve through user points (A, s): checked, ordered by current, log-log between points. */
function fromPoints(id: string, name: string, volts: number, points: DamagePoint[]): GeneratorWithstandCurve {
  if (!Array.isArray(points) || points.length < 2)
    throw new InputError('options.points', expectedGot('at least two damage points', points));
  points.forEach((p, i) => {
    requireNumberAbove(`options.points[${i}].amps`, p?.amps, 0, 'a current in A');
    requireNumberAbove(`options.points[${i}].seconds`, p?.seconds, 0, 'a time in s');
  });
  const sorted = [...points].sort((a, b) => a.amps - b.amps);
  for (let i = 1; i < sorted.length; i++) {
    if (!(sorted[i].seconds < sorted[i - 1].seconds) || sorted[i].amps === sorted[i - 1].amps)
      throw new InputError(
        'options.points',
        expectedGot(
          'times that fall as currents rise',
          sorted.map((p) => [p.amps, p.seconds]),
        ),
      );
  }
  const amps = Float64Array.from(sorted, (p) => p.amps);
  const seconds = Float64Array.from(sorted, (p) => p.seconds);
  const last = sorted.length - 1;
  return {
    elementId: id,
    kind: 'generator',
    label: `${name} damage curve (given points)`,
    volts,
    amps,
    seconds,
    timeAt(current) {
      if (!(current >= amps[0])) return Infinity;
      if (current >= amps[last]) return seconds[last] * (amps[last] / current) ** 2;
      let i = 1;
      while (amps[i] < current) i++;
      // Straight line in log-log between the bracketing points.
      const f = Math.log(current / amps[i - 1]) / Math.log(amps[i] / amps[i - 1]);
      return seconds[i - 1] * (seconds[i] / seconds[i - 1]) ** f;
    },
    notes: [
      `damage curve through ${sorted.length} given points, straight in log-log between them, constant I²t beyond the last (common practice)`,
      `${significant(amps[0], 6)} A at ${significant(seconds[0], 6)} s to ${significant(amps[last], 6)} A at ${significant(seconds[last], 6)} s, at ${significant(volts, 6)} V`,
    ],
  };
}
