import { locationBusOf } from '../network/index.ts';
import type { Device, Study } from '../study/index.ts';
import {
  AHJ_SELECTIVITY_SECONDS,
  notShownText,
  pairsAboveOf,
  SELECTIVITY_ARTICLE,
  type ScenarioPairs,
} from './codeSelectivity.ts';
import { illustrativeSentence, isIllustrative } from './coordination.ts';
import { nameOf } from './context.ts';
import { inSeriesAlone } from './seriesException.ts';
import type { Finding } from './finding.ts';

/** The edition of NFPA 70 that brought in 240.11. */
const FROM_EDITION = '2023';

/**
 * NFPA 70 (2023) 240.11: where one or more feeder devices must be selectively coordinated with a
 * service overcurrent device, every feeder device the service device supplies directly must be. A
 * device the study marks (emergency, legally required standby, critical operations, elevator) must be
 * selective with every supply-side device, so on a tree fed by the utility the feeder device on its path
 * just below the service device must be (one that feeds a cable, transformer or bus, not a branch
 * circuit's; not one the Exception for two devices in series leaves out); then so must every feeder device
 * the service device supplies directly, that one included, each over its own range. The
 * service device is taken as a device with no device above it in a tree the utility feeds (the study's
 * utility source stands at the service point): the engineer confirms it. Each such pair is read as the
 * code-selectivity check reads the marked devices' own pairs (`codeSelectivityFindings`: an interval
 * classed "overlap" or "not provable from curves" is not shown selective, and with `codeSelectivity:
 * "above-0.1-s"` one is accepted where the feeder device clears within 0.1 s at its lowest current). One
 * finding per service device, in the 2023 edition only.
 *
 * @example serviceSelectivityFindings(study, [{ label: 'Normal', parts: [analysis] }])
 */
