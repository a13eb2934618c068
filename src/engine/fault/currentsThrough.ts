import type { FaultLevels } from './faultLevels.ts';
import type { FaultTree } from './faultTree.ts';
import {
  addImpedance,
  divideComplex,
  magnitudeOf,
  multiplyComplex,
  parallelImpedance,
  type Impedance,
} from './impedance.ts';

/** The bolted fault currents through a device at maximum fault (A at its bus voltage). */
export interface CurrentsThrough {
  threePhase: number;
  /** Faulted-phase current for a line-to-ground fault; 0 with no zero-sequence path. */
  lineToGround: number;
}

/**
 * The currents through a device for a bolted fault at bus `busId`, given the admittance of the sources
 * that feed that fault through the device (`admittance`, from the maximum-fault tree and the bus's
 * positive-sequence impedance `z1`). With equal pre-fault voltages the sources' currents add as
 * admittances, so the device carries `E · Y` of the three-phase fault and the share `c1 = Z1 · Y` of its
 * positive- and negative-sequence currents; a line-to-ground fault then sends `I0 · (2·c1 + 1)` through
 * it (symmetrical components, IEEE 399), all of `I0` coming through the device since motors carry no
 * zero sequence. A single-phase bus counts no motors, so a device there carries the bus's own fault
 * currents; at an infinite bus there is no limit.
 *
 * @example currentsThrough(faults, 'SWBD', (tree) => invertImpedance(tree.toward.get('SWBD')!)).threePhase
 */
export function currentsThrough(
  faults: FaultLevels,
  busId: string,
  admittance: (tree: FaultTree, z1: Impedance) => Impedance,
): CurrentsThrough {
  const bus = faults.buses.get(busId)!;
  if (bus.phases === 1) return { threePhase: bus.max.threePhase, lineToGround: bus.max.lineToGround };
  const tree = faults.trees.max;
  const toward = tree.toward.get(busId)!;
  if (magnitudeOf(toward) === 0) return { threePhase: Infinity, lineToGround: bus.max.lineToGround > 0 ? Infinity : 0 };
  const z1 = parallelImpedance(toward, tree.below.get(busId))!;
  const through = admittance(tree, z1);
  const e = { r: bus.volts / Math.sqrt(3), x: 0 };
  const threePhase = magnitudeOf(multiplyComplex(e, through));
  let lineToGround = 0;
  const z0 = bus.max.zeroSequence;
  if (z0 && bus.max.lineToGround > 0) {
    const i0 = divideComplex(e, addImpedance(z1, z1, z0));
    const c1 = multiplyComplex(z1, through);
    lineToGround = magnitudeOf(multiplyComplex(i0, { r: 2 * c1.r + 1, x: 2 * c1.x }));
  }
  return { threePhase, lineToGround };
}
