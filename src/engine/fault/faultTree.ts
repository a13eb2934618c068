import { cableImpedanceOf } from '../conductors/cableImpedance.ts';
import { closedSwitchLinks, type Branch, type Network } from '../network/index.ts';
import type { Cable } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { MAXIMUM_FAULT_TEMPERATURE, MINIMUM_FAULT_TEMPERATURE } from './conductorTemperatures.ts';
import { addImpedance, invertImpedance, ParallelSum, ZERO_IMPEDANCE, type Impedance } from './impedance.ts';
import { motorImpedanceOf } from './motorImpedance.ts';
import { reflectImpedance } from './reflect.ts';
import { sourceLevelsOf } from './sourceLevels.ts';
import { sourceImpedanceOf, type SourceLevel } from './sourceImpedance.ts';
import { transformerImpedanceOf } from './transformerImpedance.ts';

/** The source and element assumptions of one fault condition (IEEE 141 / IEEE 399 maximum and minimum duty, common practice). */
export interface FaultCondition {
  /** 'max': maximum source, motors in, the study's maximum-fault conductor temperature; 'min': minimum source, no motors, its minimum-fault one. */
  kind: 'max' | 'min';
  /** The utility figure used; undefined for an infinite source. */
  level?: SourceLevel;
  /** Whether motors contribute (first cycle). */
  motors: boolean;
  /** Conductor temperature for cable resistance (°C). */
  temperature: number;
  /** Whether transformers flagged `impedanceTolerance` use 92.5 % of nameplate %Z. */
  toleranced: boolean;
}

/**
 * The tree reduced for one condition, every impedance in ohms at its own bus's nominal voltage.
 * `toward` is the Thevenin impedance looking from a bus toward the source (the source path with
 * every motor branch not below the bus in parallel); `below` the motors at and below a bus, as one
 * branch (undefined where there are none); `behind` a branch's impedance as seen from its `from`
 * bus with the branch's own subtree removed.
 */
export interface FaultTree {
  /** The condition the tree was reduced for. */
  condition: FaultCondition;
  order: string[];
  toward: Map<string, Impedance>;
  below: Map<string, Impedance | undefined>;
  behind: Map<string, Impedance>;
  /** Series impedance of each branch: cables in ohms, transformers in ohms at the secondary. */
  branchZ: Map<string, Impedance>;
  /** The steps that produce each element's own impedance (source, branch, motor), by id; worked out when read. */
  steps: ElementSteps;
  /** Motor first-cycle impedance by motor id (when the condition counts motors). */
  motorZ: Map<string, Impedance>;
}

/**
 * The steps behind the own impedance of each element of a tree, by id (the source, a branch, a motor
 * where the condition counts motors): worked out again when read, not kept, since a study has
 * thousands of elements whose steps are seldom opened.
 */
export interface ElementSteps {
  get(id: string): { readonly steps: WorkStep[] } | undefined;
}

/**
 * Reduces the radial tree for one condition in two passes (a Thevenin reduction): leaves to source,
 * gathering motor branches; then source to leaves, putting each bus's source path in parallel with
 * the motor branches hanging elsewhere. Linear in the number of elements. `elementsFrom`, a tree
 * reduced with the same source level, conductor temperature and tolerance, lends its element
 * impedances and their steps (the maximum fault without motors takes those of the maximum fault).
 *
 * @example faultTreeOf(network, { kind: 'max', level: study.source.max, motors: true, temperature: 20, toleranced: true }).toward.get('SWBD')
 */
export function faultTreeOf(network: Network, condition: FaultCondition, elementsFrom?: FaultTree): FaultTree {
  const { study } = network;
  const volts = (busId: string) => network.buses.get(busId)!.voltage;
  const steps: ElementSteps = { get: (id) => elementStepsOf(network, condition, id) };
  const branchZ = new Map<string, Impedance>();
  const motorZ = new Map<string, Impedance>();

  // Element impedances for this condition: taken from a tree with the same source, conductor
  // temperature and tolerance where one is given (the maximum fault without motors), else computed.
  const root = study.source.bus;
  if (elementsFrom && sameElements(elementsFrom.condition, condition)) {
    for (const [id, z] of elementsFrom.branchZ) branchZ.set(id, z);
  } else {
    elementImpedances(network, condition, branchZ);
  }
  if (condition.motors)
    for (const motor of study.motors) motorZ.set(motor.id, motorImpedanceOf(motor, volts(motor.bus)).z);

  // Breadth-first order from the source bus.
  const order = [root];
  for (let i = 0; i < order.length; i++)
    for (const branch of network.branchesFrom.get(order[i]) ?? []) order.push(branch.item.to);

  // Leaves to source: the motors at and below each bus, as one branch seen from it.
  const below = new Map<string, Impedance | undefined>();
  const feeding = new Map<string, Impedance | undefined>();
  // The motors on a bus and the branches below it in parallel (motors first, then branches), summed
  // term by term without a list of terms per bus: a study has thousands.
  const sum = new ParallelSum();
  const addBusTerms = (bus: string, branches: readonly Branch[]) => {
    for (const motor of network.motorsOn.get(bus) ?? []) sum.add(motorZ.get(motor.id));
    for (const branch of branches) sum.add(feeding.get(branch.item.id));
  };
  for (let i = order.length - 1; i >= 0; i--) {
    const bus = order[i];
    const branches = network.branchesFrom.get(bus) ?? NO_BRANCHES;
    for (const branch of branches) {
      // A single-phase transformer's load side is not a balanced source: its motors feed no three-phase fault.
      const child = isSinglePhase(branch) ? undefined : below.get(branch.item.to);
      feeding.set(
        branch.item.id,
        child && seenFromParent(branch, addImpedance(branchZ.get(branch.item.id)!, child), volts),
      );
    }
    sum.clear();
    addBusTerms(bus, branches);
    below.set(bus, sum.impedance());
  }

  // Source to leaves: everything but a branch's own subtree, seen from its `from` bus.
  const toward = new Map<string, Impedance>([[root, branchZ.get(study.source.id)!]]);
  const behind = new Map<string, Impedance>();
  for (const bus of order) {
    const up = toward.get(bus)!;
    const branches = network.branchesFrom.get(bus) ?? NO_BRANCHES;
    sum.clear();
    sum.add(up);
    addBusTerms(bus, branches);
    const all = admittanceOf(sum.impedance());
    for (const branch of branches) {
      const own = admittanceOf(feeding.get(branch.item.id));
      const rest = up.r === 0 && up.x === 0 ? ZERO_IMPEDANCE : invertImpedance({ r: all.r - own.r, x: all.x - own.x });
      behind.set(branch.item.id, rest);
      const to = branch.item.to;
      const z = branchZ.get(branch.item.id)!;
      toward.set(
        to,
        branch.type === 'transformer'
          ? addImpedance(reflectImpedance(rest, volts(bus), volts(to)), z)
          : addImpedance(rest, z),
      );
    }
  }
  return { condition, order, toward, below, behind, branchZ, steps, motorZ };
}

