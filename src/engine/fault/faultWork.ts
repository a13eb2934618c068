import type { Branch, Network } from '../network/index.ts';
import type { Motor } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import type { FaultLevel } from './faultLevels.ts';
import type { FaultTree } from './faultTree.ts';
import { addImpedance, formatImpedance, magnitudeOf } from './impedance.ts';
import { motorRatingText } from './motorImpedance.ts';
import type { SinglePhaseBus } from './singlePhase.ts';
import { impedanceStep, num } from './workSteps.ts';
import type { ZeroSequenceNetwork } from './zeroSequence.ts';

// The worked calculation behind each bus's fault level, written in the order a person would follow it.
// Every substituted number carries its unit.

const OHMIC = 'ohmic form of the per-unit method (IEEE 141 / IEEE 399)';

/**
 * How many ids a step names before it counts the rest: every motor of a site contributes to the fault
 * at its top bus, and naming them all in each bus's steps made a large study's worked calculations
 * grow with buses × motors.
 */
const NAMED_IDS = 8;

/** Ids for a step's text: a short list whole, a long one as its first few and how many more. */
function idsText(ids: readonly string[]): string {
  if (ids.length <= NAMED_IDS + 2) return ids.join(', ');
  return `${ids.slice(0, NAMED_IDS).join(', ')} and ${ids.length - NAMED_IDS} more`;
}

/** The branches from the source down to a bus, top first. */
function chainTo(network: Network, busId: string): Branch[] {
  const chain: Branch[] = [];
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from))
    chain.unshift(feeder);
  return chain;
}

/** Prefixes each step's label with the condition's name. */
function tag(name: string, steps: readonly WorkStep[]): WorkStep[] {
  return steps.map((s) => ({ ...s, label: `${name}: ${s.label}` }));
}

/**
 * The steps from the source down to the bus: each element, each reflection, each running sum.
 * @example stepsTo(network, tree, 'MCC', 'maximum')
 */
export function stepsTo(network: Network, tree: FaultTree, busId: string, name: string): WorkStep[] {
  const volts = (id: string) => network.buses.get(id)!.voltage;
  const steps = tag(name, tree.steps.get(network.study.source.id)!.steps);
  for (const branch of chainTo(network, busId)) {
    const id = branch.item.id;
    const from = branch.item.from;
    const to = branch.item.to;
    const up = tree.toward.get(from)!;
    const behind = tree.behind.get(id)!;
    if (magnitudeOf({ r: behind.r - up.r, x: behind.x - up.x }) > 1e-9 * magnitudeOf(up)) {
      const motors = motorsAwayFrom(network, tree, from, id);
      steps.push(
        impedanceStep(
          `${name}: toward the source from ${from}, with the motor branches there in parallel (${idsText(motors)})`,
          'Z = 1 / (1/Z_source + Σ 1/Z_motor branch)',
          `Z = 1 / (1/(${formatImpedance(up)} Ω) + Σ 1/Z for ${idsText(motors)})`,
          behind,
          'Ω',
          'motors as parallel sources (IEEE 399 short-circuit chapter)',
        ),
      );
    }
    let carried = behind;
    if (branch.type === 'transformer') {
      const ratio = volts(to) / volts(from);
      carried = { r: behind.r * ratio * ratio, x: behind.x * ratio * ratio };
      steps.push(
        impedanceStep(
          `${name}: referred to ${num(volts(to))} V`,
          'Z_sec = Z_pri · (V_sec / V_pri)²',
          `Z = (${formatImpedance(behind)} Ω) × (${num(volts(to))} V / ${num(volts(from))} V)²`,
          carried,
          'Ω',
          OHMIC,
        ),
      );
    }
    steps.push(...tag(name, tree.steps.get(id)!.steps));
    const total = tree.toward.get(to)!;
    steps.push(
      impedanceStep(
        `${name}: series sum to ${to}`,
        'Z = ΣR + jΣX',
        `Z = (${formatImpedance(carried)} Ω) + (${formatImpedance(tree.branchZ.get(id)!)} Ω)`,
        total,
        'Ω',
        `${OHMIC}, phasor sum`,
      ),
    );
  }
  return steps;
}

