import { motorFullLoadAmps } from '../fault/index.ts';
import { locationBusOf } from '../network/index.ts';
import type { Device } from '../study/index.ts';
import { transformerRatedAmps } from '../withstand/index.ts';
import type { Trial } from './trial.ts';

/** The load a device must carry without operating, and the pickup that carries it. */
export interface FullLoad {
  /** The lowest pickup (A at the device's voltage) that carries the load. */
  requiredAmps: number;
  /** Words: "Service transformer's rated current 1804 A". */
  label: string;
  source: string;
  subjects: string[];
}

/**
 * The load below a device, as the "carry load" constraint reads it. A device feeding a transformer, or
 * the main on a transformer's secondary, carries the transformer's rated current (100 %, common
 * practice). Otherwise the motors and transformers below it, up to the next transformer: 125 % of the
 * largest motor's full-load current plus the others' (NEC 430.24) plus the rated current of each
 * transformer below. `undefined` when nothing below is a known load.
 *
 * @example fullLoadOf(trial, mccFeeder) // { requiredAmps: 451, label: '2 motors below: 125 % of the largest plus the rest', … }
 */
export function fullLoadOf(trial: Trial, device: Device): FullLoad | undefined {
  const { network } = trial;
  const volts = locationBusOf(network, device).voltage;
  const element = network.elements.get(device.feeds);
  if (!element) return undefined;
  const transformerLoad = (t: Trial['study']['transformers'][number], atVolts: number): FullLoad => ({
    requiredAmps: transformerRatedAmps(t, atVolts),
    label: `${t.name ?? t.id}'s rated current`,
    source: 'transformer rated current (common practice)',
    subjects: [t.id],
  });
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
  // A cable, or a bus fed by a cable: walk down to the loads, stopping at transformers.
  const motors: number[] = [];
  let transformersAmps = 0;
  const subjects: string[] = [];
  const start = element.type === 'cable' ? element.item.to : element.item.id;
  const stack = [start];
  while (stack.length > 0) {
    const busId = stack.pop()!;
    const busVolts = network.buses.get(busId)!.voltage;
    for (const motor of network.motorsOn.get(busId) ?? []) {
      motors.push((motorFullLoadAmps(motor, busVolts) * busVolts) / volts);
      subjects.push(motor.id);
    }
    for (const branch of network.branchesFrom.get(busId) ?? []) {
      if (branch.type === 'cable' || branch.type === 'switch') stack.push(branch.item.to);
      else {
        transformersAmps += (transformerRatedAmps(branch.item, busVolts) * busVolts) / volts;
        subjects.push(branch.item.id);
      }
    }
  }
  if (motors.length === 0 && transformersAmps === 0) return undefined;
  const largest = Math.max(0, ...motors);
  const required = 1.25 * largest + motors.reduce((a, b) => a + b, 0) - largest + transformersAmps;
  const parts = [
    motors.length > 0
      ? `${motors.length} motor${motors.length > 1 ? 's' : ''} (125 % of the largest plus the rest)`
      : '',
    transformersAmps > 0 ? 'the rated current of the transformers below' : '',
  ].filter(Boolean);
  return {
    requiredAmps: required,
    label: `the load below: ${parts.join(' and ')}`,
    source:
      motors.length > 0
        ? 'NEC 430.24; transformers at rated current (common practice)'
        : 'transformer rated current (common practice)',
    subjects,
  };
}
