import { formatAmps, formatSeconds, significant } from '../quantity/format.ts';
import type { Device, Transformer } from '../study/index.ts';
import {
  inrushMarkersOf,
  throughFaultReachOf,
  transformerRatedAmps,
  transformerWithstandOf,
} from '../withstand/index.ts';
import {
  capitalise,
  describeRange,
  nameOf,
  protectingDevice,
  rangeOf,
  surelyClearsFrom,
  type CheckContext,
} from './context.ts';
import type { Finding } from './finding.ts';
import { protectionOf, withstandBandOf } from './withstandBand.ts';

/**
 * Checks a transformer's primary device against the transformer (IEEE C57.109 / C57.12.59 through-fault
 * curves; inrush points common practice): it must clear
 * below the IEEE C57.109 / C57.12.59 through-fault curve up to the largest secondary fault it sees
 * (three-phase; for Δ–Yg also the secondary line-to-ground fault, with the curve shifted by 0.58,
 * IEEE C37.91 shift factor, exactly 1/√3; Δ–Δ line-to-line with √3/2), the unbalanced currents from the
 * sequence networks (so a resistance-grounded secondary brings little or no line-to-ground case), and it must not operate on magnetising inrush.
 * All on the primary voltage base.
 *
 * @example transformerFindings(context, t1)
 */
export function transformerFindings(context: CheckContext, transformer: Transformer, horizon = 1000): Finding[] {
  const device = protectingDevice(context, transformer.id);
  const name = transformer.name ?? transformer.id;
  const volts = transformer.primary;
  if (!device) {
    return [
      {
        id: `transformer-withstand:${transformer.id}:none`,
        kind: 'transformer-withstand',
        severity: 'warning',
        title: `${name} has no primary device`,
        subjects: [transformer.id],
        explanation: `No device feeds ${name}, so nothing in this study protects it against through-faults or is checked against its inrush.`,
        suggestion: 'Add the primary fuse or relay that feeds the transformer.',
        referenceVolts: volts,
      },
    ];
  }
  const band = context.bands.get(device.id)!;
  const findings = throughFaultFindings(context, transformer, device, horizon);
  const deviceName = nameOf(device);

  // Inrush: the device must not operate at or below/left of each inrush point.
  for (const marker of inrushMarkersOf(transformer)) {
    const operates = band.minTime(marker.amps);
    const ok = operates > marker.seconds!;
    findings.push({
      id: `transformer-inrush:${transformer.id}:${marker.seconds}`,
      kind: 'transformer-inrush',
      severity: ok ? 'ok' : 'fail',
      // Two inrush points per transformer: the title says which, so the two findings read apart.
      title: ok
        ? `${deviceName} rides through ${name}'s inrush at ${significant(marker.seconds!)} s`
        : `${deviceName} may trip on ${name}'s inrush at ${significant(marker.seconds!)} s`,
      subjects: [device.id, transformer.id],
      range: rangeOf(marker.amps, marker.amps, volts, []),
      explanation: `${marker.label}: ${formatAmps(marker.amps, 3)} for ${formatSeconds(marker.seconds!)}. ${deviceName} ${
        operates === Infinity ? 'does not operate at that current' : `may operate after ${formatSeconds(operates)}`
      }${ok ? ', later than the inrush lasts.' : ', before the inrush has decayed.'}`,
      suggestion: ok
        ? undefined
        : `Raise ${deviceName}'s instantaneous pickup or its time delay above ${formatAmps(marker.amps, 3)} at ${significant(marker.seconds!)} s.`,
      basis: 'inrush points (8–12 × rated for 0.1 s, 25 × for 0.01 s) are common practice',
      referenceVolts: volts,
    });
  }
  return findings;
}

/**
 * The primary device against the transformer's through-fault curve, for the three-phase fault and (Δ–Y,
 * Δ–Δ) the shifted unbalanced case: where it is not sure to clear, where it clears below the curve, and
 * where it does not. A source so weak that the transformer never carries a through-fault current the
 * curve covers gives one note instead.
 */