export function serviceSelectivityFindings(
  study: Study,
  scenarios: ScenarioPairs[],
  { labelled = true }: { labelled?: boolean } = {},
): Finding[] {
  if (study.coordination.edition !== FROM_EDITION || !study.devices.some((device) => device.system)) return [];
  const aboveTenthSecond = study.coordination.codeSelectivity === 'above-0.1-s';
  // What each service device is found to owe, by its id, in the order met.
  const owed = new Map<string, ServiceDuty>();
  for (const scenario of scenarios)
    for (const part of scenario.parts) {
      if (part.study.source.kind === 'generator') continue;
      const { network, pairs, bands } = part;
      const pairAbove = pairsAboveOf(part);
      const above = (id: string) => pairAbove.get(id)?.upstream;
      // A feeder device (one that feeds a cable, transformer or bus; not a branch circuit's) sits on a marked
      // device's path just below its tree's top device, which its article then asks it to be selective with
      // (but for the Exception's two devices in series with no load in parallel).
      const isFeeder = (device: Device) => network.elements.get(device.feeds)?.type !== 'motor';
      const requiredBy = new Map<string, { feeder: Device; marked: Device }>();
      for (const marked of study.devices) {
        if (!marked.system || !network.devices.has(marked.id)) continue;
        let down = marked.id;
        let up = above(down);
        while (up !== undefined && pairAbove.has(up)) [down, up] = [up, above(up)];
        if (up === undefined || requiredBy.has(up)) continue;
        const feeder = network.devices.get(down)!;
        const exempt = SELECTIVITY_ARTICLE[marked.system].seriesException && inSeriesAlone(network, up, down);
        if (isFeeder(feeder) && !exempt) requiredBy.set(up, { feeder, marked });
      }
      for (const [serviceId, reason] of requiredBy) {
        const service = network.devices.get(serviceId)!;
        let duty = owed.get(serviceId);
        if (!duty) {
          const volts = locationBusOf(network, service).voltage;
          duty = {
            service,
            reason,
            referenceVolts: volts,
            problems: [],
            failing: [],
            checked: [],
            feeders: new Set(),
            illustrative: new Set(),
          };
          owed.set(serviceId, duty);
        }
        duty.checked.push(scenario.label);
        for (const pair of pairs) {
          const feeder = network.devices.get(pair.downstream)!;
          if (pair.upstream !== serviceId || !isFeeder(feeder)) continue;
          // The sheet's base: the feeders' own voltage, where their intervals are read.
          if (duty.feeders.size === 0) duty.referenceVolts = pair.cases[0]?.referenceVolts ?? duty.referenceVolts;
          duty.feeders.add(nameOf(feeder));
          for (const each of [service, feeder]) if (isIllustrative(each)) duty.illustrative.add(nameOf(each));
          for (const fault of pair.cases)
            for (const interval of fault.intervals) {
              if (interval.status === 'selective' || interval.status === 'thin margin') continue;
              // The intervals are on the feeder device's own voltage, its band's.
              if (
                aboveTenthSecond &&
                (bands.get(feeder.id)?.maxTime(interval.fromAmps) ?? Infinity) <= AHJ_SELECTIVITY_SECONDS
              )
                continue;
              duty.failing.push(scenario.label);
              duty.problems.push(
                `${scenario.label}: ${notShownText(nameOf(service), nameOf(feeder), interval, interval.toAmps, fault)}`,
              );
            }
        }
      }
    }
  const scope = aboveTenthSecond
    ? 'for faults lasting longer than 0.1 s (the study option "above-0.1-s")'
    : 'over the full range of available fault currents';
  const findings: Finding[] = [];
  for (const { service, reason, referenceVolts, problems, failing, checked, feeders, illustrative } of owed.values()) {
    // A service device that supplies no feeder but the one on the marked path adds nothing to that
    // device's own finding.
    if (feeders.size === 1 && feeders.has(nameOf(reason.feeder))) continue;
    const { system } = SELECTIVITY_ARTICLE[reason.marked.system!];
    const why = `${nameOf(reason.feeder)} must be selectively coordinated with ${nameOf(service)}, since ${nameOf(reason.marked)} (${system}) must be selective with every supply-side device; NFPA 70 (2023) 240.11 then asks the same of every feeder device ${nameOf(service)} supplies directly, ${scope}. ${nameOf(service)} is taken as the service overcurrent device: it has no device above it in the utility's tree (confirm that the study's utility source stands at the service point).`;
    findings.push({
      id: `service-selectivity:${service.id}`,
      kind: 'code-selectivity',
      severity: problems.length > 0 ? 'fail' : illustrative.size > 0 ? 'warning' : 'ok',
      title: `${nameOf(service)}: NFPA 70 240.11 selective coordination of the feeders it supplies`,
      subjects: [service.id],
      explanation:
        problems.length > 0
          ? `${why} Not shown: ${problems.join('; ')}. The authority having jurisdiction decides what selective coordination means where the work is done.`
          : `${why} ${illustrative.size > 0 ? 'On their curves, ' : ''}${[...feeders].join(', ')} ${feeders.size > 1 ? 'are' : 'is'} selective with it wherever it supplies ${feeders.size > 1 ? 'them' : 'it'} (scenarios checked: ${[...new Set(checked)].join(', ')}).${illustrative.size > 0 ? ` ${illustrativeSentence([...illustrative])}` : ''}`,
      suggestion:
        problems.length > 0
          ? "Separate the overlapping devices (raise or delay the service device, lower the feeder's instantaneous), or show selectivity from the manufacturers' tested selectivity tables."
          : undefined,
      basis: 'NFPA 70 (2023) 240.11',
      referenceVolts,
      ...(labelled ? { scenarios: [...new Set(failing.length > 0 ? failing : checked)] } : {}),
    });
  }
  return findings;
}

/** What one service device is found to owe across the scenarios. */
interface ServiceDuty {
  service: Device;
  /** The first marked device whose path makes a feeder of this service device owe selectivity, and that feeder. */
  reason: { feeder: Device; marked: Device };
  /** The voltage the feeders' intervals are read at. */
  referenceVolts: number;
  problems: string[];
  failing: string[];
  checked: string[];
  /** The names of the feeder devices checked, the one on the marked path included. */
  feeders: Set<string>;
  illustrative: Set<string>;
}
