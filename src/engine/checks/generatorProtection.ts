import { scaleBand } from '../band.ts';
import { generatorDamageCurve } from '../generator/generatorDamageCurve.ts';
import { ratedAmpsOf } from '../generator/rating.ts';
import { locationBusOf, upstreamDeviceOf, type Network } from '../network/index.ts';
import { formatAmps, formatSeconds, significant } from '../quantity/format.ts';
import type { Device, Source } from '../study/index.ts';
import { capitalise, describeRange, nameOf, rangeOf, surelyClearsFrom, type CheckContext } from './context.ts';
import type { Finding } from './finding.ts';
import { protectionOf, withstandBandOf } from './withstandBand.ts';

type Generator = Extract<Source, { kind: 'generator' }>;

/** NFPA 70 requires a generator's overcurrent protection; the curve it is held to is the machine's short-time capability. */
const CODE = 'NFPA 70 445.12(A) (generator overcurrent protection)';
const INHERENT =
  'Unless the machine is protected by its inherent design or its own protection, as NFPA 70 445.12(A) also allows: confirm from its documentation.';

/**
 * Checks that the device nearest a generator (`devices`, by default `generatorDevicesOf`: its breaker
 * at its bus, or each feeder breaker where several leave the generator bus) clears before the
 * generator's damage curve, `generatorDamageCurve` (IEEE C50.13 armature short-time thermal capability
 * with IEC 60034-1's 1.5 × rated for 30 s on it, or the machine's own damage points), from where the curve
 * starts up to the largest fault at the generator bus (the most the machine delivers), both at constant
 * current as the other withstand checks. A device not sure to clear over the lower end of the curve
 * leaves the armature's overload to nothing. Both are warnings, not failures: NFPA 70 445.12(A) also
 * accepts protection by the machine's inherent design (its own control), which the study does not
 * show. For a tree whose source is a generator.
 *
 * @example generatorFindings(context, standbyGenerator)
 */
export function generatorFindings(
  context: CheckContext,
  generator: Generator,
  horizon = 1000,
  devices = generatorDevicesOf(context.network),
): Finding[] {
  const { network, faults } = context;
  const name = generator.name ?? generator.id;
  const volts = network.buses.get(generator.bus)!.voltage;
  if (devices.length === 0) {
    return [
      {
        id: `generator-withstand:${generator.id}:none`,
        kind: 'generator-withstand',
        severity: 'warning',
        title: `${name} has no overcurrent device`,
        subjects: [generator.id],
        explanation: `No device at ${name}'s bus lies between it and a fault, so nothing protects its armature (a device further down protects only what lies below it).`,
        suggestion: `Add the generator breaker (${CODE}).`,
        referenceVolts: volts,
      },
    ];
  }
  const points = generator.damage?.map((p) => ({ amps: p.current, seconds: p.time }));
  const curve = generatorDamageCurve(generator, points ? { points } : {});
  const withstand = withstandBandOf(curve, curve.volts / volts);
  const from = withstand.minAmps;
  const to = faults.buses.get(generator.bus)!.max.largest;
  const basis = `${CODE}; ${curve.notes.join(' ')}`;
  // Rated current on the bus's base, for the overload region's reach in per unit.
  const rated = (ratedAmpsOf(generator) * generator.voltage) / volts;
  const findings: Finding[] = [];
  for (const device of devices) {
    const deviceName = nameOf(device);
    const head: Pick<Finding, 'kind' | 'subjects' | 'basis' | 'referenceVolts'> = {
      kind: 'generator-withstand',
      subjects: [device.id, generator.id],
      basis,
      referenceVolts: volts,
    };
    if (!(to > from)) {
      findings.push({
        ...head,
        id: `generator-withstand:${generator.id}:${device.id}`,
        severity: 'ok',
        title: `${name} cannot reach its damage curve`,
        explanation: `The largest fault ${name} feeds, ${formatAmps(to, 3)}, is below where its damage curve starts (${formatAmps(from, 3)}).`,
      });
      continue;
    }
    const band = scaleBand(context.bands.get(device.id)!, locationBusOf(network, device).voltage / volts);
    const clearsFrom = surelyClearsFrom(band, to, horizon);
    if (clearsFrom > from) {
      const range = rangeOf(from, Math.min(clearsFrom, to), volts, []);
      findings.push({
        ...head,
        id: `generator-withstand:${generator.id}:${device.id}:below-pickup`,
        severity: 'warning',
        title: `${deviceName} leaves ${name}'s armature overload unprotected`,
        range,
        explanation: `${capitalise(describeRange(range))} ${deviceName} is not sure to clear within the sheet's time range, yet ${name}'s armature heats there (up to ${significant(Math.min(clearsFrom, to) / rated, 3)} times rated current). ${INHERENT}`,
        suggestion: `Lower ${deviceName}'s long-time pickup toward ${name}'s rated current.`,
      });
    }
    const checkedFrom = Math.max(from, clearsFrom);
    if (!(to > checkedFrom)) continue;
    const { failures, closest } = protectionOf(withstand, band, checkedFrom, to, horizon);
    if (closest) {
      const range = rangeOf(checkedFrom, to, volts, []);
      findings.push({
        ...head,
        id: `generator-withstand:${generator.id}:${device.id}`,
        severity: 'ok',
        title: `${deviceName} protects ${name}`,
        range,
        worst: closest,
        explanation: `${capitalise(describeRange(range))} ${deviceName} clears before ${curve.label} is reached; the closest point is ${formatAmps(closest.amps, 3)}, where it clears in ${formatSeconds(closest.downTime)} against ${formatSeconds(closest.upTime)}.`,
      });
      continue;
    }
    failures.forEach((interval, index) => {
      const range = rangeOf(interval.fromAmps, interval.toAmps, volts, []);
      findings.push({
        ...head,
        id: `generator-withstand:${generator.id}:${device.id}:${index}`,
        severity: 'warning',
        title: `${deviceName} does not protect ${name}`,
        range,
        worst: interval.worst,
        explanation: `${capitalise(describeRange(range))} ${deviceName} may take up to ${formatSeconds(interval.worst.downTime)} to clear, but ${name} withstands only ${formatSeconds(interval.worst.upTime)} there (${curve.label}). ${INHERENT}`,
        suggestion: `Lower ${deviceName}'s long-time pickup or delay, or its short-time pickup, so that it clears below the damage curve up to ${formatAmps(to, 3)}.`,
      });
    });
  }
  return findings;
}

/**
 * The devices at the generator's own bus with no device above them, in study order: its breaker (or
 * each feeder breaker on a generator bus with no main). A device further down protects only what lies
 * below it, not the machine: with none at its bus, the machine has no overcurrent device.
 *
 * @example generatorDevicesOf(network).map((d) => d.id) // ['GEN-CB']
 */
export function generatorDevicesOf(network: Network): Device[] {
  const bus = network.study.source.bus;
  return [...network.devices.values()].filter(
    (device) => locationBusOf(network, device).id === bus && !upstreamDeviceOf(network, device),
  );
}
