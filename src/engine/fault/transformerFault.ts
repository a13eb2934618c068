import type { Network } from '../network/index.ts';
import type { Transformer } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { shiftFactorsOf, unbalancedLineCurrents } from './deltaWye.ts';
import type { TransformerFault } from './faultLevels.ts';
import type { FaultTree } from './faultTree.ts';
import { magnitudeOf } from './impedance.ts';
import { reflectAmps } from './reflect.ts';
import { effectivePerUnit, fullLoadAmpsOf } from './transformerImpedance.ts';
import { num, withLazyWork } from './workSteps.ts';

/**
 * A transformer's secondary fault picture at maximum conditions, from the reduced tree: full-load
 * currents, the infinite-bus bound, the through-fault (the part of a secondary bus fault that flows
 * through the transformer, i.e. without the secondary side's own motors; REFERENCE §1.5) reflected to
 * the primary, the source impedance on the transformer base, and the §1.8 unbalanced cases.
 *
 * @example transformerFaultOf(t1, network, maxTree, 29_900).reflectedToPrimary // A at 12.47 kV
 */
export function transformerFaultOf(
  t: Transformer,
  network: Network,
  max: FaultTree,
  secondaryAmps: number,
): TransformerFault {
  const phases = t.phases;
  const root = phases === 3 ? '√3 · ' : '';
  const primaryFla = fullLoadAmpsOf(t.rating, t.primary, phases);
  const secondaryFla = fullLoadAmpsOf(t.rating, t.secondary, phases);
  const perUnit = effectivePerUnit(t, true);
  const infiniteBusAmps = secondaryFla / perUnit;
  const busVolts = network.buses.get(t.to)!.voltage;
  const through = busVolts / (Math.sqrt(3) * magnitudeOf(max.toward.get(t.to)!));
  const reflectedToPrimary = reflectAmps(through, t.secondary, t.primary);
  const sourceBase = (t.primary * t.primary) / t.rating;
  const sourceImpedancePu = magnitudeOf(max.behind.get(t.id)!) / sourceBase;
  const lineToLine = unbalancedLineCurrents(t.connection, 'lineToLine', through, t.secondary, t.primary);
  const lineToGround = unbalancedLineCurrents(t.connection, 'lineToGround', through, t.secondary, t.primary);
  const fla = (side: string, volts: number, value: number): WorkStep => ({
    label: `${t.id} ${side} full-load current`,
    formula: `I_FL = S / (${root}V)`,
    substituted: `I_FL = ${num(t.rating)} / (${phases === 3 ? '1.7320508 × ' : ''}${num(volts)})`,
    value,
    unit: 'A',
    source: 'REFERENCE §1.1, textbook identity',
  });
  const work = (): WorkStep[] => [
    fla('secondary', t.secondary, secondaryFla),
    fla('primary', t.primary, primaryFla),
    {
      label: `${t.id} secondary fault, infinite source`,
      formula: 'I_sc = I_FL,sec / Z_pu',
      substituted: `I_sc = ${num(secondaryFla)} / ${num(perUnit)}`,
      value: infiniteBusAmps,
      unit: 'A',
      source: 'REFERENCE §1.2',
    },
    {
      label: `${t.id} source impedance behind the primary, on the transformer base`,
      formula: 'Z_S,pu = |Z_S| / (V_pri² / S_T)',
      substituted: `Z_S,pu = ${num(magnitudeOf(max.behind.get(t.id)!))} / (${num(t.primary)}² / ${num(t.rating)})`,
      value: sourceImpedancePu,
      unit: 'pu',
      source: 'per-unit convention, REFERENCE §1.3',
    },
    {
      label: `${t.id} through-fault for a secondary bus fault (no secondary-side motors)`,
      formula: 'I = V_LL / (√3 · |Z toward the source|)',
      substituted: `I = ${num(busVolts)} / (1.7320508 × ${num(magnitudeOf(max.toward.get(t.to)!))})`,
      value: through,
      unit: 'A',
      source: 'REFERENCE §1.3, §1.5',
    },
    {
      label: `${t.id} through-fault reflected to the primary`,
      formula: 'I_pri = I_sec · V_sec / V_pri',
      substituted: `I_pri = ${num(through)} × ${num(t.secondary)} / ${num(t.primary)}`,
      value: reflectedToPrimary,
      unit: 'A',
      source: 'REFERENCE §1.7',
    },
    {
      label: `${t.id} secondary L-L fault: largest primary line current (${t.connection})`,
      formula: 'I_pri,line = pu(§1.8) · I_pri,3φ',
      substituted: `I = ${num(Math.max(...lineToLine.primary))} × ${num(reflectedToPrimary)}`,
      value: Math.max(...lineToLine.primaryAmps),
      unit: 'A',
      source: 'REFERENCE §1.8',
    },
    {
      label: `${t.id} secondary L-G fault: largest primary line current (${t.connection})`,
      formula: 'I_pri,line = pu(§1.8) · I_pri,3φ',
      substituted: `I = ${num(Math.max(...lineToGround.primary))} × ${num(reflectedToPrimary)}`,
      value: Math.max(...lineToGround.primaryAmps),
      unit: 'A',
      source: 'REFERENCE §1.8',
    },
  ];
  return withLazyWork(
    {
      transformerId: t.id,
      fullLoadAmps: { primary: primaryFla, secondary: secondaryFla },
      infiniteBusAmps,
      secondaryAmps,
      reflectedToPrimary,
      sourceImpedancePu,
      unbalanced: {
        lineToLine: { secondaryAmps: lineToLine.secondaryAmps[0], primaryLineAmps: lineToLine.primaryAmps },
        lineToGround: { secondaryAmps: lineToGround.secondaryAmps[0], primaryLineAmps: lineToGround.primaryAmps },
      },
      factors: shiftFactorsOf(t.connection),
    },
    work,
  );
}
