import type { Band } from './band.ts';
import { cachedBandOf, cachedGroundBandOf } from './bandCache.ts';
import type { AnalysisMemo } from './incremental.ts';
import { cableAmpacityFindings } from './checks/cableAmpacity.ts';
import { cableFindings } from './checks/cableProtection.ts';
import { capitalise, protectingDevice, type CheckContext } from './checks/context.ts';
import { ratingOf } from './checks/deviceRating.ts';
import { checkPair, type PairCheck } from './checks/coordination.ts';
import { decrementFindings } from './checks/decrementCoordination.ts';
import { generatorDevicesOf, generatorFindings } from './checks/generatorProtection.ts';
import { expectedGot, InputError } from './errors.ts';
import type { Finding, Severity } from './checks/finding.ts';
import { busRatingFindings, interruptingFindings } from './checks/interruptingDuty.ts';
import { loadFindings } from './checks/loadCarrying.ts';
import { motorFindings } from './checks/motorStarting.ts';
import { nec450Findings } from './checks/nec450.ts';
import { sensitivityFindings } from './checks/sensitivity.ts';
import { transformerFindings } from './checks/transformerProtection.ts';
import { faultLevelsOf, type FaultLevels } from './fault/index.ts';
import { locationBusOf, networkOf, seriesPairs, upstreamDeviceOf, type Network } from './network/index.ts';
import type { ScenarioResult } from './scenario/scenarioAnalysis.ts';
import type { Device, Study } from './study/index.ts';

/** Everything the checks found for one study (DEVELOPERS.md, data flow: the data the plots and reports render). */
export interface Analysis {
  study: Study;
  network: Network;
  faults: FaultLevels;
  /** Each device's band at its own voltage. */
  bands: Map<string, Band>;
  /** Every series pair, with its classified current intervals. */
  pairs: PairCheck[];
  /**
   * Findings in the order: pairs (top down), the pairs on a generator's decaying current, the generator
   * against its damage curve, transformers, code limits, cables (short circuit, then ampacity), motors,
   * loads carried, interrupting duty, equipment short-circuit ratings, sensitivity, settings (the two
   * generator checks only in a tree whose source is a generator).
   */
  findings: Finding[];
  /** How many findings of each severity. */
  counts: Record<Severity, number>;
  /** Every scenario's own results, for a study with generators, switches or scenarios (`analyseScenarios`). */
  scenarios?: ScenarioResult[];
}

/**
 * Runs every check on a radial study that `readStudy` accepted, every bus fed by its source (a study
 * that can be switched, with a bus fed only in some scenarios, goes through `analyseScenarios`): fault
 * levels at every bus, each device's band, every series pair (DEVELOPERS.md, bands and overlaps),
 * on a generator the pairs on its decaying current and its breaker against its damage curve (NFPA 70
 * 445.12(A), IEEE C50.13), transformer through-fault and inrush protection, NEC 450.3 limits, cable
 * short-circuit and overload protection (ICEA P-32-382, NEC 240.4), motor starting, each pickup against
 * the load it feeds, interrupting duty and equipment short-circuit ratings (NFPA 70 110.9, 110.10) and
 * sensitivity to the minimum fault in each zone. Pure: the result depends only on `study`; a `memo` kept from the
 * analysis before an edit (see `AnalysisMemo`) only saves the work of what the edit did not change.
 *
 * @example const { findings } = analyseStudy(parseStudy(text))
 */
