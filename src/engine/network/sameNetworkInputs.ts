import type { Study } from '../study/index.ts';

/** The parts of a study the network and its fault levels are built from (devices aside). */
const NETWORK_FIELDS = [
  'frequency',
  'source',
  'buses',
  'transformers',
  'cables',
  'motors',
  'generators',
  'switches',
  'scenarios',
] as const satisfies readonly (keyof Study)[];

/**
 * True when `next` has the network of `previous`: the same source, buses, branches, motors,
 * generators, switches and scenarios (by identity: an edited study's reading keeps the parsed lists
 * an edit left alone), the same conductor temperatures and every device where it was (its id and what
 * it feeds). An edit of a device's
 * settings keeps the network, so what depends on nothing else (the fault levels) can be kept.
 *
 * @example sameNetworkInputs(before, withOneDeviceRetuned) // true
 */
export function sameNetworkInputs(previous: Study, next: Study): boolean {
  if (previous === next) return true;
  if (NETWORK_FIELDS.some((field) => previous[field] !== next[field])) return false;
  // Compared by value: two numbers, which a default fills in afresh at each whole reading.
  const [before, after] = [previous.conductorTemperatures, next.conductorTemperatures];
  if (before.maximumFault !== after.maximumFault || before.minimumFault !== after.minimumFault) return false;
  if (previous.devices === next.devices) return true;
  if (previous.devices.length !== next.devices.length) return false;
  return previous.devices.every(
    (device, i) => device.id === next.devices[i].id && device.feeds === next.devices[i].feeds,
  );
}
