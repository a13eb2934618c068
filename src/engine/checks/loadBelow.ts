import { motorFullLoadAmps } from '../fault/index.ts';
import { locationBusOf, type Network } from '../network/index.ts';
import type { Device, Study } from '../study/index.ts';
import { transformerRatedAmps } from '../withstand/index.ts';

/** The load a device must carry without operating, and the pickup that carries it. */
export interface FullLoad {
  /** The lowest pickup (A at the device's voltage) that carries the load. */
  requiredAmps: number;
  /** Words: "Service transformer's rated current", "2 motors below (125 % of the largest plus the rest)". */
  label: string;
  source: string;
  subjects: string[];
}

/**
 * The load below a device, which its pickup must carry: the setting window's "carry load" bound and
 * the load check read it alike. A device feeding a transformer, or the main on a transformer's
 * secondary, carries the transformer's rated current (100 %, common practice); a device feeding a
 * motor 125 % of its full-load current (NEC 430.22); any other the loads below it (`loadBelowBus`).
 * `undefined` when nothing below is a known load.
 *
 * @example fullLoadOf(network, mccFeeder) // { requiredAmps: 451, label: '2 motors below (125 % of the largest plus the rest)', … }
 */
export function fullLoadOf(network: Network, device: Device): FullLoad | undefined {
  const volts = locationBusOf(network, device).voltage;
  const element = network.elements.get(device.feeds);
  if (!element) return undefined;
  if (element.type === 'transformer') return transformerLoad(element.item, volts);
  if (element.type === 'bus') {
    const feeder = network.feederOf.get(element.item.id);
    if (feeder?.type === 'transformer') return transformerLoad(feeder.item, element.item.voltage);
  }
  if (element.type === 'motor') {
    const amps = motorFullLoadAmps(element.item, volts);
    return {
      requiredAmps: 1.25 * amps,
      label: `${element.item.name ?? element.item.id}'s full-load current × 125 %`,
      source: 'NEC 430.22, 430.32',
      subjects: [element.item.id],
    };
  }
  // A cable, or a bus fed by a cable: the loads below its far end.
  return loadBelowBus(network, element.type === 'cable' ? element.item.to : element.item.id, volts);
}

/**
 * The loads below a bus, walking down cables and closed switches and stopping at transformers: 125 %
 * of the largest motor's full-load current plus the others' (NEC 430.24; 430.22 for one motor) plus
 * the rated current of each transformer, in amperes at `volts`. `undefined` when nothing below is a
 * known load. `motors` counts the motors, for the rules that hold motor circuits apart (NEC 240.4(G)).
 *
 * @example loadBelowBus(network, 'MCC', 480)?.requiredAmps // 531
 */
export function loadBelowBus(
  network: Network,
  busId: string,
  volts: number,
): (FullLoad & { motors: number }) | undefined {
  let motors = 0;
  let motorsAmps = 0;
  let largest = 0;
  const transformers: string[] = [];
  let transformersAmps = 0;
  const subjects: string[] = [];
  const stack = [busId];
  while (stack.length > 0) {
    const at = stack.pop()!;
    const busVolts = network.buses.get(at)!.voltage;
    for (const motor of network.motorsOn.get(at) ?? []) {
      const amps = (motorFullLoadAmps(motor, busVolts) * busVolts) / volts;
      motors++;
      motorsAmps += amps;
      if (amps > largest) largest = amps;
      subjects.push(motor.id);
    }
    for (const branch of network.branchesFrom.get(at) ?? []) {
      if (branch.type === 'cable' || branch.type === 'switch') stack.push(branch.item.to);
      else {
        transformersAmps += (transformerRatedAmps(branch.item, busVolts) * busVolts) / volts;
        transformers.push(branch.item.name ?? branch.item.id);
        subjects.push(branch.item.id);
      }
    }
  }
  if (motors === 0 && transformersAmps === 0) return undefined;
  const required = 0.25 * largest + motorsAmps + transformersAmps;
  const parts = [
    motors > 1 ? `${motors} motors below (125 % of the largest plus the rest)` : '',
    motors === 1 ? `the motor below (125 % of its full-load current)` : '',
    transformers.length === 1 ? `${transformers[0]}'s rated current` : '',
    transformers.length === 2 ? `the rated currents of ${transformers.join(' and ')}` : '',
    transformers.length > 2 ? `the rated currents of ${transformers.length} transformers below` : '',
  ].filter(Boolean);
  return {
    requiredAmps: required,
    label: parts.join(' and '),
    source: [
      motors > 1 ? 'NEC 430.24' : motors === 1 ? 'NEC 430.22' : '',
      transformers.length > 0 ? 'transformers at rated current (common practice)' : '',
    ]
      .filter(Boolean)
      .join('; '),
    subjects,
    motors,
  };
}

/** A transformer's rated current at `atVolts`, as the load of the device feeding it or of its secondary main. */
function transformerLoad(transformer: Study['transformers'][number], atVolts: number): FullLoad {
  return {
    requiredAmps: transformerRatedAmps(transformer, atVolts),
    label: `${transformer.name ?? transformer.id}'s rated current`,
    source: 'transformer rated current (common practice)',
    subjects: [transformer.id],
  };
}

/** The nominal (lowest-element) pickup of a device in amperes at its own voltage, as the load rule compares it; `undefined` for a fuse without a rating. */
export function pickupAmpsOf(device: Device): number | undefined {
  const c = device.characteristic;
  switch (c.kind) {
    case 'trip-unit':
      return c.longTime.pickup * c.sensor;
    case 'relay':
      return ((c.timeOvercurrent?.pickup ?? c.instantaneous?.pickup ?? 0) * c.ct.primary) / c.ct.secondary;
    case 'thermal-magnetic':
      return c.rating;
    case 'fuse':
      return device.rating;
  }
}

/** Whether a pickup carries the required current; a relative 1e-9 keeps a pickup set exactly at it on the right side. */
export function carriesLoad(pickupAmps: number, requiredAmps: number): boolean {
  return pickupAmps - requiredAmps >= -1e-9 * requiredAmps;
}
