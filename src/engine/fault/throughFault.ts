import type { Network } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import type { FaultLevels } from './faultLevels.ts';
import { currentsThrough } from './currentsThrough.ts';
import { divideComplex, magnitudeOf, multiplyComplex, type Impedance } from './impedance.ts';

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
  const { threePhase, lineToGround } = currentsThrough(faults, locationBus, (tree) => {
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
    // What arrives from above, 1 / Z_toward, times the share passing `upstream`.
    return divideComplex(share, tree.toward.get(locationBus)!);
  });
  // On a single-phase bus the devices carry the bus's own fault currents, its line-to-line one among them.
  const bus = faults.buses.get(locationBus)!;
  const lineToLine = bus.phases === 1 ? bus.max.lineToLine : (threePhase * Math.sqrt(3)) / 2;
  return { threePhase, lineToLine, lineToGround };
}
