import { formatAmps, formatVolts, significant } from '../engine/quantity/format.ts';
import type { Analysis } from '../engine/analysis.ts';
import type { Finding } from '../engine/checks/finding.ts';
import { fastestOf, groundFaultBandOf, scaleBand, type Band } from '../engine/band.ts';
import { CAUTION } from '../engine/caution.ts';
import { busFaultLineOf } from './busFaultLine.ts';
import { longTimeRampBasis } from '../engine/devices/tripUnit.ts';
import { locationBusOf } from '../engine/network/index.ts';
import { deviceFaultOf, largestFaultOf } from '../engine/fault/index.ts';
import {
  cableWithstandOf,
  inrushMarkersOf,
  motorStartingOf,
  throughFaultReachOf,
  transformerRatedAmps,
  transformerWithstandOf,
} from '../engine/withstand/index.ts';
import { cableAmpacityOf, conductorAreaCmil } from '../engine/conductors/index.ts';
import { generatorDamageCurve, generatorDecrement } from '../engine/generator/index.ts';
import type {
  SheetBand,
  SheetFaultLine,
  SheetInput,
  SheetMarker,
  SheetRegion,
  SheetStarting,
  SheetWithstand,
} from './sheetInput.ts';

/** A coordination finding a sheet may hatch: it has a current range and a status other than selective. */
type Hatchable = Finding & {
  range: NonNullable<Finding['range']>;
  status: Exclude<Finding['status'], 'selective' | undefined>;
};

function isHatchable(finding: Finding): finding is Hatchable {
  return finding.kind === 'coordination' && !!finding.range && !!finding.status && finding.status !== 'selective';
}

/**
 * The findings a sheet may hatch, with their places in the list, by their first subject (the upstream
 * device; "" for none), for each list of findings. The workbench draws its sheet again at every edit
 * with the findings last received, and a report draws every view with one list: each list is gone
 * through once, not at every drawing (a large study has thousands).
 */
const hatchableByList = new WeakMap<readonly Finding[], Map<string, { at: number; finding: Hatchable }[]>>();

/** The findings of `findings` a sheet of the devices `shown` may hatch, in their order. */
function hatchableOnSheet(findings: readonly Finding[], shown: ReadonlySet<string>): Hatchable[] {
  let byUpstream = hatchableByList.get(findings);
  if (!byUpstream) {
    byUpstream = new Map();
    findings.forEach((finding, at) => {
      if (!isHatchable(finding)) return;
      const upstream = finding.subjects[0] ?? '';
      let list = byUpstream!.get(upstream);
      if (!list) byUpstream!.set(upstream, (list = []));
      list.push({ at, finding });
    });
    hatchableByList.set(findings, byUpstream);
  }
  const found = [...(byUpstream.get('') ?? [])];
  for (const id of shown) if (id !== '') found.push(...(byUpstream.get(id) ?? []));
  return found.sort((a, b) => a.at - b.at).map(({ finding }) => finding);
}

/** The few words a region on a shifted upstream band ends its plot label with. */
const SHIFTED_FAULT_WORDS: Record<string, string> = {
  'line-to-line': 'secondary L-L',
  'single-phase': 'single-phase secondary',
  'line-to-neutral': 'secondary L-N',
};

