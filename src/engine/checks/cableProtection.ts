import { withLazyText } from '../lazyText.ts';
import { scaleBand } from '../band.ts';
import { locationBusOf } from '../network/index.ts';
import { findOverlaps } from '../overlap.ts';
import { formatAmps, formatSeconds } from '../quantity/format.ts';
import type { Cable } from '../study/index.ts';
import { conductorAreaCmil } from '../conductors/index.ts';
import { cableWithstandOf } from '../withstand/index.ts';
import { capitalise, describeRange, nameOf, protectingDevice, rangeOf, type CheckContext } from './context.ts';
import type { Finding } from './finding.ts';
import { PROTECTION_FINDER, withstandBandOf } from './withstandBand.ts';

/**
 * Checks that the device nearest above a cable clears before the cable's ICEA P-32-382 short-circuit
 * limit (ICEA P-32-382), from the current where the limit is 10 s up to the maximum fault at the
 * cable's supply end (the largest current the cable can carry into a fault).
 *
 * @example cableFindings(context, cable)
 */
export function cableFindings(context: CheckContext, cable: Cable, horizon = 1000): Finding[] {
  const { network, faults, bands } = context;
  const device = protectingDevice(context, cable.id);
  const name = cable.name ?? cable.id;
  const volts = network.buses.get(cable.from)!.voltage;
  if (!device) return [];
  const deviceVolts = locationBusOf(network, device).voltage;
  const withstandOf = () => cableWithstandOf(cable, { volts, conductorAreaCmil: conductorAreaCmil(cable.size) });
  const curve = withstandOf();
  const { label } = curve;
  const band = bands.get(device.id)!;
  const withstand = withstandBandOf(curve, 1);
  const toAmps = faults.buses.get(cable.from)!.max.threePhase;
  const from = withstand.minAmps;
  const deviceName = nameOf(device);
  // The sentences and the basis are written when first read (a large study has thousands of cables);
  // they keep the curve's label, and the basis works the curve out again when read, so a finding does
  // not keep the whole curve.
  const basis = () => withstandOf().notes.join(' ');
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
        {
          explanation: () =>
            `The largest fault at ${cable.from}, ${formatAmps(toAmps, 3)}, is below the current ${name} withstands for 10 s (${formatAmps(from, 3)}).`,
          basis,
        },
        { referenceVolts: volts },
      ),
    ];
  }
  const scaled = scaleBand(band, deviceVolts / volts);
  const intervals = findOverlaps(withstand, scaled, { fromAmps: from, toAmps, horizon, ...PROTECTION_FINDER });
  const failures = intervals.filter((interval) => interval.status === 'overlap');
  const range = rangeOf(from, toAmps, volts, []);
  if (failures.length === 0) {
    const least = intervals.reduce((a, b) => (b.worst.ratio < a.worst.ratio ? b : a));
    return [
      withLazyText<Finding>(
        {
          id: `cable-withstand:${cable.id}`,
          kind: 'cable-withstand',
          severity: 'ok',
          title: `${deviceName} protects ${name}`,
          subjects: [device.id, cable.id],
          range,
          worst: least.worst,
        },
        {
          explanation: () =>
            `${capitalise(describeRange(range))} ${deviceName} clears before ${name} reaches its short-circuit limit (${label}); closest at ${formatAmps(least.worst.amps, 3)}: ${formatSeconds(least.worst.downTime)} against ${formatSeconds(least.worst.upTime)}.`,
          basis,
        },
        { referenceVolts: volts },
      ),
    ];
  }
  return failures.map((interval, index) => {
    const failed = rangeOf(interval.fromAmps, interval.toAmps, volts, []);
    return withLazyText<Finding>(
      {
        id: `cable-withstand:${cable.id}:${index}`,
        kind: 'cable-withstand',
        severity: 'fail',
        title: `${deviceName} does not protect ${name}`,
        subjects: [device.id, cable.id],
        range: failed,
        worst: interval.worst,
      },
      {
        explanation: () =>
          `${capitalise(describeRange(failed))} ${name} reaches its short-circuit limit after ${formatSeconds(interval.worst.upTime)}, but ${deviceName} may take ${formatSeconds(interval.worst.downTime)} to clear (${label}).`,
        suggestion: () => 'Use a faster device (lower instantaneous or short-time pickup) or a larger conductor.',
        basis,
      },
      { referenceVolts: volts },
    );
  });
}
