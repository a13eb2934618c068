import type { Network } from '../network/index.ts';
import type { Work } from '../work.ts';
import type { WorkStep } from '../work.ts';
import { sourceLevelsOf } from './sourceLevels.ts';
import { faultTreeOf, type FaultTree } from './faultTree.ts';
import { faultSteps, singlePhaseSteps, stepsTo, zeroSequenceStepsTo } from './faultWork.ts';
import {
  addImpedance,
  divideComplex,
  magnitudeOf,
  multiplyComplex,
  parallelImpedance,
  xrOf,
  type Impedance,
} from './impedance.ts';
import { primaryConnectionOf, singlePhaseBusesOf, type SinglePhaseBus } from './singlePhase.ts';
import { transformerFaultOf } from './transformerFault.ts';
import { withLazyWork } from './workSteps.ts';
import { zeroSequenceOf } from './zeroSequence.ts';

/**
 * Bolted fault currents at one bus for one condition (maximum or minimum); amps symmetrical RMS at the
 * bus's nominal voltage. Readers of fault duty (interrupting rating, sensitivity, ranges) read these.
 *
 * On a three-phase bus: `threePhase`, `lineToLine` and `lineToGround` are the three bolted faults from
 * the sequence networks (Z2 = Z1). On a single-phase bus (below a single-phase transformer; `BusFault.phases`
 * is 1) there is no three-phase fault: `threePhase` and `lineToLine` both hold the full-winding
 * (line-to-line) fault, the one that reflects across the transformer by its voltage ratio, and
 * `lineToGround` the line-to-neutral fault (half winding on a centre-tapped secondary). `largest` is the
 * largest of them for duty checks.
 *
 * @example faults.buses.get('SWBD')!.max.lineToGround // A at 480 V
 */
export interface FaultLevel {
  /** Three-phase bolted fault (A); on a single-phase bus the full-winding line-to-line fault. */
  threePhase: number;
  /** Line-to-line bolted fault (A): `√3/2 · I_3φ` exactly (Z2 = Z1); on a single-phase bus the full-winding fault. */
  lineToLine: number;
  /**
   * Line-to-ground bolted fault (A): `3·V_LN / |Z1 + Z2 + Z0|` from the zero-sequence network (source,
   * transformer connection, neutral grounding, cables); 0 where no zero-sequence path reaches the bus
   * (delta or ungrounded systems). On a single-phase bus the line-to-neutral (or grounded-leg) fault.
   */
  lineToGround: number;
  /** The largest of the bolted faults above (A): the duty a device at the bus must interrupt. */
  largest: number;
  /** How much motors add to the three-phase (full-winding) fault (A); 0 at minimum. */
  motorAmps: number;
  /** ΣX/ΣR of the three-phase (single-phase: full-winding loop) fault; `Infinity` with no resistance. */
  xr: number;
  /** X/R of the line-to-ground loop, `(2X1 + X0) / (2R1 + R0)` (single-phase: the line-to-neutral loop); NaN where `lineToGround` is 0. */
  lineToGroundXr: number;
  /** Positive-sequence Thevenin impedance at the fault (Ω at the bus voltage); single-phase: the full-winding loop. */
  impedance: Impedance;
  /** Zero-sequence Thevenin impedance (Ω at the bus voltage, neutral impedance as 3·Zn included); undefined with no path. Single-phase: the line-to-neutral loop. */
  zeroSequence?: Impedance;
}

/** Fault currents at one bus, with the work behind them. */
export interface BusFault {
  busId: string;
  /** Nominal line-to-line voltage (V); for a single-phase bus the full-winding voltage (240 V for 120/240 V). */
  volts: number;
  /** 3 for a three-phase bus; 1 for a bus below a single-phase transformer. */
  phases: 1 | 3;
  /** What the levels describe, in words: "three-phase", "single-phase 120/240 V centre-tapped", … */
  system: string;
  max: FaultLevel;
  min: FaultLevel;
  /**
   * For each voltage level on the bus's path to the source, the max/min current a fault at the bus draws
   * through the nearest transformer fed at that level, as a line current there (A at each entry's
   * `volts`): the three-phase (single-phase: full-winding) fault less what motors on the far side of that
   * transformer feed, which never passes through it.
   */
  reflected: { volts: number; maxAmps: number; minAmps: number }[];
  work: Work;
}

