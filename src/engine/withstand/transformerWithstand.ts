import { InputError, expectedGot } from '../errors.ts';
import { significant } from '../quantity/format.ts';
import type { Transformer } from '../study/index.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';
import { transformerCategoryOf, type TransformerCategory } from './transformerCategory.ts';
import { transformerRatedAmps } from './transformerRatedAmps.ts';
import { thermalCurveOf } from './transformerThermal.ts';
import type { WithstandCurve } from './withstand.ts';

/** Options of `transformerWithstandOf`. */
export interface TransformerWithstandOptions {
  /**
   * Source (system) impedance in per unit on the transformer's own base, added to `Z_T` for the
   * maximum through-fault current of Categories III and IV (`I_max = 1/(Z_T + Z_S)`). Ignored for I and II.
   * @default 0 (infinite bus); range ≥ 0
   */
  sourceImpedancePu?: number;
  /** Through-fault duty. Category I has one curve and Category IV always uses the frequent construction. @default the transformer's `faultFrequency` */
  faultFrequency?: Transformer['faultFrequency'];
  /**
   * Fraction `f` of `I_max` where the mechanical portion starts. For dry-type units the C57.12.59
   * value is not confirmed and the liquid-immersed value is used.
   * @default 0.7 (Category II), 0.5 (Categories III, IV); range (0, 1]
   */
  mechanicalFraction?: number;
}

/** Mechanical-portion fraction `f` by category, IEEE C57.109 (from memory). */
export const MECHANICAL_FRACTION: Readonly<Record<'II' | 'III' | 'IV', number>> = { II: 0.7, III: 0.5, IV: 0.5 };

/** The mechanical curve passes through `(I_max, 2 s)`: `K = 2 · I_max²` (IEEE C57.109). */
export const MECHANICAL_SECONDS_AT_MAX = 2;

/** Polyline density along each curved stretch (points per decade of current). */
const POINTS_PER_DECADE = 32;

/**
 * The through-fault withstand ("damage") curve of a transformer, IEEE C57.109 (liquid-immersed) or
 * IEEE C57.12.59 (dry-type), IEEE C57.109 Currents are in amps at the secondary winding voltage
 * (`volts` = `transformer.secondary`); callers scale to other bases and apply the connection factor of
 * IEEE C37.91 / IEEE C57.109 delta–wye shift factors for primary devices.
 *
 * - Thermal part: `thermalCurveOf` (liquid: table points then `I²t = 1250`; dry: `I²t = 1250` from 100 s).
 * - `I_max = 1/Z_T` (Categories I, II) or `1/(Z_T + Z_S)` (III, IV); the curve ends there.
 * - Category I: the thermal curve alone, to `I_max` (past 25 pu, below 2 s, when Z_T < 4 %).
 * - Category II frequent, III frequent, IV: thermal curve to `f · I_max`, a vertical step down to
 *   `t = K / I²` (`K = 2 · I_max²`), which runs to `(I_max, 2 s)`; where the mechanical curve lies above
 *   the thermal one (I_max ≥ 25 pu) the thermal curve governs.
 * - Categories II, III infrequent: the thermal curve to `I_max`.
 *
 * @example transformerWithstandOf(t2500kva, { faultFrequency: 'frequent' }).timeAt(40_000) // 3.419 s, K/I² (hand-worked IEEE C57.109 Category II case)
 */