/** The ids of the motors counted at `busId` but outside the branch `exceptBranch` (those in parallel with the source there). */
function motorsAwayFrom(network: Network, tree: FaultTree, busId: string, exceptBranch: string): string[] {
  const out: string[] = [];
  const visit = (bus: string) => {
    for (const motor of network.motorsOn.get(bus) ?? []) if (tree.motorZ.has(motor.id)) out.push(motor.id);
    for (const branch of network.branchesFrom.get(bus) ?? [])
      if (branch.item.id !== exceptBranch && !(branch.type === 'transformer' && branch.item.phases === 1))
        visit(branch.item.to);
  };
  visit(busId);
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from)) {
    const from = feeder.item.from;
    for (const motor of network.motorsOn.get(from) ?? []) if (tree.motorZ.has(motor.id)) out.push(motor.id);
    for (const branch of network.branchesFrom.get(from) ?? [])
      if (branch.item.id !== feeder.item.id && !(branch.type === 'transformer' && branch.item.phases === 1))
        visit(branch.item.to);
  }
  return out.length > 0 ? out : ['motor branches'];
}

/** The motors at and below a bus (not past a single-phase transformer). */
function motorsBelow(network: Network, tree: FaultTree, busId: string): string[] {
  const out: string[] = [];
  const visit = (bus: string) => {
    for (const motor of network.motorsOn.get(bus) ?? []) if (tree.motorZ.has(motor.id)) out.push(motor.id);
    for (const branch of network.branchesFrom.get(bus) ?? [])
      if (!(branch.type === 'transformer' && branch.item.phases === 1)) visit(branch.item.to);
  };
  visit(busId);
  return out;
}

/**
 * Each motor's first-cycle contribution, as the first of its own steps; motors whose contributions are
 * worked out alike (the same rating, multiple and voltage) in one step, "each", with their ids and count.
 */
function contributionSteps(name: string, network: Network, tree: FaultTree, motorIds: readonly string[]): WorkStep[] {
  const alike = new Map<string, { ids: string[]; motor: Motor; volts: number; step: WorkStep }>();
  for (const id of motorIds) {
    const step = tree.steps.get(id)!.steps[0];
    const motor = network.elements.get(id)!.item as Motor;
    const volts = network.buses.get(motor.bus)!.voltage;
    const key = `${volts}|${step.substituted}|${step.value}`;
    const group = alike.get(key);
    if (group) group.ids.push(id);
    else alike.set(key, { ids: [id], motor, volts, step });
  }
  return [...alike.values()].map(({ ids, motor, volts, step }) => ({
    ...step,
    label:
      ids.length === 1
        ? `${name}: ${step.label}`
        : `${name}: ${idsText(ids)} (${ids.length} motors of ${motorRatingText(motor)}) first-cycle contribution at ${num(volts)} V, each`,
  }));
}

/**
 * The zero-sequence steps from the grounding point down to the bus.
 * @example zeroSequenceStepsTo(network, zeroMax, 'MCC', 'maximum')
 */
export function zeroSequenceStepsTo(
  network: Network,
  zero: ZeroSequenceNetwork,
  busId: string,
  name: string,
): WorkStep[] {
  const steps: WorkStep[] = [];
  const chain = chainTo(network, busId);
  // Start at the lowest element that starts a zero-sequence path afresh: a transformer other than Yg–Yg, else the source.
  let first = -1;
  chain.forEach((branch, i) => {
    if (branch.type === 'transformer' && branch.item.connection !== 'wye-wye') first = i;
  });
  if (first < 0) steps.push(...tag(name, zero.steps.get(network.study.source.id)?.steps ?? []));
  for (const branch of chain.slice(Math.max(first, 0))) {
    steps.push(...tag(name, zero.steps.get(branch.item.id)?.steps ?? []));
    const z0 = zero.atBus.get(branch.item.to);
    if (branch.type === 'cable' && z0)
      steps.push(
        impedanceStep(
          `${name}: zero-sequence series sum to ${branch.item.to}`,
          'Z0 = ΣR0 + jΣX0',
          `Z0 = (${formatImpedance(zero.atBus.get(branch.item.from)!)} Ω at ${branch.item.from}) + (Z0 of ${branch.item.id})`,
          z0,
          'Ω',
          'zero-sequence network (IEEE 399 short-circuit chapter)',
        ),
      );
  }
  return steps;
}

/**
 * The closing steps at a three-phase bus: the motors counted, motor branches in parallel, then the currents.
 * @example faultSteps('maximum', 480, maxTree, network, 'MCC', level)
 */