/**
 * Gathers what one view of an analysed study draws, all on the view's reference voltage (DEVELOPERS.md, names):
 * each device's band scaled by `V_own / V_ref`, the transformer and cable withstand curves (with the
 * Δ–Yg secondary line-to-ground curve × 0.58 beside a transformer's three-phase curve, IEEE C37.91 / IEEE C57.109 delta–wye shift factors),
 * inrush points, motor starting curves, each bus's maximum fault current as a line labelled at both
 * voltages (at a transformer's primary voltage, the current through it: `busFaultLineOf`), and the non-selective regions of the view's pairs, each hatched between the two edges in
 * conflict. Where a finding rests on a secondary line-to-line fault the upstream band is drawn again,
 * shifted as the pair check shifted it (2/√3 across a Δ–Y transformer). A ground-fault view (`groundFault`) adds each ground-fault element's band, draws the
 * line-to-ground fault currents and hatches the ground-fault findings, which other views leave out.
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

  // Each band is drawn up to the largest fault current through its device (a main's stops at what its
  // transformer passes, short of its bus's motors): beyond it nothing flows through that device.
  const ground = view.groundFault;
  const located = new Map(
    view.devices.map((id) => {
      const device = network.devices.get(id)!;
      const bus = locationBusOf(network, device);
      const fault = largestFaultOf(deviceFaultOf(network, faults, device), ground);
      // At an infinite bus there is no largest fault to stop the band at.
      const toAmps = Number.isFinite(fault) && fault > 0 ? fault * onSheet(bus.voltage) : undefined;
      return [id, { device, bus, toAmps }] as const;
    }),
  );
  const sheetBands: SheetBand[] = view.devices.map((id) => {
    const { device, bus, toAmps } = located.get(id)!;
    return {
      id,
      label: device.name ?? id,
      band: scaleBand(bands.get(id)!, onSheet(bus.voltage)),
      ownVolts: bus.voltage,
      toAmps,
    };
  });
  if (ground)
    for (const id of view.devices) {
      const { device, bus, toAmps } = located.get(id)!;
      const element = groundFaultBandOf(device.characteristic);
      if (element)
        sheetBands.push({
          id: `${id}:ground-fault`,
          label: `${device.name ?? id} ground-fault`,
          band: scaleBand(element, onSheet(bus.voltage)),
          ownVolts: bus.voltage,
          toAmps,
        });
    }

  const withstand: SheetWithstand[] = [];
  const markers: SheetMarker[] = [];
  const starting: SheetStarting[] = [];
  for (const id of view.withstand) {
    const source = study.source;
    if (source.kind === 'generator' && id === source.id) {
      // The machine's damage curve, and its fault current against time at the terminals (the decrement).
      const name = source.name ?? source.id;
      const scale = onSheet(source.voltage);
      const points = source.damage?.map((p) => ({ amps: p.current, seconds: p.time }));
      const damage = generatorDamageCurve(source, points ? { points } : {});
      withstand.push({ id, label: `${name} ${points ? 'damage curve' : 'armature damage'}`, curve: damage, scale });
      const decrement = generatorDecrement(source, { frequency: study.frequency });
      const curve = { ...decrement, elementId: id, label: `${name} decrement`, amps: decrement.amps };
      starting.push({ id: `${id}:decrement`, label: `${name} fault current (decrement)`, curve, scale });
      continue;
    }
    const element = network.elements.get(id);
    if (!element) continue;
    if (element.type === 'transformer') {
      const t = element.item;
      const fault = faults.transformers.get(t.id)!;
      const name = t.name ?? t.id;
      const reach = throughFaultReachOf(t, fault.sourceImpedancePu);
      // A source too weak to drive a through-fault onto the curve leaves no curve to draw (the check says so).
      const curve =
        reach.maxPu > reach.lowestPu
          ? transformerWithstandOf(t, { sourceImpedancePu: fault.sourceImpedancePu })
          : undefined;
      if (curve) withstand.push({ id: t.id, label: `${name} through-fault`, curve, scale: onSheet(t.secondary) });
      if (curve && fault.factors.withstandShift !== 1) {
        const shift = fault.factors.withstandShift;
        const which = t.connection === 'delta-wye' ? 'secondary L-G' : 'secondary L-L';
        withstand.push({
          id: `${t.id}:shifted`,
          label: `${name} ${which} (× ${significant(shift, 3)})`,
          curve,
          scale: onSheet(t.secondary) * shift,
        });
      }
      // Its rated current, the base of its withstand curve and inrush, which the device feeding it carries.
      const fullLoadAmps = transformerRatedAmps(t, t.primary);
      markers.push({
        kind: 'full-load',
        label: `${name} full-load current (${formatAmps(fullLoadAmps, 4)} at ${formatVolts(t.primary)})`,
        volts: t.primary,
        amps: fullLoadAmps,
        elementId: t.id,
        scale: onSheet(t.primary),
      });
      for (const marker of inrushMarkersOf(t)) markers.push({ ...marker, scale: onSheet(t.primary) });
    } else if (element.type === 'cable') {
      const c = element.item;
      const volts = network.buses.get(c.from)!.voltage;
      const curve = cableWithstandOf(c, { volts, conductorAreaCmil: conductorAreaCmil(c.size) });
      // ICEA P-32-382 is adiabatic: a short-circuit limit to 10 s, saying nothing of overload. The
      // cable's ampacity, drawn as a line, is its limit for overload (NFPA 70 240.4, 1000 V and less).
      withstand.push({
        id: c.id,
        label: `${c.name ?? c.id} short-circuit limit (overload not covered)`,
        curve,
        scale: onSheet(volts),
      });
      const ampacity = volts <= 1000 ? cableAmpacityOf(c) : undefined;
      if (ampacity !== undefined)
        markers.push({
          kind: 'ampacity',
          label: `${c.name ?? c.id} ampacity ${formatAmps(ampacity, 3)} (${c.ampacity === undefined ? 'NFPA 70 Table 310.16, 75 °C' : 'as given'}${c.sets > 1 ? `, ${c.sets} sets` : ''})`,
          volts,
          amps: ampacity,
          elementId: c.id,
          scale: onSheet(volts),
        });
    }
  }

  for (const id of view.motors) {
    const motor = network.elements.get(id)!.item as (typeof study.motors)[number];
    const volts = network.buses.get(motor.bus)!.voltage;
    const start = motorStartingOf(motor, volts);
    markers.push({ ...start.lockedRotor, scale: onSheet(volts) });
    starting.push({ id, label: `${motor.name ?? id} starting`, curve: start.curve, scale: onSheet(volts) });
  }

  const busIds = view.faults ?? [
    ...new Set(view.devices.map((id) => locationBusOf(network, network.devices.get(id)!).id)),
  ];
  const faultLines: SheetFaultLine[] = busIds.flatMap((busId) => {
    const line = busFaultLineOf(network, faults, busId, ref, ground);
    return line ? [line] : [];
  });

  // Findings of the view's pairs, each hatched between its two edges; ground-fault ones only on a ground-fault view.
  const shown = new Set(view.devices);
  const onSheetBand = (id: string) => {
    const { bus } = located.get(id)!;
    return (band: Band, shift = 1) => scaleBand(band, onSheet(bus.voltage) / shift);
  };
  // The upstream current per downstream current of a pair's fault case, as the pair check used it.
  const shiftOf = (up: string, down: string, fault: string = 'line-to-line') =>
    analysis.pairs.find((p) => p.upstream === up && p.downstream === down)?.cases.find((c) => c.fault === fault)
      ?.upstreamShift ?? 1;
  const edgesOf = (up: string, down: string, fault: string): SheetRegion['edges'] => {
    const upDevice = network.devices.get(up)!;
    const downDevice = network.devices.get(down)!;
    if (fault === 'line-to-line' || fault === 'single-phase' || fault === 'line-to-neutral')
      return {
        upstream: onSheetBand(up)(bands.get(up)!, shiftOf(up, down, fault)),
        downstream: onSheetBand(down)(bands.get(down)!),
      };
    const withGround = (d: typeof upDevice) => {
      const element = groundFaultBandOf(d.characteristic);
      return element ? fastestOf([bands.get(d.id)!, element]) : bands.get(d.id)!;
    };
    if (fault === 'ground-fault')
      return { upstream: onSheetBand(up)(withGround(upDevice)), downstream: onSheetBand(down)(withGround(downDevice)) };
    // A line-to-ground fault above the three-phase current: the upstream phase elements against all below.
    if (fault === 'line-to-ground')
      return { upstream: onSheetBand(up)(bands.get(up)!), downstream: onSheetBand(down)(withGround(downDevice)) };
    return { upstream: onSheetBand(up)(bands.get(up)!), downstream: onSheetBand(down)(bands.get(down)!) };
  };
  const regions: SheetRegion[] = [];
  const shifted = new Map<string, { shift: number; fault: string }>();
  for (const f of hatchableOnSheet(analysis.findings, shown)) {
    if (!f.subjects.every((id) => shown.has(id))) continue;
    const fault =
      /:(three-phase|line-to-line|ground-fault|line-to-ground|single-phase|line-to-neutral):\d+(?:@[^:]+)?$/.exec(
        f.id,
      )?.[1] ?? 'three-phase';
    if ((fault === 'ground-fault') !== ground) continue;
    const isShifted = fault === 'line-to-line' || fault === 'single-phase' || fault === 'line-to-neutral';
    const shift = isShifted ? shiftOf(f.subjects[0], f.subjects[1], fault) : 1;
    const upName = network.devices.get(f.subjects[0])?.name ?? f.subjects[0];
    const region: SheetRegion = {
      fromAmps: (f.range.fromAmps * f.referenceVolts) / ref,
      toAmps: (f.range.toAmps * f.referenceVolts) / ref,
      status: f.status,
      // The region spans the fault's own currents by the voltage ratio; the finding's text also gives
      // them as the upstream device carries them, shifted: say so, or the two ranges seem to disagree.
      label:
        shift === 1
          ? f.title
          : `${f.title} (the fault's current by the voltage ratio; ${upName} carries × ${significant(shift, 4)} of it)`,
      ...(shift === 1 ? {} : { fault: SHIFTED_FAULT_WORDS[fault] }),
      findingId: f.id,
      edges: edgesOf(f.subjects[0], f.subjects[1], fault),
    };
    if (!(region.toAmps > region.fromAmps)) continue;
    regions.push(region);
    if (isShifted) shifted.set(f.subjects[0], { shift, fault });
  }
  // The finding rests on the upstream band shifted for a secondary line-to-line fault: draw that band too.
  const faultWords: Record<string, string> = {
    'line-to-line': 'a secondary L-L fault',
    'single-phase': 'a single-phase secondary fault',
    'line-to-neutral': 'a secondary line-to-neutral fault',
  };
  for (const [id, { shift, fault }] of shifted) {
    const { device, bus, toAmps } = located.get(id)!;
    sheetBands.push({
      id: `${id}:${fault}`,
      label: `${device.name ?? id} for ${faultWords[fault]} (× ${significant(shift, 4)})`,
      band: onSheetBand(id)(bands.get(id)!, shift),
      ownVolts: bus.voltage,
      toAmps,
    });
  }

  return {
    study: study.name,
    view: view.id,
    title: view.title ?? view.id,
    preparedBy: study.preparedBy,
    checkedBy: study.checkedBy,
    site: study.site,
    client: study.client,
    revision: study.revisions.at(-1)?.revision,
    date: study.date,
    // Say on the sheet how its trip units' long-time and short-time functions meet.
    notes:
      [
        view.notes,
        ...new Set(
          view.devices.flatMap((id) => {
            const c = network.devices.get(id)!.characteristic;
            const basis = c.kind === 'trip-unit' ? longTimeRampBasis(c) : undefined;
            return basis ? [`Trip units: ${basis}.`] : [];
          }),
        ),
      ]
        .filter(Boolean)
        .join(' ') || undefined,
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
