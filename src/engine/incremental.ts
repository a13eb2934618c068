import { cachedGroundBandOf } from './bandCache.ts';
import type { CheckContext } from './checks/context.ts';
import { checkPair, type PairCheck } from './checks/coordination.ts';
import type { Finding } from './checks/finding.ts';
import { faultLevelsOf, type FaultLevels } from './fault/index.ts';
import { sameNetworkInputs, type Network } from './network/index.ts';
import type { CoordinationSettings, Device, Study } from './study/index.ts';

type PairResult = { check: PairCheck; findings: Finding[] };

/**
 * What one analysis of a study keeps for the next analysis of the same study after an edit, so that
 * an edit costs what it changed: fault levels are worked out again only when the network changed
 * (source, buses, transformers, cables, motors, or where a device sits), and a pair is checked again
 * only when something it depends on changed (either device's bands, names or margin, the fault levels,
 * the coordination settings); likewise each device's sensitivity and each transformer's, cable's and
 * motor's findings (`findings`). Unchanged checks give back the very same result objects. The results
 * are exactly those of a fresh analysis; pass one memo to `analyseStudy` edit after edit.
 *
 * A finding given back keeps the analysis that made it (its network and bands, about 0.9 MB at 2,000
 * devices) until its sentences and range are read, since they are written from it (`sharedSentences.ts`).
 * The workbench's worker reads every finding it sends, so it keeps none: its heap stays flat edit after
 * edit (measured: 40 setting edits of a 2,000-device study, 65.1 to 65.3 MB). A caller that never reads
 * the findings keeps one such analysis per edit that made a finding still given back.
 *
 * @example const memo = new AnalysisMemo(); analyseStudy(study, memo); analyseStudy(edited, memo)
 */
export class AnalysisMemo {
  #networkKey: string | undefined;
  #networkStudy: Study | undefined;
  #faults: FaultLevels | undefined;
  #settings: CoordinationSettings | undefined;
  #settingsKey = '';
  #pairs = new Map<string, { inputs: unknown[]; result: PairResult; used: number }>();
  #items = new Map<string, { inputs: readonly unknown[]; findings: Finding[]; used: number }>();
  #generation = 0;
  /** How many pair checks the last analysis ran, and how many it took from the memo. */
  readonly lastRun = { pairsChecked: 0, pairsReused: 0, faultsReused: false, itemsChecked: 0, itemsReused: 0 };

  /** The network's fault levels, the previous ones while the network is unchanged. */
  faultsOf(network: Network): FaultLevels {
    const { study } = network;
    // A new analysis begins here: pairs and items not met by its end are forgotten.
    this.#generation++;
    this.lastRun.pairsChecked = 0;
    this.lastRun.pairsReused = 0;
    this.lastRun.itemsChecked = 0;
    this.lastRun.itemsReused = 0;
    // An edit that kept every network list (by identity) and every device's place keeps the network.
    const previous = this.#networkStudy;
    this.#networkStudy = study;
    if (previous && this.#faults && sameNetworkInputs(previous, study)) {
      this.lastRun.faultsReused = true;
      return this.#faults;
    }
    // Everything the fault levels are worked out from (`sameNetworkInputs`' fields), by value.
    const key = JSON.stringify([
      study.frequency,
      study.source,
      study.buses,
      study.transformers,
      study.cables,
      study.motors,
      study.generators,
      study.switches,
      study.scenarios,
      study.conductorTemperatures,
      study.devices.map((device) => device.feeds),
    ]);
    this.lastRun.faultsReused = key === this.#networkKey && this.#faults !== undefined;
    if (!this.lastRun.faultsReused) {
      this.#faults = faultLevelsOf(network);
      this.#networkKey = key;
    }
    return this.#faults!;
  }

  /** `checkPair(context, pair, settings)`, or its previous result where none of its inputs changed. */
  pair(
    context: CheckContext,
    pair: { upstream: Device; downstream: Device },
    settings: CoordinationSettings,
  ): PairResult {
    if (settings !== this.#settings) {
      this.#settings = settings;
      this.#settingsKey = JSON.stringify(settings);
    }
    const { upstream, downstream } = pair;
    const inputs = [
      context.faults,
      context.bands.get(upstream.id),
      context.bands.get(downstream.id),
      cachedGroundBandOf(upstream.characteristic),
      cachedGroundBandOf(downstream.characteristic),
      this.#settingsKey,
      upstream.name,
      downstream.name,
      JSON.stringify(upstream.margin),
      upstream.characteristic.kind,
      downstream.characteristic.kind,
    ];
    const key = `${upstream.id}\u0000${downstream.id}`;
    const known = this.#pairs.get(key);
    if (known && known.inputs.every((value, i) => value === inputs[i])) {
      known.used = this.#generation;
      this.lastRun.pairsReused++;
      return known.result;
    }
    const result = checkPair(context, pair, settings);
    this.#pairs.set(key, { inputs, result, used: this.#generation });
    this.lastRun.pairsChecked++;
    return result;
  }

  /**
   * `check()`'s findings for one item (a device's sensitivity, a transformer, a cable, a motor), or
   * the previous ones where none of `inputs` changed, compared by identity: the fault levels (kept
   * only while the network is), the item, the devices whose bands and names the check reads, its
   * settings. The caller names every input the check reads.
   */
  findings(key: string, inputs: readonly unknown[], check: () => Finding[]): Finding[] {
    const known = this.#items.get(key);
    if (known && known.inputs.length === inputs.length && known.inputs.every((value, i) => value === inputs[i])) {
      known.used = this.#generation;
      this.lastRun.itemsReused++;
      return known.findings;
    }
    const findings = check();
    this.#items.set(key, { inputs, findings, used: this.#generation });
    this.lastRun.itemsChecked++;
    return findings;
  }

  /** Forgets the pairs and items the last analysis did not meet (removed devices, changed trees). */
  forgetUnused(): void {
    for (const [key, entry] of this.#pairs) if (entry.used !== this.#generation) this.#pairs.delete(key);
    for (const [key, entry] of this.#items) if (entry.used !== this.#generation) this.#items.delete(key);
  }
}
