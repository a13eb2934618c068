import type { Network } from '../network/index.ts';
import type { Work } from '../work.ts';
import { isGroundedSecondary } from './deltaWye.ts';
import { faultTreeOf, type FaultTree } from './faultTree.ts';
import { magnitudeOf, parallelImpedance, xrOf, type Impedance } from './impedance.ts';
import { reflectAmps } from './reflect.ts';
import { transformerFaultOf } from './transformerFault.ts';
import { withLazyWork } from './workSteps.ts';
import { faultSteps, stepsTo } from './faultWork.ts';

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
   * The max/min three-phase (single-phase: full-winding) current reflected to the voltage levels where
   * that current flows: the buses on the bus's path to the source (A at `volts`).
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
  /** Sheet shift factors (REFERENCE §1.8). */
  factors: { lineToLineDeviceShift: number; withstandShift: number };
  work: Work;
}

/** Every bus's and transformer's fault results, and warnings about the model. */
export interface FaultLevels {
  buses: Map<string, BusFault>;
  transformers: Map<string, TransformerFault>;
  diagnostics: string[];
}

/** Conductor temperature for minimum fault (°C): operating temperature, common practice (REFERENCE §1.4). */
export const MINIMUM_FAULT_TEMPERATURE = 90;

/**
 * Fault levels at every bus of a radial network (REFERENCE §1.3): series impedances added as complex
 * values, motors as parallel sources anywhere in the tree. Maximum: `max` source, motors in, Table 9
 * at 75 °C, %Z tolerance where asked. Minimum: `min` source (else `max`), no motors, R at 90 °C.
 *
 * @example faultLevelsOf(networkOf(study)).buses.get('SWBD')!.max.threePhase // A at 480 V
 */
export function faultLevelsOf(network: Network): FaultLevels {
  const { study } = network;
  const source = study.source;
  const maxLevel = source.kind === 'utility' ? source.max : undefined;
  const minLevel = source.kind === 'utility' ? (source.min ?? source.max) : undefined;
  const max = faultTreeOf(network, { kind: 'max', level: maxLevel, motors: true, temperature: 75, toleranced: true });
  const bare = faultTreeOf(network, { kind: 'max', level: maxLevel, motors: false, temperature: 75, toleranced: true });
  const min = faultTreeOf(network, {
    kind: 'min',
    level: minLevel,
    motors: false,
    temperature: MINIMUM_FAULT_TEMPERATURE,
    toleranced: false,
  });

  const diagnostics: string[] = [];
  if (source.kind === 'infinite')
    diagnostics.push(`${source.id}: infinite source, so the fault current at bus ${source.bus} is unbounded`);
  for (const t of study.transformers)
    if (t.phases === 1)
      diagnostics.push(`${t.id}: single-phase transformer; buses below it are computed as a three-phase system`);

  // Grounding follows the nearest transformer above; the utility system is taken as solidly grounded.
  const grounded = new Map<string, boolean>();
  for (const busId of max.order) {
    const feeder = network.feederOf.get(busId);
    grounded.set(
      busId,
      !feeder
        ? true
        : feeder.type === 'transformer'
          ? isGroundedSecondary(feeder.item.connection)
          : grounded.get(feeder.item.from)!,
    );
  }

  const levels = [...new Set(study.buses.map((b) => b.voltage))].sort((a, b) => b - a);
  const buses = new Map<string, BusFault>();
  for (const busId of max.order) {
    const volts = network.buses.get(busId)!.voltage;
    const isGrounded = grounded.get(busId)!;
    const noMotors = levelAt(network, bare, busId, isGrounded, 0);
    const maxAt = levelAt(network, max, busId, isGrounded, noMotors.threePhase);
    const minAt = levelAt(network, min, busId, isGrounded, 0);
    const reflected = levels
      .filter((v) => v !== volts)
      .map((v) => ({
        volts: v,
        maxAmps: reflectAmps(maxAt.threePhase, volts, v),
        minAmps: reflectAmps(minAt.threePhase, volts, v),
      }));
    const work = () => [
      ...stepsTo(network, max, busId, 'maximum'),
      ...faultSteps('maximum', volts, max.toward.get(busId)!, max.below.get(busId), maxAt),
      ...stepsTo(network, min, busId, 'minimum'),
      ...faultSteps('minimum', volts, min.toward.get(busId)!, min.below.get(busId), minAt),
    ];
    buses.set(
      busId,
      withLazyWork({ busId, volts, phases: 3, system: 'three-phase', max: maxAt, min: minAt, reflected }, work),
    );
  }

  const transformers = new Map(
    study.transformers.map((t) => [t.id, transformerFaultOf(t, network, max, buses.get(t.to)!.max.threePhase)]),
  );
  return { buses, transformers, diagnostics };
}

/** One condition's fault level at a bus. */
function levelAt(
  network: Network,
  tree: FaultTree,
  busId: string,
  grounded: boolean,
  withoutMotors: number,
): FaultLevel {
  const volts = network.buses.get(busId)!.voltage;
  const toward = tree.toward.get(busId)!;
  const below = tree.below.get(busId);
  const z = parallelImpedance(toward, below)!;
  const magnitude = magnitudeOf(z);
  const threePhase = magnitude === 0 ? Infinity : volts / (Math.sqrt(3) * magnitude);
  return {
    threePhase,
    lineToLine: (threePhase * Math.sqrt(3)) / 2,
    lineToGround: grounded ? threePhase : 0,
    largest: threePhase,
    lineToGroundXr: grounded ? xrOf(z) : NaN,
    motorAmps: tree.motorZ.size > 0 && Number.isFinite(threePhase) ? Math.max(0, threePhase - withoutMotors) : 0,
    xr: xrOf(z),
    impedance: z,
  };
}