/** The source's, cables', closed links' and transformers' own impedances for a condition. */
function elementImpedances(network: Network, condition: FaultCondition, branchZ: Map<string, Impedance>): void {
  const { study } = network;
  branchZ.set(study.source.id, sourceOf(network, condition).z);
  study.cables.forEach((cable, i) => branchZ.set(cable.id, cableOf(cable, i, condition).z));
  for (const link of closedSwitchLinks(study.switches)) branchZ.set(link.id, ZERO_IMPEDANCE);
  for (const t of study.transformers)
    branchZ.set(t.id, transformerImpedanceOf(t, { toleranced: condition.toleranced }).z);
}

/** The steps behind one element's own impedance in a tree for `condition` (see `ElementSteps`). */
function elementStepsOf(
  network: Network,
  condition: FaultCondition,
  id: string,
): { readonly steps: WorkStep[] } | undefined {
  const { study } = network;
  if (id === study.source.id) return sourceOf(network, condition);
  const element = network.elements.get(id);
  switch (element?.type) {
    case 'cable':
      return cableOf(element.item, study.cables.indexOf(element.item), condition);
    case 'transformer':
      return transformerImpedanceOf(element.item, { toleranced: condition.toleranced });
    case 'switch': {
      const link = element.item;
      const step = {
        label: `${link.id}: closed switch from ${link.from} to ${link.to}, no impedance`,
        formula: 'Z = 0',
        substituted: 'Z = 0',
        value: 0,
        unit: 'Ω',
      };
      return { steps: [step] };
    }
    case 'motor':
      return condition.motors
        ? motorImpedanceOf(element.item, network.buses.get(element.item.bus)!.voltage)
        : undefined;
    default:
      return undefined;
  }
}

/** The source's impedance for a condition, with its steps: none for an infinite source. */
function sourceOf(network: Network, condition: FaultCondition): { z: Impedance; readonly steps: WorkStep[] } {
  const { source } = network.study;
  if (!condition.level) {
    const step = { label: 'infinite source', formula: 'Z_U = 0', substituted: 'Z_U = 0', value: 0, unit: 'Ω' };
    return { z: ZERO_IMPEDANCE, steps: [step] };
  }
  return sourceImpedanceOf(condition.level, network.buses.get(source.bus)!.voltage, sourceLevelsOf(source).label);
}

/** A cable's impedance at the condition's conductor temperature, with its steps (`index` names it in messages). */
function cableOf(cable: Cable, index: number, condition: FaultCondition): { z: Impedance; readonly steps: WorkStep[] } {
  return cableImpedanceOf(cable, {
    temperature: condition.temperature,
    temperatureBasis: temperatureBasisOf(condition),
    path: `study.cables[${index}]`,
  });
}

/** Why a condition's cables are taken at its temperature: the default's source, or the study's own setting. */
function temperatureBasisOf({ kind, temperature }: FaultCondition): string {
  if (kind === 'max')
    return temperature === MAXIMUM_FAULT_TEMPERATURE
      ? 'maximum fault: IEC 60909-0 takes line resistance at 20 °C for the maximum short-circuit currents'
      : "maximum fault: the study's conductor temperature (conductorTemperatures.maximumFault)";
  return temperature === MINIMUM_FAULT_TEMPERATURE
    ? 'minimum fault: conductors at operating temperature, common practice'
    : "minimum fault: the study's conductor temperature (conductorTemperatures.minimumFault)";
}

/** Whether two conditions give every element but the motors the same impedance. */
function sameElements(a: FaultCondition, b: FaultCondition): boolean {
  return a.level === b.level && a.temperature === b.temperature && a.toleranced === b.toleranced;
}

/** A branch's series impedance plus what hangs below it, referred to the branch's `from` bus. */
function seenFromParent(branch: Branch, z: Impedance, volts: (busId: string) => number): Impedance {
  return branch.type === 'transformer' ? reflectImpedance(z, volts(branch.item.to), volts(branch.item.from)) : z;
}

/** Whether a branch is a single-phase transformer (its load side is computed as single-phase loops). */
export function isSinglePhase(branch: Branch): boolean {
  return branch.type === 'transformer' && branch.item.phases === 1;
}

const NO_BRANCHES: readonly Branch[] = [];

/** Admittance of an impedance; zero for an open circuit (undefined). */
function admittanceOf(z: Impedance | undefined): Impedance {
  return z ? invertImpedance(z) : ZERO_IMPEDANCE;
}
