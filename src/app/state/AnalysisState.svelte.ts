import { untrack } from 'svelte';
import type { Band } from '../../engine/band.ts';
import type { FaultLevels } from '../../engine/fault/index.ts';
import { AnalysisMemo } from '../../engine/incremental.ts';
import { locationBusOf, type Network } from '../../engine/network/index.ts';
import type { Analysis } from '../../engine/analysis.ts';
import type { Finding } from '../../engine/checks/finding.ts';
import type { Work } from '../../engine/work.ts';
import type { AnalyseReply, AnalyseRequest } from '../worker/protocol.ts';
import type { StudyState } from './StudyState.svelte.ts';
import { bandsByDevice, findingCountsOf, findingCountsWith, idSetOf, type FindingCount } from '../lib/lookups.ts';
import { sameNetworkInputs } from '../../engine/network/sameNetworkInputs.ts';
import type { Study } from '../../engine/study/index.ts';
import { resultsWith, type CheckResults } from '../worker/changes.ts';
import { analysisOfPart, findingsIn, placeOfView, scenarioViewOf, type ScenarioView } from '../lib/scenarioParts.ts';

/** The counts before any finding has arrived. */
const NO_COUNTS: ReadonlyMap<string, FindingCount> = findingCountsOf([]);

/** Where the checks run: a Web Worker in the browser, or in-line where there is none. */
export interface CheckRunner {
  post(request: AnalyseRequest): void;
  onreply: ((reply: AnalyseReply) => void) | undefined;
}

/**
 * The analysis behind the workbench, in two halves. The fast half — fault levels and every device's
 * band — is derived on the main thread from the parsed study, so the sheet redraws on the same
 * frame as an edit. The heavy half — every pair, transformer, code, cable and motor check — runs in
 * a worker; its findings arrive a moment later (`pending` until then) and are merged in.
 *
 * @example const analysis = new AnalysisState(study, workerRunner()); $effect(() => analysis.request());
 */
export class AnalysisState {
  #study: StudyState;
  #runner: CheckRunner;
  #sent = $state(0);
  #received = $state(0);
  // The run the runner has (its seq), if any.
  #inFlight: number | undefined;
  // The next reply starts the results afresh (after a worker failed and another was started).
  #fresh = false;
  #waiting: AnalyseRequest | undefined;
  // The study shown (`StudyState.opened`) and the first run asked for it: replies to runs before it
  // describe the study shown before (a restored copy with problems asks for no run at all).
  #opened = 0;
  #firstRunOfStudy = $state(1);
  #results: CheckResults | undefined = $state.raw();
  // The run whose reply `#results` holds (a failed run leaves the results of the one before).
  #resultsRun = $state(0);
  // Per device, the findings of `#results` naming it, kept up to date from each reply's changes.
  #counts: ReadonlyMap<string, FindingCount> = $state.raw(NO_COUNTS);
  // Fault levels are kept while an edit leaves the network as it was (a setting, a name).
  #memo = new AnalysisMemo();
  // The study the fault levels were last worked out for: kept, without even asking the memo, while
  // an edit leaves the network's parsed inputs as they were (a device setting).
  #faultsFor: { study: Study; faults: FaultLevels } | undefined;

  /** The finding the user opened (highlighted on the sheet). */
  selectedFindingId: string | undefined = $state();
  /** The last failure of the checks, if the latest run failed. */
  error: string | undefined = $state();