function throughFaultFindings(
  context: CheckContext,
  transformer: Transformer,
  device: Device,
  horizon: number,
): Finding[] {
  const band = context.bands.get(device.id)!;
  const fault = context.faults.transformers.get(transformer.id)!;
  const reach = throughFaultReachOf(transformer, fault.sourceImpedancePu);
  if (!(reach.maxPu > reach.lowestPu)) return [weakSourceFinding(transformer, device, reach)];
  const curve = transformerWithstandOf(transformer, { sourceImpedancePu: fault.sourceImpedancePu });
  const toPrimary = transformer.secondary / transformer.primary;
  const findings: Finding[] = [];
  const deviceName = nameOf(device);
  const name = transformer.name ?? transformer.id;
  const volts = transformer.primary;

  const cases = [{ label: 'three-phase', shift: 1, toAmps: fault.reflectedToPrimary }];
  if (fault.factors.withstandShift !== 1) {
    const unbalanced =
      transformer.connection === 'delta-wye' ? fault.unbalanced.lineToGround : fault.unbalanced.lineToLine;
    cases.push({
      label: transformer.connection === 'delta-wye' ? 'secondary line-to-ground' : 'secondary line-to-line',
      shift: fault.factors.withstandShift,
      toAmps: Math.max(...unbalanced.primaryLineAmps),
    });
  }

  for (const faultCase of cases) {
    const withstand = withstandBandOf(curve, toPrimary * faultCase.shift);
    const clearsFrom = surelyClearsFrom(band, faultCase.toAmps, horizon);
    const from = withstand.minAmps;
    const to = Math.min(faultCase.toAmps, withstand.maxAmps);
    const suffix =
      faultCase.shift === 1 ? '' : ` (${faultCase.label} fault: curve × ${significant(faultCase.shift, 3)})`;
    if (!(to > from)) continue;
    if (clearsFrom > from) {
      const range = rangeOf(from, Math.min(clearsFrom, to), volts, [transformer.secondary]);
      // Up to about three times rated current the secondary devices are expected to carry the duty.
      const usual = clearsFrom <= 3 * transformerRatedAmps(transformer, volts) * faultCase.shift;
      findings.push({
        id: `transformer-withstand:${transformer.id}:${faultCase.label}:below-pickup`,
        kind: 'transformer-withstand',
        severity: usual ? 'info' : 'warning',
        title: `${deviceName} leaves ${name}'s overload region to the secondary devices${suffix}`,
        subjects: [device.id, transformer.id],
        range,
        explanation: `${capitalise(describeRange(range))} ${deviceName} is not sure to clear within the sheet's time range, so it does not protect ${name} there${suffix}; the secondary main and the load devices must.${usual ? " This is usual for a primary device set above the transformer's full-load current." : ` That reaches ${significant(clearsFrom / transformerRatedAmps(transformer, volts), 3)} times rated current: a smaller primary device would cover more of the through-fault range.`}`,
        referenceVolts: volts,
      });
    }
    const checkedFrom = Math.max(from, clearsFrom);
    if (!(to > checkedFrom)) continue;
    const { failures, closest } = protectionOf(withstand, band, checkedFrom, to, horizon);
    const range = rangeOf(checkedFrom, to, volts, [transformer.secondary]);
    if (closest) {
      findings.push({
        id: `transformer-withstand:${transformer.id}:${faultCase.label}`,
        kind: 'transformer-withstand',
        severity: 'ok',
        title: `${deviceName} protects ${name}${suffix}`,
        subjects: [device.id, transformer.id],
        range,
        worst: closest,
        explanation: `${capitalise(describeRange(range))} ${deviceName} clears before ${curve.label} is reached${suffix}; the closest point is ${formatAmps(closest.amps, 3)}, where it clears in ${formatSeconds(closest.downTime)} against ${formatSeconds(closest.upTime)}.`,
        basis: curve.notes.join(' '),
        referenceVolts: volts,
      });
      continue;
    }
    failures.forEach((interval, index) => {
      const failed = rangeOf(interval.fromAmps, interval.toAmps, volts, [transformer.secondary]);
      findings.push({
        id: `transformer-withstand:${transformer.id}:${faultCase.label}:${index}`,
        kind: 'transformer-withstand',
        // A secondary ground fault beyond the secondary main is cleared by the main; the primary device
        // alone covers the zone up to the main, so the unbalanced cases warn rather than fail.
        severity: faultCase.shift === 1 ? 'fail' : 'warning',
        title: `${deviceName} does not protect ${name}${suffix}`,
        subjects: [device.id, transformer.id],
        range: failed,
        worst: interval.worst,
        explanation: `${capitalise(describeRange(failed))} ${deviceName} may take up to ${formatSeconds(interval.worst.downTime)} to clear, but ${name} withstands only ${formatSeconds(interval.worst.upTime)} there (${curve.label})${suffix}.`,
        suggestion: `Use a smaller or faster primary device, or lower its pickup or time dial, so that it clears below the through-fault curve up to ${formatAmps(to, 3)}.`,
        basis: curve.notes.join(' '),
        referenceVolts: volts,
      });
    });
  }
  return findings;
}

/** A note that no through-fault reaches the transformer's curve: the source limits it below where the curve starts. */
function weakSourceFinding(
  transformer: Transformer,
  device: Device,
  reach: { maxPu: number; lowestPu: number },
): Finding {
  const name = transformer.name ?? transformer.id;
  return {
    id: `transformer-withstand:${transformer.id}:weak-source`,
    kind: 'transformer-withstand',
    severity: 'info',
    title: `${name}'s through-fault curve is not reached: the source limits its fault current`,
    subjects: [device.id, transformer.id],
    explanation: `With the source's impedance added to its own ${significant(transformer.impedance, 3)} %, ${name} carries at most ${significant(reach.maxPu, 3)} times its rated current on a secondary fault, below the ${significant(reach.lowestPu, 3)} times rated current where its through-fault curve starts (IEEE C57.109: Categories III and IV take the source impedance into the largest through-fault current). ${nameOf(device)} is therefore not checked against the curve (its NEC 450.3 limits still are).`,
    referenceVolts: transformer.primary,
  };
}
