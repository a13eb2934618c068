import type { Analysis } from '../engine/analysis.ts';
import { scaleBand } from '../engine/band.ts';
import { CAUTION } from '../engine/caution.ts';
import { locationBusOf } from '../engine/network/index.ts';
import {
  cableWithstandOf,
  inrushMarkersOf,
  motorStartingOf,
  transformerWithstandOf,
} from '../engine/withstand/index.ts';
import { conductorAreaCmil } from '../engine/conductors/index.ts';
import type { SheetInput, SheetMarker, SheetRegion, SheetStarting, SheetWithstand } from './sheetInput.ts';

/**
 * Gathers what one view of an analysed study draws, all on the view's reference voltage (DESIGN §3):
 * each device's band scaled by `V_own / V_ref`, the transformer and cable withstand curves (with the
 * Δ–Yg secondary line-to-ground curve × 0.58 beside a transformer's three-phase curve, REFERENCE §1.8),
 * inrush points, motor starting curves, each bus's maximum fault current as a line labelled at both
 * voltages, and the non-selective regions of the view's pairs.
 *
 * @example sheetOf(viewInputOf(analysis, 'service'), { width: 960, height: 720 })
 */
export function viewInputOf(analysis: Analysis, viewId: string): SheetInput {
  const { study, network, faults, bands } = analysis;
  const view = study.views.find((v) => v.id === viewId);
  if (!view)
    throw new RangeError(
      `no view "${viewId}" in the study (views: ${study.views.map((v) => v.id).join(', ') || 'none'})`,
    );
  const ref = view.referenceVoltage;
  const onSheet = (volts: number) => volts / ref;

  // Each band is drawn up to the largest fault at its device's location: beyond it nothing flows.
  const sheetBands = view.devices.map((id) => {
    const device = network.devices.get(id)!;
    const bus = locationBusOf(network, device);
    const fault = faults.buses.get(bus.id)!.max.threePhase;
    // At an infinite bus there is no largest fault to stop the band at.
    const toAmps = Number.isFinite(fault) ? fault * onSheet(bus.voltage) : undefined;
    return {
      id,
      label: device.name ?? id,
      band: scaleBand(bands.get(id)!, onSheet(bus.voltage)),
      ownVolts: bus.voltage,
      toAmps,
    };
  });

  const withstand: SheetWithstand[] = [];
  const markers: SheetMarker[] = [];
  for (const id of view.withstand) {
    const element = network.elements.get(id)!;
    if (element.type === 'transformer') {
      const t = element.item;
      const fault = faults.transformers.get(t.id)!;
      const curve = transformerWithstandOf(t, { sourceImpedancePu: fault.sourceImpedancePu });
      const name = t.name ?? t.id;
      withstand.push({ id: t.id, label: `${name} through-fault`, curve, scale: onSheet(t.secondary) });
      if (fault.factors.withstandShift !== 1) {
        const shift = fault.factors.withstandShift;
        const which = t.connection === 'delta-wye' ? 'secondary L-G' : 'secondary L-L';
        withstand.push({
          id: `${t.id}:shifted`,
          label: `${name} ${which} (× ${shift})`,
          curve,
          scale: onSheet(t.secondary) * shift,
        });
      }
      for (const marker of inrushMarkersOf(t)) markers.push({ ...marker, scale: onSheet(t.primary) });
    } else if (element.type === 'cable') {
      const c = element.item;
      const volts = network.buses.get(c.from)!.voltage;
      const curve = cableWithstandOf(c, { volts, conductorAreaCmil: conductorAreaCmil(c.size) });
      withstand.push({ id: c.id, label: `${c.name ?? c.id} damage`, curve, scale: onSheet(volts) });
    }
  }

  const starting: SheetStarting[] = view.motors.map((id) => {
    const motor = network.elements.get(id)!.item as (typeof study.motors)[number];
    const volts = network.buses.get(motor.bus)!.voltage;
    const start = motorStartingOf(motor, volts);
    markers.push({ ...start.lockedRotor, scale: onSheet(volts) });
    return { id, label: `${motor.name ?? id} starting`, curve: start.curve, scale: onSheet(volts) };
  });

  const busIds = view.faults ?? [
    ...new Set(view.devices.map((id) => locationBusOf(network, network.devices.get(id)!).id)),
  ];
  const faultLines = busIds
    .filter((busId) => Number.isFinite(faults.buses.get(busId)!.max.threePhase))
    .map((busId) => {
      const bus = network.buses.get(busId)!;
      const ownAmps = faults.buses.get(busId)!.max.threePhase;
      return {
        busId,
        label: busId,
        amps: ownAmps * onSheet(bus.voltage),
        ownVolts: bus.voltage,
        ownAmps,
        kind: 'max' as const,
      };
    });

  const shown = new Set(view.devices);
  const regions: SheetRegion[] = analysis.findings
    .filter(
      (f) =>
        f.kind === 'coordination' &&
        f.range &&
        f.status &&
        f.status !== 'selective' &&
        f.subjects.every((s) => shown.has(s)),
    )
    .map((f) => ({
      fromAmps: (f.range!.fromAmps * f.referenceVolts) / ref,
      toAmps: (f.range!.toAmps * f.referenceVolts) / ref,
      status: f.status as SheetRegion['status'],
      label: f.title,
      findingId: f.id,
    }))
    .filter((r) => r.toAmps > r.fromAmps);

  return {
    study: study.name,
    view: view.id,
    title: view.title ?? view.id,
    preparedBy: study.preparedBy,
    date: study.date,
    notes: view.notes,
    referenceVolts: ref,
    bands: sheetBands,
    withstand,
    markers,
    starting,
    faultLines,
    regions,
    currentRange: view.currentRange,
    timeRange: view.timeRange,
    caution: CAUTION,
  };
}
