import { locationBusOf, type Network } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import { currentsThrough, type CurrentsThrough } from './currentsThrough.ts';
import type { FaultLevels } from './faultLevels.ts';
import { invertImpedance } from './impedance.ts';

/** The largest bolted fault currents a device carries (A at its own bus voltage). */
export type DeviceFault = CurrentsThrough;

/**
 * The largest currents through a device, for a bolted fault just below it at maximum fault (IEEE 399 /
 * IEEE 141: motor contributions are parallel sources at their buses): what its bus gets from every side
 * but the one the device feeds. A main carries what arrives from the source side, not the motors below
 * it; a feeder everything but the motors below it; a motor's device everything but that motor
 * (`currentsThrough` for the line-to-ground fault, the single-phase and the infinite bus).
 *
 * @example deviceFaultOf(network, faults, main).threePhase // the transformer's share of the switchboard fault
 */
export function deviceFaultOf(network: Network, faults: FaultLevels, device: Device): DeviceFault {
  const busId = locationBusOf(network, device).id;
  return currentsThrough(faults, busId, (tree, z1) => {
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
  });
}

/**
 * The largest of a device's or bus's fault currents a sheet reaches to: the line-to-ground fault on a
 * ground-fault sheet; on a phase sheet the larger of the three-phase and line-to-ground faults (the
 * faulted phase's current, which a Δ–Yg secondary or a solidly grounded generator makes the larger),
 * as far as the pair checks go. The same at any voltage the sheet is drawn at: only its units change.
 *
 * @example largestFaultOf({ threePhase: 28_421, lineToGround: 29_377 }, false) // 29_377
 */
export function largestFaultOf(fault: { threePhase: number; lineToGround: number }, groundFault: boolean): number {
  return groundFault ? fault.lineToGround : Math.max(fault.threePhase, fault.lineToGround);
}
