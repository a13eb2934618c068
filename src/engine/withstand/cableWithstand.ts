import { conductorAreaCmil } from '../conductors/index.ts';
import { InputError, expectedGot } from '../errors.ts';
import { withLazyFields } from '../lazyText.ts';
import { significant } from '../quantity/format.ts';
import type { Cable } from '../study/index.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';
import type { WithstandCurve } from './withstand.ts';

/**
 * ICEA P-32-382 conductor constants: `K` in A²·s/cmil², `lambda` (λ) in °C, the
 * inferred temperature of zero resistance. Copper 0.0297 / 234, aluminium 0.0125 / 228.
 */
export const ICEA_CONDUCTOR: Readonly<Record<Cable['material'], { k: number; lambda: number; symbol: string }>> = {
  copper: { k: 0.0297, lambda: 234, symbol: 'Cu' },
  aluminium: { k: 0.0125, lambda: 228, symbol: 'Al' },
};

/**
 * Conductor temperatures by insulation, `[T1, T2]` in °C: normal operating and short-circuit limit
 * (ICEA P-32-382 as cable makers restate it for XLPE/EPR and EPR MV-105; 75/150 °C for thermoplastic is
 * common practice).
 */
export const ICEA_TEMPERATURES: Readonly<Record<Cable['insulation'], readonly [number, number]>> = {
  thermoplastic: [75, 150],
  xlpe: [90, 250],
  'epr-105': [105, 250],
};

/**
 * The longest time (s) the adiabatic ICEA formula is drawn and checked to (common practice: it holds
 * for short durations, about 10 s at most): the curve is a short-circuit limit only.
 */
export const ICEA_LONGEST_SECONDS = 10;

/** What the cable curve leaves out, in words for the sheet, the findings and the report. */
export const CABLE_OVERLOAD_NOTE =
  'short-circuit limit only: the overload region beyond 10 s is not covered (overload protection is checked against the ampacity, NFPA 70 240.4, at 1000 V and below)';

/** Options of `cableWithstandOf`. */
export interface CableWithstandOptions {
  /** The cable's bus voltage (V, line-to-line): the voltage the curve's currents are given at. */
  volts: number;
  /**
   * Area of one conductor in circular mils, when it should not come from `cable.size` (e.g. a size
   * the NEC table does not list). Parallel `sets` still multiply it.
   * @default conductorAreaCmil(cable.size); range > 0
   */
  conductorAreaCmil?: number;
  /** Time (s) where the drawn line starts; the adiabatic formula is not valid for long durations. @default 10; at most 10 */
  longestSeconds?: number;
  /** Time (s) where the drawn line ends (one half-cycle). @default 0.01 */
  shortestSeconds?: number;
}

/**
 * A cable's short-circuit withstand curve by ICEA P-32-382, adiabatic heating from the insulation's
 * operating temperature T1 to its short-circuit limit T2:
 * `(I / A)² · t = K · log10[(T2 + λ) / (T1 + λ)]`, I in A, A in cmil (× parallel sets), t in s.
 * Drawn as a straight line of slope −2 in log-log from 10 s down to 0.01 s. It is a short-circuit
 * limit only: below the 10 s current `timeAt` is `Infinity` (the overload region is not covered, and
 * the label and notes say so), and it is never drawn beyond `ICEA_LONGEST_SECONDS`.
 *
 * @example cableWithstandOf({ size: '4/0', material: 'copper', insulation: 'xlpe', sets: 1, ... }, { volts: 480 }).timeAt(15_224.5) // ≈ 1 s
 */
