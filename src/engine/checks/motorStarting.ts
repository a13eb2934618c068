import { withLazyText } from '../lazyText.ts';
import { scaleBand } from '../band.ts';
import { locationBusOf } from '../network/index.ts';
import { formatAmps, formatSeconds } from '../quantity/format.ts';
import type { Motor } from '../study/index.ts';
import { motorStartingOf, startingPointsOf } from '../withstand/index.ts';
import { motorSubjectOf, nameOf, protectingDevice, rangeOf, type CheckContext } from './context.ts';
import type { Finding } from './finding.ts';
import { sentencesOf, sharedSentencesOf, type Rerun, type SharedSentences } from './sharedSentences.ts';

/**
 * Checks that a motor's start does not trip the device above it (NFPA 70 Article 430): at every point of
 * the starting curve — full-load current at long times, locked-rotor current until the acceleration
 * time, the asymmetrical first-cycle point — the device's earliest operating time must be later.
 *
 * @example motorFindings(context, compressor)
 */
export function motorFindings(context: CheckContext, motor: Motor): Finding[] {
  // The analysis's findings share their sentence builders, where the motor is the network's own.
  const own = context.network.elements.get(motor.id)?.item === motor;
  return startingFindings(context, motor, own ? sharedSentencesOf(context, undefined, startingAgain) : undefined);
}

/** `startingFindings` again for a finding's motor, each finding writing its own sentences. */
const startingAgain: Rerun<CheckContext, undefined> = (finding, context) =>
  startingFindings(context, motorSubjectOf(context, finding));

/** `motorFindings`, its findings given `shared` sentence builders, else their own. */
function startingFindings(context: CheckContext, motor: Motor, shared?: SharedSentences): Finding[] {
  const device = protectingDevice(context, motor.id);
  if (!device) return [];
  const volts = context.network.buses.get(motor.bus)!.voltage;
  const band = scaleBand(context.bands.get(device.id)!, locationBusOf(context.network, device).voltage / volts);
  // The curve's points alone: its words are written when a sentence is read.
  const curve = startingPointsOf(motor, volts);
  const name = motor.name ?? motor.id;
  const deviceName = nameOf(device);
  let worst: { amps: number; seconds: number; operates: number } | undefined;
  for (let i = 0; i < curve.amps.length; i++) {
    const amps = curve.amps[i];
    const seconds = curve.seconds[i];
    const operates = band.minTime(amps);
    if (operates <= seconds && (!worst || operates / seconds < worst.operates / worst.seconds))
      worst = { amps, seconds, operates };
  }
  // The sentences and the basis are written when first read (a large study has thousands of motors):
  // they keep the motor, and work the start out again with its words when read, so a finding does not
  // keep the curve.
  const basis = () => motorStartingOf(motor, volts).curve.notes.join(' ');
  if (!worst) {
    return [
      withLazyText<Finding>(
        {
          id: `motor-starting:${motor.id}`,
          kind: 'motor-starting',
          severity: 'ok',
          title: `${name} starts without tripping ${deviceName}`,
          subjects: [device.id, motor.id],
        },
        sentencesOf(shared, {
          explanation: () =>
            `${deviceName} stays above ${name}'s starting curve: ${motorStartingOf(motor, volts).curve.label}.`,
          basis,
        }),
        { referenceVolts: volts },
      ),
    ];
  }
  const { amps, seconds, operates } = worst;
  return [
    withLazyText<Finding>(
      {
        id: `motor-starting:${motor.id}`,
        kind: 'motor-starting',
        severity: 'fail',
        title: `${deviceName} may trip while ${name} starts`,
        subjects: [device.id, motor.id],
        range: rangeOf(amps, amps, volts, []),
      },
      sentencesOf(shared, {
        explanation: () =>
          `While starting, ${name} draws ${formatAmps(amps, 3)} for up to ${formatSeconds(seconds)}, and ${deviceName} may operate after ${formatSeconds(operates)}.`,
        suggestion: () =>
          `Raise ${deviceName}'s pickup or delay (or instantaneous setting) above the starting current, within NEC 430.52 limits.`,
        basis,
      }),
      { referenceVolts: volts },
    ),
  ];
}
