import { withLazyText } from '../lazyText.ts';
import { scaleBand, type Band } from '../band.ts';
import { locationBusOf } from '../network/index.ts';
import { formatAmps, formatSeconds } from '../quantity/format.ts';
import type { Cable, Device } from '../study/index.ts';
import { conductorAreaCmil } from '../conductors/index.ts';
import { cableWithstandOf, type WithstandCurve } from '../withstand/index.ts';
import {
  cableSubjectOf,
  capitalise,
  describeRange,
  nameOf,
  protectingDevice,
  rangeOf,
  type CheckContext,
} from './context.ts';
import type { Finding } from './finding.ts';
import { protectionOf, withstandBandOf } from './withstandBand.ts';

/**
 * Checks that the device nearest above a cable clears before the cable's ICEA P-32-382 short-circuit
 * limit (ICEA P-32-382), from the current where the limit is 10 s up to the maximum fault at the
 * cable's supply end (the largest current the cable can carry into a fault).
 *
 * @example cableFindings(context, cable)
 */
export function cableFindings(context: CheckContext, cable: Cable, horizon = 1000): Finding[] {
  const facts = withstandFactsOf(context, cable);
  if (!facts) return [];
  const { device, name, volts, deviceVolts, withstand, toAmps, from, deviceName } = facts;
  // The sentences and the basis are written when first read (a large study has thousands of cables),
  // from the cable's facts worked out again (the curve, not the overlap search): the analysis's
  // findings share one set of builders where the cable is the network's own, so a finding keeps
  // neither the curve nor a closure.
  const own = context.network.elements.get(cable.id)?.item === cable;
  const sentences = own ? sharedWithstandSentencesOf(context) : sentencesFrom(() => facts);
  if (!(toAmps > from)) {
    return [
      withLazyText<Finding>(
        {
          id: `cable-withstand:${cable.id}`,
          kind: 'cable-withstand',
          severity: 'ok',
          title: `${name} can carry any fault here for 10 s`,
          subjects: [device.id, cable.id],
        },
        { explanation: sentences.belowLimit, basis: sentences.basis },
        { referenceVolts: volts },
      ),
    ];
  }
  const scaled = scaleBand(context.bands.get(device.id)!, deviceVolts / volts);
  const { failures, closest } = protectionOf(withstand, scaled, from, toAmps, horizon);
  if (closest) {
    return [
      withLazyText<Finding>(
        {
          id: `cable-withstand:${cable.id}`,
          kind: 'cable-withstand',
          severity: 'ok',
          title: `${deviceName} protects ${name}`,
          subjects: [device.id, cable.id],
          range: rangeOf(from, toAmps, volts, []),
          worst: closest,
        },
        { explanation: sentences.protects, basis: sentences.basis },
        { referenceVolts: volts },
      ),
    ];
  }
  return failures.map((interval, index) =>
    withLazyText<Finding>(
      {
        id: `cable-withstand:${cable.id}:${index}`,
        kind: 'cable-withstand',
        severity: 'fail',
        title: `${deviceName} does not protect ${name}`,
        subjects: [device.id, cable.id],
        range: rangeOf(interval.fromAmps, interval.toAmps, volts, []),
        worst: interval.worst,
      },
      { explanation: sentences.fails, suggestion: sentences.suggestion, basis: sentences.basis },
      { referenceVolts: volts },
    ),
  );
}

/** What the check and its sentences read of a cable: its protecting device, names, voltages, curve and current span. */
interface WithstandFacts {
  cable: Cable;
  device: Device;
  name: string;
  deviceName: string;
  volts: number;
  deviceVolts: number;
  curve: WithstandCurve;
  withstand: Band;
  /** The largest fault at the cable's supply end (A). */
  toAmps: number;
  /** The current the cable withstands for 10 s (A), where its limit starts. */
  from: number;
}

/** A cable's facts for the check; undefined where no device protects it. */
function withstandFactsOf(context: CheckContext, cable: Cable): WithstandFacts | undefined {
  const { network, faults } = context;
  const device = protectingDevice(context, cable.id);
  if (!device) return undefined;
  const volts = network.buses.get(cable.from)!.voltage;
  const curve = cableWithstandOf(cable, { volts, conductorAreaCmil: conductorAreaCmil(cable.size) });
  const withstand = withstandBandOf(curve, 1);
  return {
    cable,
    device,
    name: cable.name ?? cable.id,
    deviceName: nameOf(device),
    volts,
    deviceVolts: locationBusOf(network, device).voltage,
    curve,
    withstand,
    // A ground fault's current runs in the faulted conductor, and may exceed the three-phase current.
    toAmps: faults.buses.get(cable.from)!.max.largest,
    from: withstand.minAmps,
  };
}

/** The sentence builders of the check's findings, each writing from the finding and its cable's facts. */
interface WithstandSentences {
  belowLimit: (finding: Finding) => string;
  protects: (finding: Finding) => string;
  fails: (finding: Finding) => string;
  suggestion: (finding: Finding) => string;
  basis: (finding: Finding) => string;
}

/** Builders taking a finding's cable's facts from `factsOf`. */
function sentencesFrom(factsOf: (finding: Finding) => WithstandFacts): WithstandSentences {
  return {
    belowLimit: (finding) => {
      const { cable, name, toAmps, from } = factsOf(finding);
      return `The largest fault at ${cable.from}, ${formatAmps(toAmps, 3)}, is below the current ${name} withstands for 10 s (${formatAmps(from, 3)}).`;
    },
    protects: (finding) => {
      const { name, deviceName, curve } = factsOf(finding);
      const worst = finding.worst!;
      return `${capitalise(describeRange(finding.range!))} ${deviceName} clears before ${name} reaches its short-circuit limit (${curve.label}); closest at ${formatAmps(worst.amps, 3)}: ${formatSeconds(worst.downTime)} against ${formatSeconds(worst.upTime)}.`;
    },
    fails: (finding) => {
      const { name, deviceName, curve } = factsOf(finding);
      const worst = finding.worst!;
      return `${capitalise(describeRange(finding.range!))} ${name} reaches its short-circuit limit after ${formatSeconds(worst.upTime)}, but ${deviceName} may take ${formatSeconds(worst.downTime)} to clear (${curve.label}).`;
    },
    suggestion: () => 'Use a faster device (lower instantaneous or short-time pickup) or a larger conductor.',
    basis: (finding) => factsOf(finding).curve.notes.join(' '),
  };
}

/** The builders an analysis's cable findings share: each works its cable's facts out again when read. */
function sharedWithstandSentencesOf(context: CheckContext): WithstandSentences {
  let sentences = withstandSentences.get(context);
  if (!sentences) {
    sentences = sentencesFrom((finding) => withstandFactsOf(context, cableSubjectOf(context, finding))!);
    withstandSentences.set(context, sentences);
  }
  return sentences;
}

const withstandSentences = new WeakMap<CheckContext, WithstandSentences>();
