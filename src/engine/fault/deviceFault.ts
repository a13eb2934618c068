import { locationBusOf, type Network } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import type { FaultLevels } from './faultLevels.ts';
import {
  addImpedance,
  divideComplex,
  invertImpedance,
  magnitudeOf,
  multiplyComplex,
  parallelImpedance,
  type Impedance,
} from './impedance.ts';

/** The largest bolted fault currents a device carries (A at its own bus voltage). */
export interface DeviceFault {
  threePhase: number;
  /** Faulted-phase current for a line-to-ground fault; 0 with no zero-sequence path. */
  lineToGround: number;
}

/**
 * The largest currents through a device, for a bolted fault just below it at maximum fault (IEEE 399 /
 * IEEE 141: motor contributions are parallel sources at their buses): what its bus gets from every side
 * but the one the device feeds. A main carries what arrives from the source side, not its bus's motors; a
 * feeder everything but the motors below it; a motor's device everything but that motor. With equal
 * pre-fault voltages the contributions add as admittances, so the device's share of the positive-sequence
 * current is `c1 = Z1 · Y_through`, and for a line-to-ground fault it carries `I0 · (2·c1 + 1)` (motors
 * carry no zero sequence: all of `I0` comes through the device, as in `throughFaultOf`). A single-phase bus
 * counts no motors, so its devices carry the bus's own fault currents; at an infinite bus there is no limit.
 *
 * @example deviceFaultOf(network, faults, main).threePhase // the transformer's share of the switchboard fault
 */
export function deviceFaultOf(network: Network, faults: FaultLevels, device: Device): DeviceFault {
  const bus = locationBusOf(network, device);
  const level = faults.buses.get(bus.id)!;
  if (level.phases === 1) return { threePhase: level.max.threePhase, lineToGround: level.max.lineToGround };
  const tree = faults.trees.max;
  const toward = tree.toward.get(bus.id)!;
  if (magnitudeOf(toward) === 0)
    return { threePhase: Infinity, lineToGround: level.max.lineToGround > 0 ? Infinity : 0 };
  const z1 = parallelImpedance(toward, tree.below.get(bus.id))!;
  const through = throughAdmittanceOf(network, tree, device, bus.id, z1);
  const e = { r: bus.voltage / Math.sqrt(3), x: 0 };
  const threePhase = magnitudeOf(multiplyComplex(e, through));
  let lineToGround = 0;
  const z0 = level.max.zeroSequence;
  if (z0 && level.max.lineToGround > 0) {
    const i0 = divideComplex(e, addImpedance(z1, z1, z0));
    const c1 = multiplyComplex(z1, through);
    lineToGround = magnitudeOf(multiplyComplex(i0, { r: 2 * c1.r + 1, x: 2 * c1.x }));
  }
  return { threePhase, lineToGround };
}

/** The admittance of every source feeding a fault just below `device` through it. */
function throughAdmittanceOf(
  network: Network,
  tree: FaultLevels['trees']['max'],
  device: Device,
  busId: string,
  z1: Impedance,
): Impedance {
  // A main: only what arrives from above its bus.
  if (device.feeds === busId) return invertImpedance(tree.toward.get(busId)!);
  // A branch: everything at its bus but its own subtree (the tree keeps that impedance per branch).
  const behind = tree.behind.get(device.feeds);
  if (behind) return invertImpedance(behind);
  // A motor: everything at its bus but the motor itself.
  const all = invertImpedance(z1);
  const motor = tree.motorZ.get(device.feeds);
  if (!motor) return all;
  const own = invertImpedance(motor);
  return { r: all.r - own.r, x: all.x - own.x };
}