export function transformerWithstandOf(
  transformer: Transformer,
  options: TransformerWithstandOptions = {},
): WithstandCurve {
  const path = elementPath('transformers', transformer.id);
  const { sourceImpedancePu = 0, faultFrequency = transformer.faultFrequency, mechanicalFraction } = options;
  requireNumberAbove('options.sourceImpedancePu', sourceImpedancePu, 0, 'a per-unit impedance', true);
  if (faultFrequency !== 'frequent' && faultFrequency !== 'infrequent') {
    throw new InputError('options.faultFrequency', expectedGot('"frequent" or "infrequent"', faultFrequency));
  }

  // Per-unit base and maximum through-fault current.
  const category = transformerCategoryOf(transformer);
  const volts = requireNumberAbove(`${path}.secondary`, transformer.secondary, 0, 'a voltage in V');
  const baseAmps = transformerRatedAmps(transformer, volts);
  const zT = requireNumberAbove(`${path}.impedance`, transformer.impedance, 0, 'a percentage') / 100;
  const usesSource = category === 'III' || category === 'IV';
  const { maxPu, lowestPu } = throughFaultReachOf(transformer, sourceImpedancePu);
  const thermal = thermalCurveOf(transformer.construction);
  // A denormal impedance (1e-310 %) gives an infinite through-fault current: no curve ends there.
  if (maxPu === Infinity) {
    throw new InputError(`${path}.impedance`, expectedGot('a percentage of at least 1e-9', transformer.impedance));
  }
  if (!(maxPu > lowestPu)) {
    throw new InputError(
      `${path}.impedance`,
      expectedGot(
        `a percentage giving a maximum through-fault current above ${significant(thermal.lowestPu)} pu`,
        transformer.impedance,
      ),
    );
  }

  // Which construction applies, and where the mechanical portion starts.
  if (mechanicalFraction !== undefined && !(mechanicalFraction > 0 && mechanicalFraction <= 1)) {
    throw new InputError(
      'options.mechanicalFraction',
      expectedGot('a fraction greater than 0 and at most 1', mechanicalFraction),
    );
  }
  const duty = category === 'I' ? 'single' : category === 'IV' ? 'frequent' : faultFrequency;
  const mechanical = duty === 'frequent' ? (category as 'II' | 'III' | 'IV') : undefined;
  const fraction = mechanical ? (mechanicalFraction ?? MECHANICAL_FRACTION[mechanical]) : undefined;
  const stepPu = fraction === undefined ? Infinity : Math.max(fraction * maxPu, thermal.lowestPu);
  const k = MECHANICAL_SECONDS_AT_MAX * maxPu * maxPu;
  // Below the step the thermal limit alone; from it on, the lower of thermal and mechanical.
  const secondsAtPu = (pu: number, onOrPastStep: boolean) => {
    const t = thermal.secondsAt(pu);
    return onOrPastStep ? Math.min(t, k / (pu * pu)) : t;
  };

  const { amps, seconds } = polylineOf({
    knotsPu: thermal.breakpointsPu,
    lowestPu: thermal.lowestPu,
    stepPu,
    maxPu,
    baseAmps,
    secondsAtPu,
  });
  const lowestAmps = thermal.lowestPu * baseAmps;
  const maxAmps = maxPu * baseAmps;
  const stepAmps = stepPu * baseAmps;
  const standard = transformer.construction === 'dry' ? 'C57.12.59' : 'C57.109';
  const dutyText = duty === 'single' ? '' : `, ${duty} faults`;
  return {
    elementId: transformer.id,
    kind: 'transformer',
    label: `${standard} Category ${category}${transformer.construction === 'dry' ? ' (dry-type)' : ''}${dutyText}`,
    volts,
    amps,
    seconds,
    timeAt(current) {
      if (!(current >= lowestAmps)) return Infinity;
      // Clamp to the drawn range; compare with the step in amps, as drawn, so a current read off the
      // polyline lands on the right side of it.
      const pu = Math.max(Math.min(current, maxAmps) / baseAmps, thermal.lowestPu);
      return secondsAtPu(pu, fraction !== undefined && current >= stepAmps);
    },
    notes: notesOf({
      transformer,
      category,
      duty,
      baseAmps,
      volts,
      zT,
      sourceImpedancePu,
      usesSource,
      maxPu,
      fraction,
      k,
      thermalRule: thermal.rule,
    }),
  };
}

/**
 * How far a transformer's through-fault duty reaches, per unit of its rated current: `maxPu`, the largest
 * through-fault current (`1/Z_T`, or `1/(Z_T + Z_S)` for Categories III and IV, IEEE C57.109), and
 * `lowestPu`, where its through-fault curve starts. A source so weak that `maxPu` is not above
 * `lowestPu` leaves no through-fault the curve covers (check `throughFaultReachOf(t, zs).maxPu > lowestPu`
 * before `transformerWithstandOf`).
 *
 * @example throughFaultReachOf(tenMvaLiquid, 0.667) // { maxPu: 1.36, lowestPu: 2 }: a 15 MVA source feeding a 10 MVA, 7 % unit
 */
export function throughFaultReachOf(
  transformer: Transformer,
  sourceImpedancePu = 0,
): { maxPu: number; lowestPu: number } {
  const category = transformerCategoryOf(transformer);
  const usesSource = category === 'III' || category === 'IV';
  const maxPu = 1 / (transformer.impedance / 100 + (usesSource ? sourceImpedancePu : 0));
  return { maxPu, lowestPu: thermalCurveOf(transformer.construction).lowestPu };
}

interface PolylineFacts {
  /** Currents (pu) where the thermal formula changes. */
  knotsPu: readonly number[];
  lowestPu: number;
  /** Current (pu) of the vertical step; `Infinity` when there is none. */
  stepPu: number;
  maxPu: number;
  baseAmps: number;
  secondsAtPu(pu: number, onOrPastStep: boolean): number;
}