/** A transformer's secondary fault duty and its primary-side picture. */
export interface TransformerFault {
  transformerId: string;
  /** Rated full-load current of each winding (A). */
  fullLoadAmps: { primary: number; secondary: number };
  /** `FLA_sec × 100 / %Z` at the secondary (A), with the −7.5 % tolerance when the transformer asks for it. */
  infiniteBusAmps: number;
  /** Maximum three-phase fault at the secondary bus (A), motors included. */
  secondaryAmps: number;
  /** The part of that fault flowing through the transformer, at the primary voltage (A). */
  reflectedToPrimary: number;
  /** Source impedance behind the primary, per unit on the transformer's base (IEEE C57.109 Cat. III/IV). */
  sourceImpedancePu: number;
  /** Secondary L-L and L-G faults through the transformer, and the primary line currents they cause (A). */
  unbalanced: {
    lineToLine: { secondaryAmps: number; primaryLineAmps: number[] };
    lineToGround: { secondaryAmps: number; primaryLineAmps: number[] };
  };
  /** Sheet shift factors (IEEE C37.91 / C57.109 practice, exact values; see `shiftFactorsOf`). */
  factors: { lineToLineDeviceShift: number; withstandShift: number };
  work: Work;
}

/** Every bus's and transformer's fault results, and warnings about the model. */
export interface FaultLevels {
  buses: Map<string, BusFault>;
  transformers: Map<string, TransformerFault>;
  diagnostics: string[];
  /** The reduced positive-sequence networks behind the levels, for current division (`throughFaultOf`). */
  trees: { max: FaultTree; min: FaultTree };
}

/**
 * Fault levels at every bus of a radial network by the ohmic form of the per-unit method (IEEE 141 /
 * IEEE 399): series impedances added as complex values, motors as parallel sources anywhere in the
 * tree, unbalanced faults from symmetrical components with Z2 = Z1 and the zero-sequence network of
 * `zeroSequenceOf`; buses below a single-phase transformer as single-phase loops (`singlePhaseBusesOf`).
 * Maximum: `max` source, motors in, conductors at the study's maximum-fault temperature (20 °C unless
 * set; NEC Table 9 corrected), %Z tolerance where asked. Minimum: `min` source (else `max`), no motors,
 * conductors at the study's minimum-fault temperature (90 °C unless set).
 *
 * @example faultLevelsOf(networkOf(study)).buses.get('SWBD')!.max.lineToGround // A at 480 V
 */
export function faultLevelsOf(network: Network): FaultLevels {
  const { study } = network;
  const source = study.source;
  const { max: maxLevel, min: minLevel, minPath, minKeepsMaxZ0 } = sourceLevelsOf(source);
  const max = faultTreeOf(network, {
    kind: 'max',
    level: maxLevel,
    motors: true,
    temperature: study.conductorTemperatures.maximumFault,
    toleranced: true,
  });
  // The maximum fault without motors, for the motors' share: the same elements as `max`, taken from it.
  const withoutMotors = threePhaseAmpsOf(network, faultTreeOf(network, { ...max.condition, motors: false }, max));
  const min = faultTreeOf(network, {
    kind: 'min',
    level: minLevel,
    motors: false,
    temperature: study.conductorTemperatures.minimumFault,
    toleranced: false,
  });
  const zeroMax = zeroSequenceOf(network, max, maxLevel);
  const keptZ0 = minKeepsMaxZ0 ? zeroMax.atBus.get(source.bus) : undefined;
  const zeroMin = zeroSequenceOf(network, min, minLevel, minPath, keptZ0);
  const singleMax = singlePhaseBusesOf(network, max, zeroMax, true);
  const singleMin = singlePhaseBusesOf(network, min, zeroMin, false);

  const diagnostics: string[] = [];
  if (source.kind === 'infinite')
    diagnostics.push(`${source.id}: infinite source, so the fault current at bus ${source.bus} is unbounded`);
  for (const t of study.transformers)
    if (
      t.grounding.kind !== 'solid' &&
      t.phases === 3 &&
      (t.connection === 'delta-delta' || t.connection === 'wye-delta')
    )
      diagnostics.push(`${t.id}: ${t.connection} secondary is ungrounded; its grounding entry is not used`);
  for (const motor of study.motors)
    if (singleMax.has(motor.bus))
      diagnostics.push(`${motor.id}: motors on single-phase bus ${motor.bus} are not counted as fault sources`);

  // Each bus's work is written when first read, by one builder for all buses, which reads the bus from
  // the fault it is given (a closure per bus, with what it held, was a fifth of what the levels keep).
  const threePhaseWork = (fault: Omit<BusFault, 'work'>) => [
    ...stepsTo(network, max, fault.busId, 'maximum'),
    ...zeroSequenceStepsTo(network, zeroMax, fault.busId, 'maximum'),
    ...faultSteps('maximum', fault.volts, max, network, fault.busId, fault.max),
    ...stepsTo(network, min, fault.busId, 'minimum'),
    ...zeroSequenceStepsTo(network, zeroMin, fault.busId, 'minimum'),
    ...faultSteps('minimum', fault.volts, min, network, fault.busId, fault.min),
  ];
  const singlePhaseWork = (fault: Omit<BusFault, 'work'>) => {
    const single = singleMax.get(fault.busId)!;
    const singleLow = singleMin.get(fault.busId)!;
    return [
      ...tagged('maximum', single.steps),
      ...singlePhaseSteps('maximum', single, fault.max),
      ...tagged('minimum', singleLow.steps),
      ...singlePhaseSteps('minimum', singleLow, fault.min),
    ];
  };
  const buses = new Map<string, BusFault>();
  for (const busId of max.order) {
    const volts = network.buses.get(busId)!.voltage;
    const single = singleMax.get(busId);
    if (single) {
      const singleLow = singleMin.get(busId)!;
      const maxAt = singlePhaseLevel(single);
      const minAt = singlePhaseLevel(singleLow);
      const fault = {
        busId,
        volts,
        phases: 1 as const,
        system: single.system,
        max: maxAt,
        min: minAt,
        reflected: reflectedOf(network, { max, min }, singleMax, busId, maxAt, minAt),
      };
      buses.set(busId, withLazyWork(fault, singlePhaseWork));
      continue;
    }
    const maxAt = levelAt(network, max, busId, zeroMax.atBus.get(busId), withoutMotors.get(busId)!);
    const minAt = levelAt(network, min, busId, zeroMin.atBus.get(busId), 0);
    // A literal, not `{ ...levels, reflected }`: V8 gives each object made by spreading and adding a
    // field a hidden class of its own, and every check reads these.
    const fault = {
      busId,
      volts,
      phases: 3 as const,
      system: 'three-phase',
      max: maxAt,
      min: minAt,
      reflected: reflectedOf(network, { max, min }, singleMax, busId, maxAt, minAt),
    };
    buses.set(busId, withLazyWork(fault, threePhaseWork));
  }

  const transformers = new Map(
    study.transformers.map((t) => [t.id, transformerFaultOf(t, network, max, buses.get(t.to)!)]),
  );
  return { buses, transformers, diagnostics, trees: { max, min } };
}

