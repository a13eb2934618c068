import type { Network } from '../network/index.ts';
import type { Transformer } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { DELTA_WYE_TABLE, shiftFactorsOf } from './deltaWye.ts';
import type { BusFault, TransformerFault } from './faultLevels.ts';
import type { FaultTree } from './faultTree.ts';
import { addImpedance, divideComplex, magnitudeOf, multiplyComplex, type Impedance } from './impedance.ts';
import { primaryConnectionOf, secondaryWindingOf } from './singlePhase.ts';
import { effectivePerUnit, fullLoadAmpsOf } from './transformerImpedance.ts';
import { num, withLazyWork } from './workSteps.ts';

/**
 * A transformer's secondary fault picture at maximum conditions, from the reduced networks: full-load
 * currents, the infinite-bus bound, the through-fault (the part of a secondary bus fault that flows
 * through the transformer, i.e. without the secondary side's own motors; IEEE 399 / IEEE 141 motor
 * contribution as parallel sources) reflected to the primary, the source impedance on the transformer
 * base, and the secondary line-to-line and line-to-ground faults with the primary line currents they
 * cause (symmetrical components, IEEE 399 short-circuit chapter; Δ–Y line-current patterns as used for
 * the IEEE C37.91 / C57.109 shift factors).
 *
 * Line-to-ground: with `I0 = E / (2·Z1 + Z0)` at the secondary bus and `c1` the positive-sequence share
 * through the transformer, the wye winding currents are `I0·(1 + c1·(a^-k + a^k))`; a delta primary sees
 * their differences (zero sequence trapped), a wye primary the currents themselves, both scaled by the
 * winding turns. A single-phase unit's primary line current is `I_s · V_s / V_w`, `V_w` the primary
 * winding voltage (line to neutral for a unit connected so).
 *
 * @example transformerFaultOf(t1, network, maxTree, faults.buses.get('SWBD')!).reflectedToPrimary // A at 12.47 kV
 */
