import type { Transformer } from '../study/index.ts';

/** Through-fault thermal limit in the short-time region, `I² · t` in pu²·s (IEEE C57.109, IEEE C57.109). */
export const THERMAL_I2T = 1250;

/**
 * IEEE C57.109 Table 1 long-time points below the `I²t = 1250` region, as `[pu, seconds]` (IEEE C57.109,
 * values from memory). The table's 10 s entry (11.3 pu) is replaced by the join on `I²t = 1250`.
 */
export const LIQUID_THERMAL_TABLE: readonly (readonly [number, number])[] = [
  [2, 1800],
  [3, 300],
  [4.75, 60],
  [6.3, 30],
];

/** Time (s) at which the liquid-immersed thermal curve joins `I²t = 1250`: 10 s, at √125 = 11.180 pu. */
export const LIQUID_JOIN_SECONDS = 10;

/** Longest time (s) of the dry-type thermal curve, IEEE C57.12.59 (from memory); beyond it IEEE C57.96 loading applies. */
export const DRY_LONGEST_SECONDS = 100;

/**
 * The thermal (through-fault) part of a transformer withstand curve in per unit of rated current.
 * `secondsAt(pu)` is `Infinity` below `lowestPu` and follows `I²t = 1250` without end above the last
 * breakpoint; the caller ends the curve at the maximum through-fault current.
 */
export interface ThermalCurve {
  /** Lowest current (pu) of the curve: 2 pu (1800 s) liquid, √12.5 = 3.536 pu (100 s) dry. */
  lowestPu: number;
  /** Currents (pu, ascending) where the formula changes: table points and the join on `I²t = 1250`. */
  breakpointsPu: readonly number[];
  /** Time in seconds the winding withstands `pu` times rated current, by the thermal limit alone. */
  secondsAt(pu: number): number;
  /** How the curve is built, for the withstand curve's notes. */
  rule: string;
}

/**
 * The thermal curve for a construction (IEEE C57.109 and IEEE C57.12.59).
 *
 * - liquid (IEEE C57.109): `t = 1250 / I²` for `I ≥ √125 = 11.180 pu`; below, straight lines in
 *   log-log through 2 pu/1800 s, 3/300, 4.75/60, 6.3/30 and the join 11.180/10. This continuous rule
 *   is a choice (IEEE C57.109): the standard's table lists 11.3 pu at 10 s, off `I²t = 1250`.
 * - dry (IEEE C57.12.59, from memory): `t = 1250 / I²` from 100 s (3.536 pu) down.
 *
 * @example thermalCurveOf('liquid').secondsAt(5) // 52.902 s (IEEE C57.109 check value)
 */
export function thermalCurveOf(construction: Transformer['construction']): ThermalCurve {
  if (construction === 'dry') {
    const lowestPu = Math.sqrt(THERMAL_I2T / DRY_LONGEST_SECONDS);
    return {
      lowestPu,
      breakpointsPu: [lowestPu],
      secondsAt: (pu) => (pu >= lowestPu ? THERMAL_I2T / (pu * pu) : Infinity),
      rule: 'thermal: I²t = 1250 pu²·s from 100 s (3.536 pu) down (IEEE C57.12.59, from memory); above 100 s IEEE C57.96 loading applies',
    };
  }
  const joinPu = Math.sqrt(THERMAL_I2T / LIQUID_JOIN_SECONDS);
  const points = [...LIQUID_THERMAL_TABLE, [joinPu, LIQUID_JOIN_SECONDS] as const];
  const logPu = points.map(([pu]) => Math.log(pu));
  const logSeconds = points.map(([, seconds]) => Math.log(seconds));
  const lowestPu = points[0][0];
  return {
    lowestPu,
    breakpointsPu: points.map(([pu]) => pu),
    secondsAt(pu) {
      if (!(pu >= lowestPu)) return Infinity;
      if (pu >= joinPu) return THERMAL_I2T / (pu * pu);
      const x = Math.log(pu);
      let k = 0;
      while (x > logPu[k + 1]) k++;
      const slope = (logSeconds[k + 1] - logSeconds[k]) / (logPu[k + 1] - logPu[k]);
      return Math.exp(logSeconds[k] + (x - logPu[k]) * slope);
    },
    rule:
      'thermal: I²t = 1250 pu²·s for I ≥ √125 = 11.180 pu; below, log-log interpolation through 2 pu/1800 s, ' +
      '3/300, 4.75/60, 6.3/30 and the join 11.180/10 (IEEE C57.109 Table 1, values from memory; the continuous ' +
      'rule is a choice made here, the table lists 11.3 pu at 10 s)',
  };
}