/** Tags element steps with the condition's name. */
function tagged(name: string, steps: WorkStep[]): WorkStep[] {
  return steps.map((s) => ({ ...s, label: `${name}: ${s.label}` }));
}

/**
 * The current a fault at `busId` draws through each transformer on its path to the source, at the
 * transformer's primary (one entry per voltage, the nearest transformer's; the bus's own voltage
 * excepted). Motors are parallel sources at their buses (IEEE 399 / IEEE 141), so on a three-phase bus
 * it starts from the current arriving from the feeder, `E / Z_toward`, not the bus total, and at each
 * bus above keeps the share `Z_behind / Z_toward` that comes from that bus's own feeder (current
 * division in the positive-sequence network); on a single-phase bus from the whole loop current. The
 * balanced line current then moves by `V_bus / V_winding` at each transformer crossed, the winding
 * voltage being the line-to-neutral voltage for a single-phase unit connected line to neutral.
 */
function reflectedOf(
  network: Network,
  trees: { max: FaultTree; min: FaultTree },
  singlePhase: ReadonlyMap<string, unknown>,
  busId: string,
  max: FaultLevel,
  min: FaultLevel,
): BusFault['reflected'] {
  const out: BusFault['reflected'] = [];
  const own = network.buses.get(busId)!.voltage;
  const single = singlePhase.has(busId);
  const arriving = (tree: FaultTree, level: FaultLevel) =>
    single ? level.threePhase : ampsOf(own / Math.sqrt(3), tree.toward.get(busId)!);
  const maxArriving = arriving(trees.max, max);
  const minArriving = arriving(trees.min, min);
  let maxShare: Impedance = ONE;
  let minShare: Impedance = ONE;
  let toNeutral = false;
  let factor = 1;
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from)) {
    const from = feeder.item.from;
    const threePhaseFrom = !singlePhase.has(from);
    if (feeder.type === 'transformer') {
      const t = feeder.item;
      const fromVolts = network.buses.get(from)!.voltage;
      // A single-phase unit on a three-phase bus: its primary winding may sit line to neutral.
      const lineToNeutral = t.phases === 1 && threePhaseFrom && primaryConnectionOf(t, fromVolts) === 'line-to-neutral';
      toNeutral ||= lineToNeutral;
      factor *= network.buses.get(t.to)!.voltage / (lineToNeutral ? fromVolts / Math.sqrt(3) : fromVolts);
      if (fromVolts !== own && !out.some((r) => r.volts === fromVolts))
        out.push({
          volts: fromVolts,
          maxAmps: maxArriving * phaseShare(maxShare, toNeutral) * factor,
          minAmps: minArriving * phaseShare(minShare, toNeutral) * factor,
        });
    }
    // Motors feed no fault below a single-phase transformer, so the current divides only on three-phase buses.
    if (threePhaseFrom) {
      maxShare = shareAbove(trees.max, feeder.item.id, from, maxShare);
      minShare = shareAbove(trees.min, feeder.item.id, from, minShare);
    }
  }
  return out;
}