export function transformerFaultOf(t: Transformer, network: Network, max: FaultTree, bus: BusFault): TransformerFault {
  const phases = t.phases;
  const root = phases === 3 ? '√3 · ' : '';
  const primaryFla = fullLoadAmpsOf(t.rating, t.primary, phases);
  const secondaryFla = fullLoadAmpsOf(t.rating, t.secondary, phases);
  const perUnit = effectivePerUnit(t, true);
  const infiniteBusAmps = secondaryFla / perUnit;
  const busVolts = bus.volts;
  const fromVolts = network.buses.get(t.from)!.voltage;
  const singlePrimaryBus = network.feederOf.has(t.from) && isBelowSinglePhase(network, t.from);
  // The primary winding voltage at bus level: line to neutral for a single-phase unit connected so.
  const windingVolts =
    phases === 1 && !singlePrimaryBus && primaryConnectionOf(t, fromVolts) === 'line-to-neutral'
      ? fromVolts / Math.sqrt(3)
      : fromVolts;
  const ratio = busVolts / windingVolts;
  const toward = max.toward.get(t.to)!;
  const through = phases === 3 ? busVolts / (Math.sqrt(3) * magnitudeOf(toward)) : bus.max.lineToLine;
  const reflectedToPrimary = through * ratio;
  const sourceBase = (windingVolts * windingVolts) / t.rating;
  const sourceZ =
    phases === 3
      ? magnitudeOf(max.behind.get(t.id)!) / sourceBase
      : magnitudeOf({
          r: bus.max.impedance.r - max.branchZ.get(t.id)!.r,
          x: bus.max.impedance.x - max.branchZ.get(t.id)!.x,
        }) /
        ((busVolts * busVolts) / t.rating);
  const sourceImpedancePu = sourceZ;

  let lineToLine: { secondaryAmps: number; primaryLineAmps: number[] };
  let lineToGround: { secondaryAmps: number; primaryLineAmps: number[] };
  if (phases === 1) {
    const lines = (amps: number) => (windingVolts === fromVolts ? [amps, amps, 0] : [amps, 0, 0]);
    const centreTapped = secondaryWindingOf(t) === 'centre-tapped';
    lineToLine = { secondaryAmps: through, primaryLineAmps: lines(reflectedToPrimary) };
    const ground = bus.max.lineToGround;
    lineToGround = {
      secondaryAmps: ground,
      primaryLineAmps: lines(ground * (centreTapped ? ratio / 2 : ratio)),
    };
  } else {
    const table = DELTA_WYE_TABLE[t.connection].lineToLine;
    lineToLine = {
      secondaryAmps: (through * Math.sqrt(3)) / 2,
      primaryLineAmps: table.primary.map((pu) => pu * reflectedToPrimary),
    };
    lineToGround = groundThrough(t, bus, toward, ratio);
  }

  const fla = (side: string, volts: number, value: number): WorkStep => ({
    label: `${t.id} ${side} full-load current`,
    formula: `I_FL = S / (${root}V)`,
    substituted: `I_FL = ${num(t.rating)} VA / (${phases === 3 ? '1.7320508 × ' : ''}${num(volts)} V)`,
    value,
    unit: 'A',
    source: 'textbook identity (IEEE 141)',
  });
  const work = (): WorkStep[] => [
    fla('secondary', t.secondary, secondaryFla),
    fla('primary', t.primary, primaryFla),
    {
      label: `${t.id} secondary fault, infinite source`,
      formula: 'I_sc = I_FL,sec / Z_pu',
      substituted: `I_sc = ${num(secondaryFla)} A / ${num(perUnit)} pu`,
      value: infiniteBusAmps,
      unit: 'A',
      source: 'infinite-bus identity (IEEE 141 / IEEE 242)',
    },
    {
      label: `${t.id} source impedance behind the primary, on the transformer base`,
      formula: phases === 3 ? 'Z_S,pu = |Z_S| / (V_pri² / S_T)' : 'Z_S,pu = |Z_loop − Z_T| / (V_sec² / S_T)',
      substituted:
        phases === 3
          ? `Z_S,pu = ${num(magnitudeOf(max.behind.get(t.id)!))} Ω / ((${num(windingVolts)} V)² / ${num(t.rating)} VA)`
          : `Z_S,pu = ${num(sourceZ * ((busVolts * busVolts) / t.rating))} Ω / ((${num(busVolts)} V)² / ${num(t.rating)} VA)`,
      value: sourceImpedancePu,
      unit: 'pu',
      source: 'per-unit convention (IEEE 399)',
    },
    {
      label: `${t.id} through-fault for a secondary bus fault (no secondary-side motors)`,
      formula: phases === 3 ? 'I = V_LL / (√3 · |Z toward the source|)' : 'I = V / |Z_loop|',
      substituted:
        phases === 3
          ? `I = ${num(busVolts)} V / (1.7320508 × ${num(magnitudeOf(toward))} Ω)`
          : `I = ${num(busVolts)} V / ${num(magnitudeOf(bus.max.impedance))} Ω`,
      value: through,
      unit: 'A',
      source: 'ohmic method (IEEE 141); motors as parallel sources (IEEE 399)',
    },
    {
      label: `${t.id} through-fault reflected to the primary`,
      formula: 'I_pri = I_sec · V_sec / V_w',
      substituted: `I_pri = ${num(through)} A × ${num(busVolts)} V / ${num(windingVolts)} V`,
      value: reflectedToPrimary,
      unit: 'A',
      source: 'turns ratio (IEEE C57.12.00 rated voltages)',
    },
    {
      label: `${t.id} secondary L-L fault: largest primary line current (${phases === 1 ? 'single-phase' : t.connection})`,
      formula: 'I_pri,line = pu · I_pri,3φ',
      substituted: `I = ${num(Math.max(...lineToLine.primaryLineAmps) / (reflectedToPrimary || 1))} × ${num(reflectedToPrimary)} A`,
      value: Math.max(...lineToLine.primaryLineAmps),
      unit: 'A',
      source: 'symmetrical components, Z2 = Z1 (IEEE 399); Δ–Y line currents as for IEEE C37.91 shift factors',
    },
    {
      label: `${t.id} secondary L-G fault: current through the transformer and largest primary line current`,
      formula:
        phases === 1
          ? 'I_pri = I_LG · V_LG / V_w'
          : 'I_wk = I0·(1 + 2·c1·cos(120°·k)); I_pri from the winding currents',
      substituted: `I_LG through = ${num(lineToGround.secondaryAmps)} A`,
      value: Math.max(...lineToGround.primaryLineAmps),
      unit: 'A',
      source: 'symmetrical components (IEEE 399 short-circuit chapter)',
    },
  ];
  return withLazyWork(
    {
      transformerId: t.id,
      fullLoadAmps: { primary: primaryFla, secondary: secondaryFla },
      infiniteBusAmps,
      secondaryAmps: bus.max.threePhase,
      reflectedToPrimary,
      sourceImpedancePu,
      unbalanced: { lineToLine, lineToGround },
      factors: shiftFactorsOf(t.connection, phases),
    },
    work,
  );
}

/** Whether a bus lies below a single-phase transformer. */
function isBelowSinglePhase(network: Network, busId: string): boolean {
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from))
    if (feeder.type === 'transformer' && feeder.item.phases === 1) return true;
  return false;
}

/** A secondary line-to-ground fault through a three-phase transformer: winding and primary line currents. */
function groundThrough(
  t: Transformer,
  bus: BusFault,
  toward: Impedance,
  ratio: number,
): { secondaryAmps: number; primaryLineAmps: number[] } {
  const z0 = bus.max.zeroSequence;
  if (!z0 || !(bus.max.lineToGround > 0)) return { secondaryAmps: 0, primaryLineAmps: [0, 0, 0] };
  const z1 = bus.max.impedance;
  const e = { r: bus.volts / Math.sqrt(3), x: 0 };
  const i0 = divideComplex(e, addImpedance(z1, z1, z0));
  const i1 = multiplyComplex(i0, divideComplex(z1, toward)); // positive (and negative) sequence through the unit
  // Winding currents on the wye side, phase k = 0, 1, 2: I0 + a^-k·I1 + a^k·I2 with I2 = I1.
  const winding = [0, 1, 2].map((k) => {
    const c = 2 * Math.cos((2 * Math.PI * k) / 3);
    return { r: i0.r + c * i1.r, x: i0.x + c * i1.x };
  });
  const primary =
    t.connection === 'wye-wye'
      ? winding.map((w) => magnitudeOf(w) * ratio)
      : winding.map((w, k) => {
          const next = winding[(k + 1) % 3];
          return (magnitudeOf({ r: w.r - next.r, x: w.x - next.x }) * ratio) / Math.sqrt(3);
        });
  return { secondaryAmps: magnitudeOf(winding[0]), primaryLineAmps: primary };
}
