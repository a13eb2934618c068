import type { Band } from '../band.ts';
import { cachedFastestOf, cachedGroundBandOf } from '../bandCache.ts';
import { DELTA_WYE_TABLE, MINIMUM_FAULT_TEMPERATURE, secondaryWindingOf } from '../fault/index.ts';
import { locationBusOf, transformersBetween, type Network } from '../network/index.ts';
import { formatAmps, formatSeconds, formatVolts, significant } from '../quantity/format.ts';
import type { Bus, CoordinationSettings, Device, Transformer } from '../study/index.ts';
import { withLazyText } from '../lazyText.ts';
import { nameOf, rangeOf, type CheckContext } from './context.ts';
import type { CurrentRange, Finding } from './finding.ts';
import { sentencesOf, sharedSentencesOf, type Rerun, type SharedSentences } from './sharedSentences.ts';

/** The sensitivity options of a study (`coordination.sensitivity`). */
export type SensitivitySettings = CoordinationSettings['sensitivity'];

/** The minimum faults a sensitivity check applies: the smallest phase fault and the line-to-ground fault. */
export type SensitivityFault = 'line-to-line' | 'line-to-ground';

/** One minimum fault in a device's zone and what the device does for it. */
export interface SensitivityCase {
  fault: SensitivityFault;
  /** The zone bus where the device sees the least current for this fault. */
  busId: string;
  /** Minimum bolted fault at that bus (A at its voltage), before any arcing factor. */
  boltedAmps: number;
  /** The current through the device (A at its own voltage), arcing factor and transformer shift applied. */
  deviceAmps: number;
  /** Latest clearing time at `deviceAmps` (s); `Infinity` where the device may not operate. */
  clearingTime: number;
  /** Whether a ground-fault element of the device acts on this case. */
  groundElement: boolean;
  /** Whether a transformer lies between the device and the fault. */
  acrossTransformer: boolean;
}

/**
 * The buses a device protects, down to the next devices below it: for a main the bus it feeds, for a
 * transformer or cable the bus at its far end, then every bus reached through branches no other device
 * feeds. A bus fed by a main of its own ends the zone but belongs to it (the main's line terminals are
 * the far end). A motor's zone is its terminals, taken as its bus.
 *
 * @example zoneBusesOf(network, feeder) // ['MCC']
 */
export function zoneBusesOf(network: Network, device: Device): string[] {
  const element = network.elements.get(device.feeds)!;
  if (element.type === 'motor') return [element.item.bus];
  const zone: string[] = [];
  const visit = (busId: string, descend: boolean) => {
    zone.push(busId);
    if (!descend) return;
    for (const branch of network.branchesFrom.get(busId) ?? []) {
      if (network.deviceFeeding.has(branch.item.id)) continue;
      visit(branch.item.to, !network.deviceFeeding.has(branch.item.to));
    }
  };
  if (element.type === 'bus') visit(element.item.id, true);
  else visit(element.item.to, !network.deviceFeeding.has(element.item.to));
  return zone;
}

/**
 * The largest line current on a transformer's primary per ampere of the faulted secondary line, for a
 * secondary fault (the per-unit table of line currents for each connection): 2/√3 for a line-to-line
 * fault across Δ–Y or Y–Δ, 1/√3 for a line-to-ground fault across Δ–Y, 1 where the fault passes as it is.
 * A single-phase unit passes its full-winding fault by the voltage ratio and a half-winding
 * (line-to-neutral) fault of a centre-tapped secondary at half of it, by ampere-turn balance.
 *
 * @example primaryShiftOf(deltaWye, 'line-to-ground') // 0.57735
 */
export function primaryShiftOf(transformer: Transformer, fault: SensitivityFault): number {
  if (transformer.phases === 1) {
    if (fault === 'line-to-line') return 1;
    return secondaryWindingOf(transformer) === 'centre-tapped' ? 0.5 : 1;
  }
  const row = DELTA_WYE_TABLE[transformer.connection][fault === 'line-to-line' ? 'lineToLine' : 'lineToGround'];
  const secondary = Math.max(...row.secondary);
  return secondary > 0 ? Math.max(...row.primary) / secondary : 0;
}

/**
 * For each minimum fault, the zone bus where the device sees the least current, that current, and the
 * device's latest clearing time for it. Line-to-line faults act on the phase elements; line-to-ground
 * faults (where a zero-sequence path gives them current) on the phase elements and, with no transformer
 * between, on a ground-fault element. Across transformers, currents scale by the bus voltages and by
 * the shift of the transformer nearest the fault (`primaryShiftOf`).
 *
 * @example sensitivityCasesOf(context, feeder, { maxTime: 2 })
 */
