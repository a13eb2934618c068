import { cableAmpacityOf, parseConductorSize } from '../conductors/index.ts';
import { withLazyText } from '../lazyText.ts';
import { locationBusOf, transformersBetween } from '../network/index.ts';
import { formatAmps } from '../quantity/format.ts';
import type { Cable } from '../study/index.ts';
import { cableSubjectOf, nameOf, protectingDevice, type CheckContext } from './context.ts';
import { ratingOf } from './deviceRating.ts';
import type { Finding } from './finding.ts';
import { sentencesOf, sharedSentencesOf, type Rerun, type SharedSentences } from './sharedSentences.ts';
import { loadBelowBus } from './loadBelow.ts';
import { nextStandardRating } from './standardRatings.ts';

/** NFPA 70 240.4(D): the most a small conductor may be protected at, by material and size. */
const SMALL_CONDUCTOR_LIMIT: Record<Cable['material'], Record<string, number>> = {
  copper: { '14 AWG': 15, '12 AWG': 20, '10 AWG': 30 },
  aluminium: { '12 AWG': 15, '10 AWG': 25 },
};

/** NFPA 70 240.4(B)(3): the next higher standard rating is allowed only up to this rating (A). */
const NEXT_HIGHER_UP_TO = 800;

/**
 * Checks a cable of 1000 V or less against its load and its overload protection (NFPA 70 Articles 240
 * and 430), with the ampacity of its conductors: the cable's own `ampacity` per conductor, else Table
 * 310.16 at 75 °C, times its parallel sets.
 * - With motors below, the conductors must carry 125 % of the largest motor's full-load current plus
 *   the other motors' and the rated current of the transformers below (430.22, 430.24).
 * - The rating of the device nearest above (its `rating`, a breaker's, a trip unit's sensor, 240.6(B))
 *   may not exceed the ampacity (240.4), or the next higher standard rating where that is 800 A or
 *   less (240.4(B)); 14–10 AWG keep the limits of 240.4(D). A motor branch circuit (one motor below,
 *   no device between) is left to 430.52 (240.4(G)); above a feeder to motors a rating beyond the
 *   limit is a warning, since 430.62 may allow it.
 * Cables above 1000 V (240 Part IX), devices without a rating and a device across a transformer
 * (secondary conductors, 240.21(C)) are not compared; a size the table does not list gives an info
 * finding asking for the ampacity.
 *
 * @example cableAmpacityFindings(context, officeFeeder)[0].severity // 'fail' for 4/0 copper on a 300 A breaker
 */
export function cableAmpacityFindings(context: CheckContext, cable: Cable): Finding[] {
  // The analysis's findings share their sentence builders, where the cable is the network's own.
  const own = context.network.elements.get(cable.id)?.item === cable;
  return ampacityFindings(context, cable, own ? sharedSentencesOf(context, undefined, ampacityAgain) : undefined);
}

/** `ampacityFindings` again for a finding's cable, each finding writing its own sentences. */
const ampacityAgain: Rerun<CheckContext, undefined> = (finding, context) =>
  ampacityFindings(context, cableSubjectOf(context, finding));

