import type { Network } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import type { FaultLevels } from './faultLevels.ts';
import {
  addImpedance,
  divideComplex,
  magnitudeOf,
  multiplyComplex,
  parallelImpedance,
  type Impedance,
} from './impedance.ts';

/** The bolted fault currents that flow through two devices in series for a fault just below the lower one. */
export interface ThroughFault {
  /** Three-phase (single-phase bus: full-winding) current through both devices (A at the lower device's bus voltage). */
  threePhase: number;
  /** Line-to-line current through both, `√3/2 · threePhase` on a three-phase bus (A). */
  lineToLine: number;
  /** Faulted-phase current through both for a line-to-ground fault (A); 0 with no zero-sequence path. */
  lineToGround: number;
}

/**
 * The largest current that flows through both `upstream` and a device below it at `locationBus` for a bolted fault just below
 * a device at `locationBus` (IEEE 399 / IEEE 141: motor contributions are parallel sources at their buses): the
 * source side plus the motors whose current passes through both, not the bus total. Motors on the
 * downstream device's bus or below the upstream device feed the fault without passing through
 * `upstream`. With equal pre-fault voltages, the current arriving at a bus from its feeder divides at
 * each bus above in the ratio `Z_behind / Z_toward` (current division in the positive-sequence
 * network). A line-to-ground fault sends `I0 · (2·c1 + 1)` through the upper device, `c1` being that
 * positive-sequence share (motors carry no zero sequence, so all of `I0` comes from above). On a
 * single-phase bus no motors are counted, so both devices carry the bus's own fault currents.
 *
 * @example throughFaultOf(network, faults, main, 'MCC').threePhase // A at the feeder's bus voltage
 */
export function throughFaultOf(
  network: Network,
  faults: FaultLevels,
  upstream: Device,
  locationBus: string,
): ThroughFault {
  const bus = faults.buses.get(locationBus)!;
  if (bus.phases === 1)
    return { threePhase: bus.max.threePhase, lineToLine: bus.max.lineToLine, lineToGround: bus.max.lineToGround };
  const tree = faults.trees.max;
  const toward = tree.toward.get(locationBus)!;
  // At an infinite bus everything comes from the source, and there is no limit.
  if (magnitudeOf(toward) === 0)
    return { threePhase: Infinity, lineToLine: Infinity, lineToGround: bus.max.lineToGround > 0 ? Infinity : 0 };
  // The share of the fault's positive-sequence current that passes `upstream`, relative to what arrives from above.
  let share: Impedance = { r: 1, x: 0 };
  let at = locationBus;
  for (;;) {
    if (network.deviceFeeding.get(at) === upstream) break;
    const feeder = network.feederOf.get(at);
    if (!feeder || network.deviceFeeding.get(feeder.item.id) === upstream) break;
    const from = feeder.item.from;
    if (magnitudeOf(tree.toward.get(from)!) === 0) break; // an infinite source takes the whole current
    share = multiplyComplex(share, divideComplex(tree.behind.get(feeder.item.id)!, tree.toward.get(from)!));
    at = from;
  }
  const e = { r: bus.volts / Math.sqrt(3), x: 0 };
  const arriving = divideComplex(e, toward);
  const threePhase = magnitudeOf(multiplyComplex(arriving, share));
  let lineToGround = 0;
  const z0 = bus.max.zeroSequence;
  if (z0 && bus.max.lineToGround > 0) {
    const z1 = parallelImpedance(toward, tree.below.get(locationBus))!;
    const i0 = divideComplex(e, addImpedance(z1, z1, z0));
    const c1 = multiplyComplex(divideComplex(z1, toward), share);
    lineToGround = magnitudeOf(multiplyComplex(i0, { r: 2 * c1.r + 1, x: 2 * c1.x }));
  }
  return { threePhase, lineToLine: (threePhase * Math.sqrt(3)) / 2, lineToGround };
}
