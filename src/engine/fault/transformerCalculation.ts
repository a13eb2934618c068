import type { Work, WorkStep } from '../work.ts';
import { addImpedance, formatImpedance, impedanceOfMagnitude, magnitudeOf, xrOf } from './impedance.ts';
import { reflectAmps } from './reflect.ts';
import { fullLoadAmpsOf, IMPEDANCE_TOLERANCE } from './transformerImpedance.ts';
import { impedanceStep, num } from './workSteps.ts';

/** Inputs of the quick transformer calculation, SI units. */
export interface TransformerCalculationInput {
  /** Rating (VA). */
  rating: number;
  /** Primary and secondary line-to-line voltages (V). */
  primary: number;
  secondary: number;
  /** Nameplate impedance (percent). */
  impedance: number;
  /** 1 or 3. @default 3 */
  phases?: 1 | 3;
  /** Transformer X/R; omit for all-reactance. */
  xr?: number;
  /** Available three-phase fault at the primary: power (VA) or current (A); omit for an infinite source. */
  source?: { va: number; amps?: undefined } | { amps: number; va?: undefined };
  /** Source X/R; omit for all-reactance. */
  sourceXr?: number;
  /** Use 92.5 % of nameplate %Z (common practice, maximum duty). @default false */
  impedanceTolerance?: boolean;
  /**
   * Single-phase units: primary across two lines of the three-phase source, or line to neutral (the
   * `primary` voltage is then the winding's, the source's line-to-line voltage √3 times it).
   * @default 'line-to-line'
   */
  primaryConnection?: 'line-to-line' | 'line-to-neutral';
  /** Single-phase units: a centre-tapped secondary (120/240 V). @default true for a 240 V secondary */
  centreTapped?: boolean;
}

/** Result of the quick transformer calculation; amps are three-phase (or single-phase) bolted, symmetrical. */
export interface TransformerCalculation {
  fullLoadAmps: { primary: number; secondary: number };
  faultAmps: {
    /** `FLA_sec / Z_pu` (A at the secondary). */
    infiniteBus: number;
    /** With the source impedance, or the infinite-bus value when no source is given (A at the secondary). */
    secondary: number;
    /** `secondary` at the primary voltage (A). */
    reflectedToPrimary: number;
    /** Centre-tapped single-phase units: the line-to-neutral (half-winding) fault at the secondary terminals (A). */
    lineToNeutral?: number;
  };
  /** Per-unit impedances on the transformer base. */
  perUnit: { source: number; transformer: number; total: number };
  /** X/R at the secondary terminals; `Infinity` with no resistance. */
  xr: number;
  work: Work;
}

/**
 * A transformer's full-load currents and secondary bolted fault, infinite or finite source, by the
 * per-unit method on the transformer's own base (IEEE 141 / IEEE 399). A single-phase unit fed
 * line-to-line from a three-phase source sees the source through two phases (Z1 + Z2), so its source
 * impedance is `2 · S_T / S_sc` (symmetrical components, Z2 = Z1).
 *
 * @example transformerCalculation({ rating: 1.5e6, primary: 12470, secondary: 480, impedance: 5.75, xr: 6,
 *   source: { va: 250e6 }, sourceXr: 12 }).faultAmps.secondary // 28 421.1 A
 */
