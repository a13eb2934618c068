import { locationBusOf } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import type { Trial } from './trial.ts';

/** The current a device must surely operate on: the minimum fault at the end of its zone. */
export interface SensitivityCurrent {
  /** Amps at the device's own voltage. */
  amps: number;
  busId: string;
  busName: string;
}

/**
 * The minimum line-to-line bolted fault at the end of a device's zone, on the device's voltage base:
 * the bus its cable or transformer feeds (or its own bus for a main or a motor branch). Across a Δ–Y
 * transformer the primary device's most loaded phase carries 1/0.866 = 1.155 times the per-unit
 * current of a secondary line-to-line fault (IEEE 242 ch. 15, the Δ–Y shift). `undefined` when the
 * study has no minimum level there.
 *
 * @example sensitivityCurrentOf(trial, mccFeeder) // { amps: 16_200, busId: 'MCC', … }
 */
export function sensitivityCurrentOf(trial: Trial, device: Device): SensitivityCurrent | undefined {
  const { network, faults } = trial;
  const volts = locationBusOf(network, device).voltage;
  const element = network.elements.get(device.feeds);
  if (!element) return undefined;
  let busId: string;
  let shift = 1;
  if (element.type === 'bus') busId = element.item.id;
  else if (element.type === 'motor') busId = element.item.bus;
  else {
    busId = element.item.to;
    if (element.type === 'transformer' && element.item.connection === 'delta-wye') shift = 1 / 0.866;
  }
  const bus = network.buses.get(busId)!;
  const level = faults.buses.get(busId)?.min.lineToLine;
  if (!(level !== undefined && level > 0)) return undefined;
  return { amps: (level * bus.voltage * shift) / volts, busId, busName: bus.name ?? bus.id };
}