export function faultSteps(
  name: string,
  volts: number,
  tree: FaultTree,
  network: Network,
  busId: string,
  level: FaultLevel,
): WorkStep[] {
  const steps: WorkStep[] = [];
  const toward = tree.toward.get(busId)!;
  const below = tree.below.get(busId);
  if (below) {
    const motors = motorsBelow(network, tree, busId);
    steps.push(...contributionSteps(name, network, tree, motors));
    steps.push(
      impedanceStep(
        `${name}: motor branches at and below the bus (${idsText(motors)}), reduced`,
        'Z_M,eq = 1 / Σ 1/Z_M',
        `Z_M,eq = 1 / Σ 1/Z over ${idsText(motors)} (each with its cable)`,
        below,
        'Ω',
        'motors as parallel sources (IEEE 399 short-circuit chapter)',
      ),
    );
    steps.push(
      impedanceStep(
        `${name}: Thevenin impedance at the fault`,
        'Z_th = Z_source · Z_M,eq / (Z_source + Z_M,eq)',
        `Z_th = (${formatImpedance(toward)} Ω) ∥ (${formatImpedance(below)} Ω)`,
        level.impedance,
        'Ω',
        'motors as parallel sources (IEEE 399 short-circuit chapter)',
      ),
    );
  }
  const z = level.impedance;
  steps.push(
    {
      label: `${name}: three-phase bolted fault`,
      formula: 'I_3φ = V_LL / (√3 · |Z1|)',
      substituted: `I_3φ = ${num(volts)} V / (1.7320508 × ${num(magnitudeOf(z))} Ω)`,
      value: level.threePhase,
      unit: 'A',
      source: OHMIC,
    },
    {
      label: `${name}: X/R at the fault`,
      formula: 'X/R = ΣX / ΣR',
      substituted: `X/R = ${num(z.x)} Ω / ${num(z.r)} Ω`,
      value: level.xr,
      unit: '',
      source: OHMIC,
    },
    {
      label: `${name}: line-to-line bolted fault`,
      formula: 'I_LL = √3 · E / |Z1 + Z2|, Z2 = Z1',
      substituted: `I_LL = ${num(volts)} V / (2 × ${num(magnitudeOf(z))} Ω)`,
      value: level.lineToLine,
      unit: 'A',
      source: 'symmetrical components, Z2 = Z1 (IEEE 399 short-circuit chapter)',
    },
  );
  const z0 = level.zeroSequence;
  if (z0 && level.lineToGround > 0) {
    const loop = addImpedance(z, z, z0);
    steps.push({
      label: `${name}: line-to-ground bolted fault`,
      formula: 'I_LG = 3 · V_LN / |Z1 + Z2 + Z0| = √3 · V_LL / |2·Z1 + Z0|',
      substituted: `I_LG = 1.7320508 × ${num(volts)} V / |2 × (${formatImpedance(z)}) Ω + (${formatImpedance(z0)}) Ω| = 1.7320508 × ${num(volts)} V / ${num(magnitudeOf(loop))} Ω`,
      value: level.lineToGround,
      unit: 'A',
      source: 'symmetrical components (IEEE 399 short-circuit chapter)',
    });
  } else {
    steps.push({
      label: `${name}: line-to-ground fault on an ungrounded (delta or ungrounded-wye) system`,
      formula: 'I_LG = 0 (no zero-sequence path)',
      substituted: 'I_LG = 0 A',
      value: 0,
      unit: 'A',
      source: 'IEEE 142: an ungrounded system draws only charging current',
    });
  }
  return steps;
}

/**
 * The closing steps at a single-phase bus: the full-winding fault and the line-to-neutral (or grounded-leg) fault.
 * @example singlePhaseSteps('maximum', bus, level)
 */
export function singlePhaseSteps(name: string, bus: SinglePhaseBus, level: FaultLevel): WorkStep[] {
  const steps: WorkStep[] = [
    {
      label: `${name}: full-winding (line-to-line) fault, ${bus.system}`,
      formula: 'I = V / |Z_loop|',
      substituted: `I = ${num(bus.lineToLine.volts)} V / ${num(magnitudeOf(bus.lineToLine.z))} Ω`,
      value: level.lineToLine,
      unit: 'A',
      source: OHMIC,
    },
  ];
  if (bus.lineToGround)
    steps.push({
      label: `${name}: line-to-${bus.lineToGround.volts < bus.lineToLine.volts ? 'neutral (half-winding)' : 'ground (grounded leg)'} fault`,
      formula: 'I = V / |Z_loop|',
      substituted: `I = ${num(bus.lineToGround.volts)} V / ${num(magnitudeOf(bus.lineToGround.z))} Ω`,
      value: level.lineToGround,
      unit: 'A',
      source: OHMIC,
    });
  return steps;
}