export function transformerCalculation(input: TransformerCalculationInput): TransformerCalculation {
  const { rating, primary, secondary, impedance, phases = 3, xr, source, sourceXr, impedanceTolerance = false } = input;
  const toNeutral = phases === 1 && input.primaryConnection === 'line-to-neutral';
  const centreTapped = phases === 1 && (input.centreTapped ?? Math.abs(secondary - 240) < 1);
  const work: WorkStep[] = [];
  const root = phases === 3 ? '1.7320508 × ' : '';
  const fla = (side: string, volts: number): number => {
    const value = fullLoadAmpsOf(rating, volts, phases);
    work.push({
      label: `${side} full-load current (${phases === 3 ? 'three' : 'single'}-phase)`,
      formula: phases === 3 ? 'I_FL = S / (√3 · V)' : 'I_FL = S / V',
      substituted: `I_FL = ${num(rating)} VA / (${root}${num(volts)} V)`,
      value,
      unit: 'A',
      source: 'textbook identity (IEEE 141)',
    });
    return value;
  };
  const secondaryFla = fla('secondary', secondary);
  const primaryFla = fla('primary', primary);

  const perUnit = (impedance / 100) * (impedanceTolerance ? IMPEDANCE_TOLERANCE : 1);
  work.push({
    label: 'transformer impedance, per unit on its own base',
    formula: impedanceTolerance ? 'Z_pu = 0.925 · %Z / 100' : 'Z_pu = %Z / 100',
    substituted: `Z_pu = ${impedanceTolerance ? '0.925 × ' : ''}${num(impedance)} % / 100`,
    value: perUnit,
    unit: 'pu',
    source: impedanceTolerance
      ? 'IEEE C57.12.00 −7.5 % impedance tolerance (verify against the edition you work to); applied for maximum duty, common practice'
      : 'nameplate',
  });
  const infiniteBus = secondaryFla / perUnit;
  work.push({
    label: 'secondary fault, infinite source',
    formula: 'I_sc = I_FL,sec / Z_pu',
    substituted: `I_sc = ${num(secondaryFla)} A / ${num(perUnit)} pu`,
    value: infiniteBus,
    unit: 'A',
    source: 'infinite-bus identity (IEEE 141 / IEEE 242)',
  });

  const zT = impedanceOfMagnitude(perUnit, xr);
  let total = zT;
  let sourcePu = 0;
  if (source) {
    const systemVolts = toNeutral ? Math.sqrt(3) * primary : primary;
    const power = source.va ?? Math.sqrt(3) * systemVolts * source.amps!;
    if (source.amps !== undefined)
      work.push({
        label: 'source short-circuit power from its fault current',
        formula: 'S_sc = √3 · V_pri · I_sc',
        substituted: `S_sc = 1.7320508 × ${num(systemVolts)} V × ${num(source.amps)} A`,
        value: power,
        unit: 'VA',
        source: 'S = √3 · V · I (IEEE 141)',
      });
    // Loop of a single-phase unit: Z1 + Z2 across two lines; (Z1 + Z2 + Z0)/3 line to neutral on the
    // winding's base, which with Z0 = Z1 is 3 · S_T / S_sc (symmetrical components, IEEE 399).
    const factor = phases === 3 ? 1 : toNeutral ? 3 : 2;
    sourcePu = (factor * rating) / power;
    const zU = impedanceOfMagnitude(sourcePu, sourceXr);
    work.push(
      impedanceStep(
        'source impedance on the transformer base',
        phases === 3
          ? 'Z_U = S_T / S_sc'
          : toNeutral
            ? 'Z_U = 3 · S_T / S_sc (line-to-neutral loop, (Z1 + Z2 + Z0)/3 with Z0 = Z1)'
            : 'Z_U = 2 · S_T / S_sc (line-to-line loop, Z1 + Z2)',
        `Z_U = ${factor !== 1 ? `${factor} × ` : ''}${num(rating)} VA / ${num(power)} VA; ${sourceXr === undefined ? 'all reactance' : `X/R ${num(sourceXr)}`}`,
        zU,
        'pu',
        toNeutral
          ? 'symmetrical components (IEEE 399); source Z0 = Z1, common practice'
          : 'per-unit method (IEEE 141 / IEEE 399)',
      ),
      impedanceStep(
        'transformer impedance split by its X/R',
        'R = Z / √(1 + (X/R)²), X = R · X/R',
        `Z_T = ${num(perUnit)} pu; ${xr === undefined ? 'all reactance' : `X/R ${num(xr)}`}`,
        zT,
        'pu',
        'per-unit method (IEEE 141 / IEEE 399)',
      ),
    );
    total = addImpedance(zU, zT);
    work.push(
      impedanceStep(
        'total impedance to the secondary terminals',
        'Z = ΣR + jΣX',
        `Z = (${formatImpedance(zU)}) + (${formatImpedance(zT)})`,
        total,
        'pu',
        'per-unit method (IEEE 141 / IEEE 399), phasor sum',
      ),
    );
  }
  const secondaryAmps = secondaryFla / magnitudeOf(total);
  if (source)
    work.push({
      label: 'secondary fault, finite source',
      formula: 'I_sc = I_FL,sec / |Z|',
      substituted: `I_sc = ${num(secondaryFla)} A / ${num(magnitudeOf(total))} pu`,
      value: secondaryAmps,
      unit: 'A',
      source: 'per-unit method (IEEE 141 / IEEE 399)',
    });
  const reflectedToPrimary = reflectAmps(secondaryAmps, secondary, primary);
  work.push({
    label: 'secondary fault reflected to the primary',
    formula: 'I_pri = I_sec · V_sec / V_pri',
    substituted: `I_pri = ${num(secondaryAmps)} A × ${num(secondary)} V / ${num(primary)} V`,
    value: reflectedToPrimary,
    unit: 'A',
    source: 'turns ratio',
  });
  let lineToNeutral: number | undefined;
  if (centreTapped) {
    // Half winding on the full kVA at V/2: 1.5 × R and 1.2 × X of the full-winding values (common
    // practice); the source keeps its per-unit value, referred by half the turns onto half the base voltage.
    const zSource = { r: total.r - zT.r, x: total.x - zT.x };
    const half = { r: 1.5 * zT.r, x: 1.2 * zT.x };
    const loop = addImpedance(zSource, half);
    lineToNeutral = rating / (secondary / 2) / magnitudeOf(loop);
    work.push(
      impedanceStep(
        'half-winding loop for a line-to-neutral fault',
        'Z = Z_U + 1.5 · R_T + j·1.2 · X_T',
        `Z = (${formatImpedance(zSource)}) pu + (${formatImpedance(half)}) pu`,
        loop,
        'pu',
        'half-winding 1.5 × R and 1.2 × X of full-winding values, common practice',
      ),
      {
        label: 'line-to-neutral (half-winding) fault at the secondary terminals',
        formula: 'I_LN = (S / (V/2)) / |Z|',
        substituted: `I_LN = ${num(rating)} VA / ${num(secondary / 2)} V / ${num(magnitudeOf(loop))} pu`,
        value: lineToNeutral,
        unit: 'A',
        source: 'per-unit method (IEEE 141 / IEEE 399)',
      },
    );
  }
  return {
    fullLoadAmps: { primary: primaryFla, secondary: secondaryFla },
    faultAmps: {
      infiniteBus,
      secondary: secondaryAmps,
      reflectedToPrimary,
      ...(lineToNeutral ? { lineToNeutral } : {}),
    },
    perUnit: { source: sourcePu, transformer: perUnit, total: magnitudeOf(total) },
    xr: xrOf(total),
    work,
  };
}