/** `cableAmpacityFindings`, its findings given `shared` sentence builders, else their own. */
function ampacityFindings(context: CheckContext, cable: Cable, shared?: SharedSentences): Finding[] {
  const { network } = context;
  const volts = network.buses.get(cable.from)!.voltage;
  const device = protectingDevice(context, cable.id);
  if (volts > 1000 || !device) return [];
  const name = cable.name ?? cable.id;
  const deviceName = nameOf(device);
  const id = `cable-ampacity:${cable.id}`;
  const subjects = [device.id, cable.id];
  const ampacity = cableAmpacityOf(cable);
  if (ampacity === undefined) {
    return [
      withLazyText<Finding>(
        { id, kind: 'cable-ampacity', severity: 'info', title: `${name}: no ampacity to check`, subjects },
        sentencesOf(shared, {
          explanation: () =>
            `NFPA 70 Table 310.16 lists no ${cable.material} conductor of ${cable.size}: give ${name}'s ampacity to check its load and overload protection (NFPA 70 240.4).`,
        }),
        { referenceVolts: volts },
      ),
    ];
  }
  const load = loadBelowBus(network, cable.to, volts);
  const motors = load?.motors ?? 0;
  // The conductors against the motor load below (Article 430).
  const carries = motors === 0 || ampacity >= load!.requiredAmps * (1 - 1e-9);
  // Conductors on a transformer's secondary protected only on its primary are secondary conductors
  // (240.21(C), 240.4(F)), not compared with a rating at another voltage.
  const secondary = transformersBetween(network, locationBusOf(network, device).id, cable.from).length > 0;
  // The device against the conductors (240.4), except a motor branch circuit (240.4(G), 430.52).
  const branchCircuit =
    !secondary &&
    motors === 1 &&
    load!.subjects.length === 1 &&
    protectingDevice(context, load!.subjects[0])?.id === device.id;
  const rating = branchCircuit || secondary ? undefined : ratingOf(device);
  if (motors === 0 && !rating) return [];
  const size = parseConductorSize(cable.size);
  const small = cable.sets === 1 ? SMALL_CONDUCTOR_LIMIT[cable.material][size] : undefined;
  const next = nextStandardRating(ampacity, device.characteristic.kind === 'fuse');
  const allowed = Math.min(next <= NEXT_HIGHER_UP_TO ? next : ampacity, small ?? Infinity);
  const protects = !rating || rating.amps <= allowed * (1 + 1e-9);
  const severity = !carries || (!protects && motors === 0) ? 'fail' : !protects ? 'warning' : 'ok';
  const title = !carries
    ? `${name} is too small for the load it feeds`
    : !protects
      ? `${deviceName} is rated above ${name}'s ampacity`
      : `${name} is protected at its ampacity`;

  // The sentences are written when first read (a large study has thousands of cables).
  const conductors = () => `${cable.sets > 1 ? `${cable.sets} × ` : ''}${cable.size} ${cable.material}`;
  const loadSentence = () =>
    `${name} (${conductors()}, ${formatAmps(ampacity, 3)}) ${carries ? 'carries' : 'is below'} the ${formatAmps(load!.requiredAmps, 3)} its load needs: ${load!.label}.`;
  const rule = () =>
    small !== undefined && small <= allowed
      ? `240.4(D) limits ${size} ${cable.material} to ${formatAmps(small, 3)}`
      : next <= NEXT_HIGHER_UP_TO
        ? `240.4(B) allows the next standard rating at or above it, ${formatAmps(next, 3)}`
        : 'above 800 A, 240.4(C) allows no more than the ampacity';
  const deviceSentence = () =>
    rating
      ? `${deviceName}'s ${rating.what}, ${formatAmps(rating.amps, 3)}, ${protects ? 'is within' : 'is above'} what ${name} may be protected at: ${conductors()} carries ${formatAmps(ampacity, 3)}, and ${rule()}.${protects || motors === 0 ? '' : ' Above a feeder to motors, NFPA 70 430.62 may allow it (240.4(G)): check the feeder against it.'}`
      : branchCircuit
        ? `A motor branch circuit's device is sized by NFPA 70 430.52, not by the conductors' ampacity (240.4(G)).`
        : secondary
          ? `${name} is protected only on the primary of a transformer above it: NFPA 70 240.21(C) governs its overcurrent protection, not compared here.`
          : '';
  const source =
    cable.ampacity === undefined ? 'per conductor at 75 °C, NFPA 70 Table 310.16' : 'per conductor as given';
  return [
    withLazyText<Finding>(
      { id, kind: 'cable-ampacity', severity, title, subjects },
      sentencesOf(shared, {
        explanation: () => [motors > 0 ? loadSentence() : '', deviceSentence()].filter(Boolean).join(' '),
        ...(severity === 'ok'
          ? {}
          : {
              suggestion: () =>
                carries
                  ? `Use a larger conductor or more parallel sets for ${name}, or a device rated ${formatAmps(allowed, 3)} or less (within the coordination above and below).${device.characteristic.kind === 'trip-unit' && device.rating === undefined ? ` Where access to ${deviceName}'s long-time setting is restricted (NFPA 70 240.6(C)), give its rating as that setting.` : ''}`
                  : `Use a larger conductor or more parallel sets for ${name}, to carry at least ${formatAmps(load!.requiredAmps, 3)}.`,
            }),
        basis: () =>
          `${conductors()}: ${formatAmps(ampacity / cable.sets, 3)} ${source}; NFPA 70 240.4${motors > 0 ? `; ${load!.source}` : ''}.`,
      }),
      { referenceVolts: volts },
    ),
  ];
}