  // The fast half, or why it could not be worked out (a study the engine cannot analyse).
  readonly #fast = $derived.by(
    (): { value?: { network: Network; faults: FaultLevels; bands: Map<string, Band> }; error?: string } | undefined => {
      const network = this.#study.network;
      if (!network) return undefined;
      try {
        // Bands are built when first drawn or probed: a sheet shows a few devices of a large study.
        const kept = this.#faultsFor;
        const faults =
          kept && sameNetworkInputs(kept.study, network.study)
            ? kept.faults
            : (this.#study.builtFaults(network) ?? this.#memo.faultsOf(network));
        this.#faultsFor = { study: network.study, faults };
        return { value: { network, faults, bands: bandsByDevice(network.devices) } };
      } catch (error) {
        return { error: (error as Error).message };
      }
    },
  );
  /** Network, fault levels and bands of the current study (main thread). */
  readonly base = $derived.by(() => this.#fast?.value);
  /** Why the fault levels or bands of the current study could not be worked out, if they could not. */
  readonly baseError = $derived.by(() => this.#fast?.error);
  // The checks' results as last received, while they are of the study shown.
  readonly #shownResults = $derived.by(() => (this.#resultsRun >= this.#firstRunOfStudy ? this.#results : undefined));
  /** The whole analysis: the fast half now, the checks' findings as last received. */
  readonly analysis: Analysis | undefined = $derived.by(() => {
    const base = this.base;
    if (!base) return undefined;
    const results = this.#shownResults;
    return {
      study: base.network.study,
      ...base,
      pairs: results?.pairs ?? [],
      findings: results?.findings ?? [],
      counts: results?.counts ?? { ok: 0, info: 0, warning: 0, fail: 0 },
    };
  });
  /** Findings as last received (they may trail the latest edit while `pending`), in every scenario. */
  readonly findings: Finding[] = $derived.by(() => this.#shownResults?.findings ?? []);
  // The chosen scenario's trees, built on the main thread like the fast half, or why they could not be.
  readonly #scenario = $derived.by((): { value?: ScenarioView; error?: string } | undefined => {
    const study = this.#study.study;
    const scenario = this.#study.scenario;
    if (!study || !scenario) return undefined;
    try {
      return { value: scenarioViewOf(study, scenario) };
    } catch (error) {
      return { error: (error as Error).message };
    }
  });
  /** The chosen scenario's energised trees and dark buses; `undefined` for a study that cannot be switched. */
  readonly scenario: ScenarioView | undefined = $derived.by(() => this.#scenario?.value);
  /** Why the chosen scenario's trees could not be worked out, if they could not. */
  readonly scenarioError: string | undefined = $derived.by(() => this.#scenario?.error);
  /** The findings holding in the chosen scenario (every finding of a study that cannot be switched). */
  readonly scenarioFindings: Finding[] = $derived.by(() => {
    const scenario = this.scenario;
    return scenario ? findingsIn(this.findings, scenario.label) : this.findings;
  });
  /**
   * True while the checks of the latest edit are still running. A study with problems is not
   * checked, so nothing is pending for it even while a run of the study before it finishes.
   */
  readonly pending = $derived.by(() => this.#study.study !== undefined && this.#received < this.#sent);
  /** The finding the user opened. */
  readonly selectedFinding = $derived.by(() => {
    const id = this.selectedFindingId;
    return id === undefined ? undefined : this.findings.find((f) => f.id === id);
  });
  /** Device ids the opened finding names (highlighted on the sheet and in the tree). */
  readonly highlighted = $derived.by(() => idSetOf(this.selectedFinding?.subjects ?? []));
  /** Per device: how many findings naming it fail or warn (in the chosen scenario). */
  readonly findingCounts = $derived.by(() =>
    this.scenario ? findingCountsOf(this.scenarioFindings) : this.#shownResults ? this.#counts : NO_COUNTS,
  );

  constructor(study: StudyState, runner: CheckRunner) {
    this.#study = study;
    this.#runner = runner;
    runner.onreply = (reply) => this.#receive(reply);
  }

  /**
   * Sends the current study to the checks. Only one run is in flight; edits made meanwhile wait,
   * and only the newest of them runs next. Call it from an `$effect` so it follows every edit.
   */
  request(): void {
    const study = this.#study.study;
    const opened = this.#study.opened;
    // Only the study and its opening are dependencies; the counters are written without being tracked.
    untrack(() => {
      if (opened !== this.#opened) {
        this.#opened = opened;
        this.#firstRunOfStudy = this.#sent + 1;
      }
    });
    if (!study) return;
    untrack(() => {
      const request = { seq: ++this.#sent, study };
      if (this.#inFlight !== undefined) this.#waiting = request;
      else this.#post(request);
    });
  }

  /** Opens a finding (or closes it with `undefined`) and puts it on the sheet. */
  selectFinding(id: string | undefined): void {
    this.selectedFindingId = id;
  }

  /**
   * What a view draws from: for a study that cannot be switched, the whole analysis; else the tree of
   * the chosen scenario holding most of the view's devices, with the findings holding in the
   * scenario, and the view's devices that tree leaves out (`left`). No `analysis` when every device
   * of the view is de-energised, or while the study cannot be analysed (`error` says why).
   */
  viewAnalysis(viewId: string): { analysis?: Analysis; left: string[]; error?: string } {
    const error = this.baseError ?? this.scenarioError;
    if (error) return { left: [], error };
    const scenario = this.scenario;
    if (!scenario) return { analysis: this.analysis, left: [] };
    const view = this.#study.study?.views.find((v) => v.id === viewId);
    if (!view) return { left: [] };
    const { part, left } = placeOfView(scenario, viewId, view.devices);
    return {
      analysis: part && analysisOfPart(part, this.#shownResults?.pairs ?? [], this.scenarioFindings),
      left,
    };
  }

  /**
   * The worked calculation for a selected bus or transformer (or the bus a selected device or source
   * sits on), with a heading, in the chosen scenario; `undefined` when there is nothing to show.
   */
  workFor(selection: { kind: string; id: string } | undefined): { title: string; work: Work } | undefined {
    if (!selection) return undefined;
    const trees = this.scenario?.parts ?? (this.base ? [this.base] : []);
    for (const { network, faults } of trees) {
      if (selection.kind === 'transformer') {
        const fault = faults.transformers.get(selection.id);
        if (fault)
          return { title: `Transformer ${selection.id}: full-load and through-fault currents`, work: fault.work };
        continue;
      }
      let busId = selection.kind === 'bus' ? selection.id : undefined;
      if (selection.kind === 'device') {
        const device = network.devices.get(selection.id);
        if (device) busId = locationBusOf(network, device).id;
      }
      const source = network.study.source;
      if ((selection.kind === 'source' || selection.kind === 'generator') && source.id === selection.id)
        busId = source.bus;
      const fault = busId ? faults.buses.get(busId) : undefined;
      if (fault) return { title: `Bus ${busId}: available fault current`, work: fault.work };
    }
    return undefined;
  }

  #post(request: AnalyseRequest): void {
    this.#inFlight = request.seq;
    this.#runner.post(request);
  }

  #receive(reply: AnalyseReply): void {
    // A worker that failed answers with seq -1, for the run it had; the next run goes to a new worker,
    // whose first reply holds every finding, not the changes since a reply of the one before.
    const failed = reply.seq < 0;
    const seq = failed ? this.#inFlight : reply.seq;
    if (failed) this.#fresh = true;
    this.#inFlight = undefined;
    const next = this.#waiting;
    this.#waiting = undefined;
    if (next) this.#post(next);
    if (seq === undefined || seq <= this.#received) return;
    this.#received = seq;
    if (!reply.ok) {
      this.error = `The checks failed: ${reply.message}`;
      return;
    }
    this.error = undefined;
    const previous = this.#fresh ? undefined : this.#results;
    this.#fresh = false;
    const results =
      'changes' in reply
        ? resultsWith(previous, reply.changes)
        : resultsWith(undefined, {
            findings: reply.findings.map((finding, i) => ({ key: `${i}`, finding })),
            removed: [],
            order: reply.findings.map((_, i) => `${i}`),
            pairs: reply.pairs,
            removedPairs: [],
            pairOrder: reply.pairs.map((pair) => `${pair.upstream}/${pair.downstream}`),
            counts: reply.counts,
          });
    this.#counts =
      previous && 'changes' in reply
        ? findingCountsWith(
            this.#counts,
            [...reply.changes.removed, ...reply.changes.findings.map(({ key }) => key)]
              .map((key) => previous.byKey.get(key))
              .filter((finding) => finding !== undefined),
            reply.changes.findings.map(({ finding }) => finding),
          )
        : findingCountsOf(results.findings);
    this.#results = results;
    this.#resultsRun = seq;
  }
}
