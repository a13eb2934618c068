import { withLazyText } from '../lazyText.ts';
import { locationBusOf, type Network } from '../network/index.ts';
import { formatAmps } from '../quantity/format.ts';
import type { Device } from '../study/index.ts';
import { capitalise, nameOf } from './context.ts';
import type { Finding } from './finding.ts';
import { sentencesOf, sharedSentencesOf, type Rerun, type SharedSentences } from './sharedSentences.ts';
import { carriesLoad, fullLoadOf, pickupAmpsOf } from './loadBelow.ts';

/**
 * Checks that a device's pickup carries the load it feeds, by the rule the setting window bounds it
 * with (`fullLoadOf`): a transformer's rated current for the device feeding it and for the main on
 * its secondary (common practice), 125 % of a motor's full-load current (NEC 430.22, 430.32), and
 * for a feeder 125 % of the largest motor below plus the rest (NEC 430.24) plus the rated current of
 * each transformer below. A pickup below it is a warning, not a failure: where the load below never
 * runs all at once (diversity) or a main is chosen smaller than its transformer, the engineer may
 * mean it. Nothing is reported for a device with no known load below, or a fuse without a rating.
 *
 * @example loadFindings(network, mccFeeder)[0].severity // 'warning' when its pickup is below 451 A
 */
export function loadFindings(network: Network, device: Device): Finding[] {
  // The analysis's findings share their sentence builders, where the device is the network's own.
  const own = network.devices.get(device.id) === device;
  return carryingFindings(network, device, own ? sharedSentencesOf(network, undefined, carryingAgain) : undefined);
}

/** `carryingFindings` again for a finding's device, each finding writing its own sentences. */
const carryingAgain: Rerun<Network, undefined> = (finding, network) =>
  carryingFindings(network, network.devices.get(finding.subjects[0])!);

/** `loadFindings`, its findings given `shared` sentence builders, else their own. */
function carryingFindings(network: Network, device: Device, shared?: SharedSentences): Finding[] {
  const load = fullLoadOf(network, device);
  const pickup = pickupAmpsOf(device);
  if (!load || pickup === undefined) return [];
  const name = nameOf(device);
  const required = load.requiredAmps;
  const id = `carry-load:${device.id}`;
  const subjects = [device.id, ...load.subjects];
  const basis = () => `${capitalise(load.label)}: ${load.source}.`;
  const referenceVolts = locationBusOf(network, device).voltage;
  if (carriesLoad(pickup, required)) {
    return [
      withLazyText<Finding>(
        { id, kind: 'carry-load', severity: 'ok', title: `${name} carries the load it feeds`, subjects },
        sentencesOf(shared, {
          explanation: () =>
            `${name}'s pickup, ${formatAmps(pickup, 3)}, is at least the ${formatAmps(required, 3)} its load needs: ${load.label}.`,
          basis,
        }),
        { referenceVolts },
      ),
    ];
  }
  return [
    withLazyText<Finding>(
      { id, kind: 'carry-load', severity: 'warning', title: `${name}'s pickup is below the load it feeds`, subjects },
      sentencesOf(shared, {
        explanation: () =>
          `${name}'s pickup, ${formatAmps(pickup, 3)}, is below the ${formatAmps(required, 3)} its load needs, ${load.label}: it may operate on load current in normal service, with no fault.`,
        suggestion: () =>
          `Raise ${name}'s pickup (or rating) to at least ${formatAmps(required, 3)}, within the limits of the devices above it; if the load below never runs all at once, record why the lower setting is meant.`,
        basis,
      }),
      { referenceVolts },
    ),
  ];
}