export function cableWithstandOf(cable: Cable, options: CableWithstandOptions): WithstandCurve {
  const path = elementPath('cables', cable.id);
  const { longestSeconds = 10, shortestSeconds = 0.01 } = options;
  const volts = requireNumberAbove('options.volts', options.volts, 0, 'a voltage in V');
  requireNumberAbove('options.shortestSeconds', shortestSeconds, 0, 'a time in s');
  requireNumberAbove('options.longestSeconds', longestSeconds, shortestSeconds, 'a time in s');
  if (longestSeconds > ICEA_LONGEST_SECONDS)
    throw new InputError(
      'options.longestSeconds',
      expectedGot(`a time of at most ${ICEA_LONGEST_SECONDS} s (a short-circuit limit only)`, longestSeconds),
    );
  const conductor = ICEA_CONDUCTOR[cable.material];
  if (!conductor) throw new InputError(`${path}.material`, expectedGot('"copper" or "aluminium"', cable.material));
  const temperatures = ICEA_TEMPERATURES[cable.insulation];
  if (!temperatures) {
    throw new InputError(`${path}.insulation`, expectedGot('"thermoplastic", "xlpe" or "epr-105"', cable.insulation));
  }
  const sets = cable.sets ?? 1;
  if (!Number.isInteger(sets) || sets < 1)
    throw new InputError(`${path}.sets`, expectedGot('a whole number of at least 1', sets));
  const perConductor =
    options.conductorAreaCmil === undefined
      ? conductorAreaCmil(cable.size, `${path}.size`)
      : requireNumberAbove('options.conductorAreaCmil', options.conductorAreaCmil, 0, 'an area in cmil');

  // (I/A)²·t = c, with c = K·log10[(T2 + λ)/(T1 + λ)].
  const [t1, t2] = temperatures;
  const area = perConductor * sets;
  const c = conductor.k * Math.log10((t2 + conductor.lambda) / (t1 + conductor.lambda));
  const ampsAt = (seconds: number) => area * Math.sqrt(c / seconds);
  const lowestAmps = ampsAt(longestSeconds);
  const highestAmps = ampsAt(shortestSeconds);

  // One point per decade of time; the line is straight in log-log, so the ends alone would draw it.
  const times = [longestSeconds];
  for (let t = 10 ** (Math.ceil(Math.log10(longestSeconds)) - 1); t > shortestSeconds * (1 + 1e-9); t /= 10) {
    if (t < longestSeconds * (1 - 1e-9)) times.push(t);
  }
  times.push(shortestSeconds);
  const seconds = Float64Array.from(times);
  const amps = seconds.map(ampsAt);

  const sizeText = `${sets > 1 ? `${sets} × ` : ''}${cable.size}`;
  const temperatureText = `${t1} to ${t2} °C`;
  // The notes are written when first read: a large study has thousands of cables, seldom all opened.
  return withLazyFields(
    {
      elementId: cable.id,
      kind: 'cable',
      label: `ICEA P-32-382 short-circuit limit, ${sizeText} ${conductor.symbol} ${temperatureText}`,
      volts,
      amps,
      seconds,
      timeAt(current) {
        if (!(current >= lowestAmps)) return Infinity;
        if (current >= highestAmps) return shortestSeconds;
        return c * (area / current) ** 2;
      },
    } satisfies Omit<WithstandCurve, 'notes'>,
    {
      notes: () => [
        `ICEA P-32-382 conductor withstand: (I/A)²·t = K·log10[(T2 + λ)/(T1 + λ)], adiabatic (valid for short durations)`,
        `${cable.material}: K = ${conductor.k}, λ = ${conductor.lambda} °C; ${cable.insulation}: T1 = ${t1} °C, T2 = ${t2} °C`,
        `A = ${sets} × ${significant(perConductor, 7)} cmil = ${significant(area, 7)} cmil` +
          (options.conductorAreaCmil === undefined ? ` (${cable.size}, NEC Chapter 9 Table 8)` : ' (area given)'),
        `I = ${significant(c ** 0.5, 5)} · A / √t: ${significant(lowestAmps, 6)} A at ${longestSeconds} s to ` +
          `${significant(highestAmps, 6)} A at ${shortestSeconds} s, at ${significant(volts, 6)} V`,
        'conductor only: metallic shields and sheaths are rated by another method (ICEA P-45-482)',
        CABLE_OVERLOAD_NOTE,
      ],
    },
  );
}