const ONE: Impedance = Object.freeze({ r: 1, x: 0 });

/** The share of a branch's fault current that reaches its `from` bus through that bus's own feeder. */
function shareAbove(tree: FaultTree, branchId: string, from: string, share: Impedance): Impedance {
  const toward = tree.toward.get(from)!;
  // An infinite source supplies the whole current.
  if (toward.r === 0 && toward.x === 0) return share;
  return multiplyComplex(share, divideComplex(tree.behind.get(branchId)!, toward));
}

/**
 * The line current in a feeder as a fraction of the fault's, from its positive-sequence share `c`:
 * `|c|` for a three-phase fault and a primary across two lines (Z2 = Z1, so the negative sequence divides
 * as the positive); `|2·c + 1| / 3` for a primary line to neutral, whose zero sequence (a third of the
 * line current) all comes from above, since motors carry none (symmetrical components, IEEE 399).
 */
function phaseShare(c: Impedance, toNeutral: boolean): number {
  return toNeutral ? magnitudeOf({ r: 2 * c.r + 1, x: 2 * c.x }) / 3 : magnitudeOf(c);
}

/** Amps from a voltage and a loop or Thevenin impedance; unbounded for a zero impedance. */
function ampsOf(volts: number, z: Impedance): number {
  const magnitude = magnitudeOf(z);
  return magnitude === 0 ? Infinity : volts / magnitude;
}

/** A single-phase bus's levels: the full-winding loop, and the line-to-neutral (or grounded-leg) loop. */
function singlePhaseLevel(bus: SinglePhaseBus): FaultLevel {
  const full = ampsOf(bus.lineToLine.volts, bus.lineToLine.z);
  const ground = bus.lineToGround ? ampsOf(bus.lineToGround.volts, bus.lineToGround.z) : 0;
  return {
    threePhase: full,
    lineToLine: full,
    lineToGround: ground,
    largest: Math.max(full, ground),
    motorAmps: 0,
    xr: xrOf(bus.lineToLine.z),
    lineToGroundXr: bus.lineToGround ? xrOf(bus.lineToGround.z) : NaN,
    impedance: bus.lineToLine.z,
    zeroSequence: bus.lineToGround?.z,
  };
}

/**
 * The three-phase fault at each bus of a tree (A), as `levelAt` works it out: for the motors' share,
 * from the tree without motors, which need not be kept.
 */
function threePhaseAmpsOf(network: Network, tree: FaultTree): Map<string, number> {
  const amps = new Map<string, number>();
  for (const busId of tree.order) {
    const z = parallelImpedance(tree.toward.get(busId)!, tree.below.get(busId))!;
    amps.set(busId, ampsOf(network.buses.get(busId)!.voltage / Math.sqrt(3), z));
  }
  return amps;
}

/** One condition's fault level at a three-phase bus. */
function levelAt(
  network: Network,
  tree: FaultTree,
  busId: string,
  z0: Impedance | undefined,
  withoutMotors: number,
): FaultLevel {
  const volts = network.buses.get(busId)!.voltage;
  const z = parallelImpedance(tree.toward.get(busId)!, tree.below.get(busId))!;
  const threePhase = ampsOf(volts / Math.sqrt(3), z);
  // Symmetrical components with Z2 = Z1: I_LL = √3·E / |2·Z1|, I_LG = 3·E / |2·Z1 + Z0| (IEEE 399).
  const lineToLine = ampsOf((volts / Math.sqrt(3)) * Math.sqrt(3), addImpedance(z, z));
  const loop = z0 && addImpedance(z, z, z0);
  const lineToGround = loop ? ampsOf(Math.sqrt(3) * volts, loop) : 0;
  return {
    threePhase,
    lineToLine,
    lineToGround,
    largest: Math.max(threePhase, lineToLine, lineToGround),
    motorAmps: tree.motorZ.size > 0 && Number.isFinite(threePhase) ? Math.max(0, threePhase - withoutMotors) : 0,
    xr: xrOf(z),
    lineToGroundXr: loop ? xrOf(loop) : NaN,
    impedance: z,
    zeroSequence: z0,
  };
}