export function sensitivityCasesOf(
  context: CheckContext,
  device: Device,
  settings: SensitivitySettings,
): SensitivityCase[] {
  const { network, faults, bands } = context;
  const factor = settings.arcingFactor ?? 1;
  const location = locationBusOf(network, device);
  const phaseBand = bands.get(device.id)!;
  // Built once per characteristic and pair of bands, not once per device and zone bus.
  const groundBand = cachedGroundBandOf(device.characteristic);
  const cases: SensitivityCase[] = [];
  const zone = zoneBusesOf(network, device);
  for (const fault of ['line-to-line', 'line-to-ground'] as const) {
    let least: SensitivityCase | undefined;
    for (const busId of zone) {
      const level = faults.buses.get(busId)!.min;
      const boltedAmps = fault === 'line-to-line' ? level.lineToLine : level.lineToGround;
      if (!(boltedAmps > 0)) continue;
      const between = transformersBetween(network, location.id, busId);
      const nearest = between.at(-1);
      const shift = nearest ? primaryShiftOf(nearest, fault) : 1;
      const deviceAmps = (boltedAmps * factor * shift * network.buses.get(busId)!.voltage) / location.voltage;
      if (!(deviceAmps > 0)) continue;
      const groundElement = fault === 'line-to-ground' && groundBand !== undefined && between.length === 0;
      const band: Band = groundElement ? cachedFastestOf(phaseBand, groundBand) : phaseBand;
      const clearingTime = band.maxTime(deviceAmps);
      const acrossTransformer = between.length > 0;
      const candidate = { fault, busId, boltedAmps, deviceAmps, clearingTime, groundElement, acrossTransformer };
      if (!least || worse(candidate, least)) least = candidate;
    }
    if (least) cases.push(least);
  }
  // An exact-size copy: a device's findings keep its cases, and an array grown by `push` keeps room for 17.
  return cases.slice();
}

/**
 * Sensitivity of one device: it must operate, within `settings.maxTime`, for the minimum fault at the
 * far end of the zone it protects (`zoneBusesOf`): minimum source, no motors, conductors at operating
 * temperature, line-to-line and line-to-ground where a zero-sequence path exists, optionally reduced
 * by `settings.arcingFactor` for an arcing fault. One `ok` finding when every case passes; else, per
 * failing case, a `fail` where the device may never clear (a protection failure) or a `warning` where it
 * clears later than the time allowed (a common-practice target the engineer weighs, e.g. a transformer
 * primary device backing up its secondary, where the through-fault check governs).
 *
 * @example sensitivityFindings(context, feeder, study.coordination.sensitivity)
 */
export function sensitivityFindings(context: CheckContext, device: Device, settings: SensitivitySettings): Finding[] {
  // The analysis's findings share their sentence builders, where the device is the network's own.
  const own = context.network.devices.get(device.id) === device;
  return zoneFindings(context, device, settings, own ? sharedSentencesOf(context, settings, zoneAgain) : undefined);
}

/** `zoneFindings` again for a finding's device, each finding writing its own sentences. */
const zoneAgain: Rerun<CheckContext, SensitivitySettings> = (finding, context, settings) =>
  zoneFindings(context, context.network.devices.get(finding.subjects[0])!, settings);

/** `sensitivityFindings`, its findings given `shared` sentence builders, else their own. */
function zoneFindings(
  context: CheckContext,
  device: Device,
  settings: SensitivitySettings,
  shared?: SharedSentences,
): Finding[] {
  const { network } = context;
  const name = nameOf(device);
  const location = locationBusOf(network, device);
  const cases = sensitivityCasesOf(context, device, settings);
  if (cases.length === 0) return [];
  // A relative 1e-9 keeps a clearing time equal to the limit from failing on rounding.
  const failing = cases.filter((c) => !(c.clearingTime <= settings.maxTime * (1 + 1e-9)));
  // The range and the sentences are made when first read (a large study has thousands of devices);
  // the helpers they call are module functions, so a finding keeps only what they read. The basis is
  // one line per study, shared.
  if (failing.length === 0) {
    const slowest = cases.reduce((a, b) => (b.clearingTime > a.clearingTime ? b : a));
    return [
      withLazyText<Finding>(
        {
          id: `sensitivity:${device.id}`,
          kind: 'sensitivity',
          severity: 'ok',
          title: `${name} sees the minimum faults in its zone`,
          subjects: [device.id],
        },
        sentencesOf(shared, {
          range: () => caseRange(network, location, slowest),
          explanation: () =>
            `${cases.map((c) => `For ${describeCase(context, c, name, location.voltage, settings)}, ${name} clears within ${formatSeconds(c.clearingTime)}.`).join(' ')} ${cases.length === 1 ? 'This is' : 'Both are'} within the ${formatSeconds(settings.maxTime)} allowed.`,
        }),
        {
          basis: basisOf(settings, context.network.study.conductorTemperatures.minimumFault),
          referenceVolts: location.voltage,
        },
      ),
    ];
  }
  return failing.map((c) => {
    const never = c.clearingTime === Infinity;
    return withLazyText<Finding>(
      {
        id: `sensitivity:${device.id}:${c.fault}`,
        kind: 'sensitivity',
        severity: never ? 'fail' : 'warning',
        title: never
          ? `${name} may not operate for a minimum ${faultNameOf(context, c)} fault`
          : `${name} is slow for a minimum ${faultNameOf(context, c)} fault`,
        subjects: [device.id],
      },
      sentencesOf(shared, {
        range: () => caseRange(network, location, c),
        explanation: () =>
          never
            ? `For ${describeCase(context, c, name, location.voltage, settings)}, ${name} may never clear: the current is below what its curve surely trips on, so a fault at the far end of its zone could persist.`
            : `For ${describeCase(context, c, name, location.voltage, settings)}, ${name} may take ${formatSeconds(c.clearingTime)} to clear, longer than the ${formatSeconds(settings.maxTime)} allowed for the minimum fault in its zone.`,
        suggestion: () => remedyOf(device, c, settings.maxTime),
      }),
      {
        basis: basisOf(settings, context.network.study.conductorTemperatures.minimumFault),
        referenceVolts: location.voltage,
      },
    );
  });
}