/** The drawn curve: log-spaced points along each stretch, exact corners at every knot and both ends of the step. */
function polylineOf(facts: PolylineFacts): { amps: Float64Array; seconds: Float64Array } {
  const { lowestPu, stepPu, maxPu, baseAmps, secondsAtPu } = facts;
  const knots = [...new Set([lowestPu, ...facts.knotsPu, stepPu, maxPu])]
    .filter((pu) => pu >= lowestPu && pu <= maxPu)
    .sort((a, b) => a - b);
  const amps: number[] = [];
  const seconds: number[] = [];
  const push = (pu: number, t: number) => {
    amps.push(pu * baseAmps);
    seconds.push(t);
  };
  for (let i = 0; i < knots.length; i++) {
    const from = knots[i];
    if (from === stepPu) {
      // The vertical step: the thermal time above, then the mechanical time below, at one current.
      const upper = secondsAtPu(from, false);
      const lower = secondsAtPu(from, true);
      push(from, upper);
      if (lower < upper) push(from, lower);
    } else {
      push(from, secondsAtPu(from, from > stepPu));
    }
    if (i === knots.length - 1) break;
    const to = knots[i + 1];
    const n = Math.max(1, Math.ceil(Math.log10(to / from) * POINTS_PER_DECADE));
    for (let j = 1; j < n; j++) {
      const pu = from * Math.pow(to / from, j / n);
      push(pu, secondsAtPu(pu, pu >= stepPu));
    }
  }
  return { amps: Float64Array.from(amps), seconds: Float64Array.from(seconds) };
}

interface NoteFacts {
  transformer: Transformer;
  category: TransformerCategory;
  duty: 'single' | 'frequent' | 'infrequent';
  baseAmps: number;
  volts: number;
  zT: number;
  sourceImpedancePu: number;
  usesSource: boolean;
  maxPu: number;
  fraction: number | undefined;
  k: number;
  thermalRule: string;
}

/** Source, method and every choice, in the order a reader checks them. */
function notesOf(facts: NoteFacts): string[] {
  const { transformer, category, duty, baseAmps, volts, zT, sourceImpedancePu, usesSource, maxPu, fraction, k } = facts;
  const dry = transformer.construction === 'dry';
  const kva = significant(transformer.rating / 1000, 6);
  const notes = [
    `${dry ? 'IEEE C57.12.59 (dry-type)' : 'IEEE C57.109 (liquid-immersed)'} through-fault curve, Category ${category}` +
      (transformer.category ? ' (set in the study)' : ` (IEEE C57.12.00, from ${kva} kVA ${transformer.phases}-phase)`),
    `currents in A at the secondary, ${significant(volts, 6)} V; 1 pu = rated current ${significant(baseAmps, 6)} A; ` +
      'scale to other voltage bases, and for primary devices apply the connection factor (0.58 Δ–Yg secondary L-G, 0.87 Δ–Δ secondary L-L)',
    facts.thermalRule,
    usesSource
      ? `I_max = 1/(Z_T + Z_S) = 1/(${significant(zT, 6)} + ${significant(sourceImpedancePu, 6)}) = ${significant(maxPu, 6)} pu = ${significant(maxPu * baseAmps, 6)} A`
      : `I_max = 1/Z_T = 1/${significant(zT, 6)} = ${significant(maxPu, 6)} pu = ${significant(maxPu * baseAmps, 6)} A` +
        (sourceImpedancePu > 0 ? ' (source impedance not used for Categories I and II)' : ''),
  ];
  if (duty === 'single') {
    notes.push('Category I: one curve for thermal and mechanical duty, ending at I_max');
    if (maxPu > 25) notes.push('Z_T < 4 %: I²t = 1250 continues past 25 pu (below 2 s) to I_max');
  } else if (fraction !== undefined) {
    const governs =
      k < 1250 ? '' : '; it lies above the thermal curve here (I_max ≥ 25 pu), so the thermal curve governs';
    notes.push(
      `mechanical (frequent faults${category === 'IV' ? ', always for Category IV' : ''}): t = K/I², K = 2·I_max² = ` +
        `${significant(k, 6)} pu²·s, from f·I_max = ${significant(fraction, 3)} × ${significant(maxPu, 6)} = ` +
        `${significant(fraction * maxPu, 6)} pu (vertical step from the thermal curve) to (I_max, 2 s)${governs}`,
    );
  } else {
    notes.push('infrequent faults: thermal curve alone, out to I_max');
  }
  if (dry) {
    notes.push(
      'verify against C57.12.59: the dry-type mechanical fraction and the thermal limits above are from memory' +
        (fraction !== undefined ? ` (f = ${significant(fraction, 3)}, the liquid-immersed value unless set)` : ''),
    );
    if (category === 'IV')
      notes.push('C57.12.59 covers Categories I–III; Category IV drawn with the C57.109 construction');
    if (maxPu > 25)
      notes.push(
        'C57.12.59 curves assume faults of at most 25 × rated current; I²t = 1250 continued to I_max (conservative)',
      );
  }
  return notes;
}
