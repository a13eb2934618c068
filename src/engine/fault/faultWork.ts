import type { Branch, Network } from '../network/index.ts';
import type { WorkStep } from '../work.ts';
import type { FaultLevel } from './faultLevels.ts';
import type { FaultTree } from './faultTree.ts';
import { formatImpedance, magnitudeOf, type Impedance } from './impedance.ts';
import { impedanceStep, num } from './workSteps.ts';

// The worked calculation behind each bus's fault level, written in the order a person would follow it.

/**
 * The steps from the source down to the bus: each element, each reflection, each running sum.
 * @example stepsTo(network, tree, 'MCC', 'maximum')
 */
export function stepsTo(network: Network, tree: FaultTree, busId: string, name: string): WorkStep[] {
  const chain: Branch[] = [];
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from))
    chain.unshift(feeder);
  const volts = (id: string) => network.buses.get(id)!.voltage;
  const tag = (steps: WorkStep[]) => steps.map((s) => ({ ...s, label: `${name}: ${s.label}` }));
  const steps = tag(tree.steps.get(network.study.source.id)!.steps);
  for (const branch of chain) {
    const id = branch.item.id;
    const from = branch.item.from;
    const to = branch.item.to;
    const up = tree.toward.get(from)!;
    const behind = tree.behind.get(id)!;
    if (magnitudeOf({ r: behind.r - up.r, x: behind.x - up.x }) > 1e-9 * magnitudeOf(up))
      steps.push(
        impedanceStep(
          `${name}: toward the source from ${from}, with the motor branches there in parallel`,
          'Z = 1 / (1/Z_source + Σ 1/Z_motor branch)',
          `Z = 1 / (1/(${formatImpedance(up)}) + motor branches at ${from})`,
          behind,
          'Ω',
        ),
      );
    let carried = behind;
    if (branch.type === 'transformer') {
      const ratio = volts(to) / volts(from);
      carried = { r: behind.r * ratio * ratio, x: behind.x * ratio * ratio };
      steps.push(
        impedanceStep(
          `${name}: referred to ${num(volts(to))} V`,
          'Z_sec = Z_pri · (V_sec / V_pri)²',
          `Z = (${formatImpedance(behind)}) × (${num(volts(to))} / ${num(volts(from))})²`,
          carried,
          'Ω',
          'REFERENCE §1.3',
        ),
      );
    }
    steps.push(...tag(tree.steps.get(id)!.steps));
    const total = tree.toward.get(to)!;
    steps.push(
      impedanceStep(
        `${name}: series sum to ${to}`,
        'Z = ΣR + jΣX',
        `Z = (${formatImpedance(carried)}) + (${formatImpedance(tree.branchZ.get(id)!)})`,
        total,
        'Ω',
        'REFERENCE §1.3, phasor sum',
      ),
    );
  }
  return steps;
}

/**
 * The closing steps at the bus: motor branches in parallel, then the currents.
 * @example faultSteps('maximum', 480, toward, below, level)
 */
export function faultSteps(
  name: string,
  volts: number,
  toward: Impedance,
  below: Impedance | undefined,
  level: FaultLevel,
) {
  const steps: WorkStep[] = [];
  if (below) {
    steps.push(
      impedanceStep(
        `${name}: motor branches at and below the bus, reduced`,
        'Z_M,eq = 1 / Σ 1/Z_M',
        'Z_M,eq',
        below,
        'Ω',
      ),
    );
    steps.push(
      impedanceStep(
        `${name}: Thevenin impedance at the fault`,
        'Z_th = Z_source · Z_M,eq / (Z_source + Z_M,eq)',
        `Z_th = (${formatImpedance(toward)}) ∥ (${formatImpedance(below)})`,
        level.impedance,
        'Ω',
        'motors as parallel sources, REFERENCE §1.5',
      ),
    );
  }
  const z = level.impedance;
  steps.push(
    {
      label: `${name}: three-phase bolted fault`,
      formula: 'I_3φ = V_LL / (√3 · |Z_th|)',
      substituted: `I_3φ = ${num(volts)} / (1.7320508 × ${num(magnitudeOf(z))})`,
      value: level.threePhase,
      unit: 'A',
      source: 'REFERENCE §1.3 ohmic method',
    },
    {
      label: `${name}: X/R at the fault`,
      formula: 'X/R = ΣX / ΣR',
      substituted: `X/R = ${num(z.x)} / ${num(z.r)}`,
      value: level.xr,
      unit: '',
    },
    {
      label: `${name}: line-to-line bolted fault`,
      formula: 'I_LL = 0.866 · I_3φ',
      substituted: `I_LL = 0.8660254 × ${num(level.threePhase)}`,
      value: level.lineToLine,
      unit: 'A',
      source: 'REFERENCE §1.2, Z2 = Z1',
    },
    level.lineToGround > 0
      ? {
          label: `${name}: line-to-ground bolted fault, solidly grounded wye`,
          formula: 'I_LG = 3·V_LN / |Z1 + Z2 + Z0| ≈ I_3φ with Z0 = Z1',
          substituted: 'I_LG ≈ I_3φ',
          value: level.lineToGround,
          unit: 'A',
          source: 'REFERENCE §1.2, Z0 = Z1 common practice',
        }
      : {
          label: `${name}: line-to-ground fault on a delta (ungrounded) system`,
          formula: 'I_LG = 0',
          substituted: 'I_LG = 0',
          value: 0,
          unit: 'A',
        },
  );
  return steps;
}