/** Where a case sits on the current axis: the current through the device, also at the faulted bus's voltage. */
function caseRange(network: Network, location: Bus, c: SensitivityCase): CurrentRange {
  return rangeOf(c.deviceAmps, c.deviceAmps, location.voltage, [network.buses.get(c.busId)!.voltage]);
}

/** The fault's name; below a single-phase transformer the faults are the full-winding and line-to-neutral ones. */
function faultNameOf(context: CheckContext, c: SensitivityCase): string {
  return context.faults.buses.get(c.busId)!.phases === 1
    ? { 'line-to-line': 'full-winding', 'line-to-ground': 'line-to-neutral' }[c.fault]
    : c.fault;
}

/** The finding's basis line: the minimum-fault assumptions (conductors at `temperature`, °C) and the time allowed. */
function basisOf(settings: SensitivitySettings, temperature: number): string {
  const written = bases.get(settings);
  if (written?.temperature === temperature) return written.text;
  const text = basisText(settings, temperature);
  bases.set(settings, { temperature, text });
  return text;
}

/** Each study's basis, written once: it is the same for every device the check looks at. */
const bases = new WeakMap<SensitivitySettings, { temperature: number; text: string }>();

function basisText(settings: SensitivitySettings, temperature: number): string {
  const conductors =
    temperature === MINIMUM_FAULT_TEMPERATURE
      ? 'conductors at operating temperature'
      : `conductors at ${temperature} °C (the study's setting)`;
  const arcing =
    settings.arcingFactor === undefined
      ? 'bolted faults'
      : `arcing faults taken as ${significant(settings.arcingFactor * 100, 3)} % of the bolted fault (a user option; common practice, IEEE 1584 gives the method for the arcing current)`;
  return `Minimum fault at the far end of the zone: weakest source, no motors, ${conductors}; ${arcing}; clearing within ${formatSeconds(settings.maxTime)} (${settings.maxTime === 2 ? 'common practice' : 'as set for this study'}).`;
}

/** One case in words: the bolted fault at its bus, and the current through the device (at `volts`) where that differs. */
function describeCase(
  context: CheckContext,
  c: SensitivityCase,
  name: string,
  volts: number,
  settings: SensitivitySettings,
): string {
  const bus = context.network.buses.get(c.busId)!;
  const at = `${formatAmps(c.boltedAmps, 3)} ${faultNameOf(context, c)} at ${bus.name ?? bus.id} (${formatVolts(bus.voltage)})`;
  const arcingText = settings.arcingFactor === undefined ? '' : ' as an arcing fault';
  const through =
    c.deviceAmps === c.boltedAmps
      ? ''
      : `, ${formatAmps(c.deviceAmps, 4)} through ${name} at ${formatVolts(volts)}${arcingText}`;
  return `${at}${through}${c.groundElement ? ', ground-fault element included' : ''}`;
}

/** What to change so the device clears the case in time. */
function remedyOf(device: Device, c: SensitivityCase, maxTime: number): string {
  const name = nameOf(device);
  const goal = `so it clears ${formatAmps(c.deviceAmps, 3)} within ${formatSeconds(maxTime)}`;
  if (device.characteristic.kind === 'fuse') return `Use a smaller fuse or a faster fuse class ${goal}.`;
  if (c.acrossTransformer)
    return `Lower ${name}'s pickup or delay ${goal}, or protect the transformer's secondary conductors with a device of their own.`;
  if (c.fault === 'line-to-ground') return `Lower ${name}'s pickup or delay, or add a ground-fault element, ${goal}.`;
  return `Lower ${name}'s pickup or delay (short-time or instantaneous) ${goal}.`;
}

/** Whether case `a` is harder on the device than `b`: slower to clear, or at equal time, less current. */
function worse(a: SensitivityCase, b: SensitivityCase): boolean {
  if (a.clearingTime !== b.clearingTime) return a.clearingTime > b.clearingTime;
  return a.deviceAmps < b.deviceAmps;
}