export function analyseStudy(study: Study, memo?: AnalysisMemo): Analysis {
  const network = networkOf(study);
  // With a memo (the workbench, edit after edit) unchanged fault levels and pairs are taken from it.
  const faults = memo ? memo.faultsOf(network) : faultLevelsOf(network);
  // A bus no source feeds (behind an open switch, or a standby generator's) has no fault level: such a
  // study is worked out a scenario at a time, each scenario's trees radial (`analyseScenarios`).
  const unfed = study.buses.find((bus) => !faults.buses.has(bus.id));
  if (unfed) {
    throw new InputError(
      'study.buses',
      expectedGot('every bus fed by the source (a study that can be switched goes through analyseScenarios)', unfed.id),
    );
  }
  // Equal characteristics share one band (a site's many identical breakers are built once).
  const bands = new Map(study.devices.map((device) => [device.id, cachedBandOf(device.characteristic)]));
  const context: CheckContext = { network, faults, bands };
  const findings: Finding[] = [];

  const pairs: PairCheck[] = [];
  // A panel's identical feeders ask the finder the same question of its main: this analysis answers
  // each once. The answers are kept for the pair checks alone, not by the findings' context.
  const pairContext: CheckContext = { network, faults, bands, overlaps: new Map() };
  for (const pair of seriesPairs(network)) {
    const { check, findings: pairFindings } = memo
      ? memo.pair(pairContext, pair, study.coordination)
      : checkPair(pairContext, pair, study.coordination);
    pairs.push(check);
    findings.push(...pairFindings);
  }
  findings.push(...decrementFindings({ network, faults, bands, pairs, study }));
  // With a memo, each item's findings are taken from it while the fault levels (so the network), the
  // item, the devices whose bands and names its check reads and its settings are the same objects.
  const remembered = (key: string, inputs: unknown[], check: () => Finding[]) =>
    memo ? memo.findings(key, [faults, ...inputs], check) : check();
  const { horizon, edition, sensitivity } = study.coordination;
  const { source } = study;
  if (source.kind === 'generator') {
    // The check reads the bands of the devices nearest the generator, whichever they are.
    const nearest = generatorDevicesOf(network);
    findings.push(
      ...remembered(`generator:${source.id}`, [source, horizon, ...nearest], () =>
        generatorFindings(context, source, horizon, nearest),
      ),
    );
  }
  for (const transformer of study.transformers) {
    const primary = protectingDevice(context, transformer.id);
    findings.push(
      ...remembered(`transformer:${transformer.id}`, [transformer, primary, horizon], () =>
        transformerFindings(context, transformer, horizon),
      ),
    );
  }
  for (const transformer of study.transformers) {
    const devices = [protectingDevice(context, transformer.id), network.deviceFeeding.get(transformer.to)];
    findings.push(
      ...remembered(`nec450:${transformer.id}`, [transformer, ...devices, edition], () =>
        nec450Findings(context, transformer, edition),
      ),
    );
  }
  for (const cable of study.cables) {
    const device = protectingDevice(context, cable.id);
    findings.push(
      ...remembered(`cable:${cable.id}`, [cable, device, horizon], () => cableFindings(context, cable, horizon)),
    );
    findings.push(...remembered(`ampacity:${cable.id}`, [cable, device], () => cableAmpacityFindings(context, cable)));
  }
  for (const motor of study.motors) {
    const device = protectingDevice(context, motor.id);
    findings.push(...remembered(`motor:${motor.id}`, [motor, device], () => motorFindings(context, motor)));
  }
  for (const device of study.devices)
    findings.push(...remembered(`load:${device.id}`, [device], () => loadFindings(network, device)));
  for (const device of study.devices) findings.push(...interruptingFindings(context, device, study.frequency));
  for (const bus of study.buses) findings.push(...busRatingFindings(context, bus, study.frequency));
  for (const device of study.devices)
    findings.push(
      ...remembered(`sensitivity:${device.id}`, [device, sensitivity], () =>
        sensitivityFindings(context, device, sensitivity),
      ),
    );
  for (const device of study.devices) {
    bands.get(device.id)!.diagnostics.forEach((message, index) =>
      findings.push({
        id: `setting:${device.id}:${index}`,
        kind: 'setting',
        severity: 'info',
        title: `${device.name ?? device.id}: setting note`,
        subjects: [device.id],
        explanation: message,
        referenceVolts: locationBusOf(network, device).voltage,
      }),
    );
    // A ground-fault element's notes are the limits of NFPA 70 230.95(A), which bind a service
    // disconnect: a warning for a main of 1000 A or more at 480 V class, none for other devices.
    // Only a ground-fault element with a note is placed in the tree: a study has thousands of devices.
    const groundNotes = cachedGroundBandOf(device.characteristic)?.diagnostics ?? [];
    if (groundNotes.length > 0 && isServiceMain(network, device))
      groundNotes.forEach((message, index) =>
        findings.push({
          id: `setting:${device.id}:ground:${index}`,
          kind: 'setting',
          severity: 'warning',
          title: `${device.name ?? device.id}: ground-fault setting beyond NFPA 70 230.95`,
          subjects: [device.id],
          explanation: `${capitalise(message)}. NFPA 70 230.95(A) holds the ground-fault protection of a service disconnect rated 1000 A or more, on a solidly grounded wye service of more than 150 V to ground and up to 1000 V, to a setting of 1200 A at most and a delay of 1 s at most at 3000 A or more; this device is checked as one (it is the first device of its voltage, rated 1000 A or more).`,
          suggestion:
            'Lower the ground-fault pickup to 1200 A or less, or its delay so that it clears within 1 s at 3000 A.',
          basis: 'NFPA 70 230.95(A)',
          referenceVolts: locationBusOf(network, device).voltage,
        }),
      );
  }

  memo?.forgetUnused();
  const counts: Record<Severity, number> = { ok: 0, info: 0, warning: 0, fail: 0 };
  for (const finding of findings) counts[finding.severity]++;
  return { study, network, faults, bands, pairs, findings, counts };
}

/**
 * Whether a device stands where NFPA 70 230.95(A) asks for ground-fault protection: rated 1000 A or more
 * (its NEC rating), on a bus of more than 150 V to ground and up to 1000 V, with no device above it at
 * its own voltage (the main of its service), in a tree fed by the utility, not a generator. Whether the
 * service is a solidly grounded wye is left to the engineer, whom the finding tells.
 */
function isServiceMain(network: Network, device: Device): boolean {
  // A standby generator's tree (a scenario on the generator) is no service.
  if (network.study.source.kind === 'generator') return false;
  const volts = locationBusOf(network, device).voltage;
  if (!(volts / Math.sqrt(3) > 150 && volts <= 1000)) return false;
  if (!((ratingOf(device)?.amps ?? 0) >= 1000)) return false;
  const above = upstreamDeviceOf(network, device);
  return !above || locationBusOf(network, above).voltage !== volts;
}
