import { afterEach, describe, it, expect, vi } from 'vitest';
import { readFileSync } from 'node:fs';
import { AnalysisState, type CheckRunner } from '../../../src/app/state/AnalysisState.svelte.ts';
import { StudyState } from '../../../src/app/state/StudyState.svelte.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';
import type { AnalyseRequest, WorkerRequest } from '../../../src/app/worker/protocol.ts';
import { workerRunner } from '../../../src/app/worker/runners.ts';
import { studyWithDelta } from '../../../src/app/worker/studyDelta.ts';
import { ChangeTracker } from '../../../src/app/worker/changes.ts';
import { checksOf } from '../../../src/app/worker/checks.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import { findingCountsOf } from '../../../src/app/lib/lookups.ts';
import type { Study } from '../../../src/engine/study/index.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-overlap.json', import.meta.url), 'utf8'),
) as StudyInput;

/** A runner that holds requests until the test answers them with the engine. */
function heldRunner() {
  const requests: AnalyseRequest[] = [];
  const runner: CheckRunner & { requests: AnalyseRequest[]; answer(i: number): void } = {
    requests,
    post: (request) => void requests.push(request),
    onreply: undefined,
    answer(i) {
      const { seq, study } = requests[i];
      const { findings, pairs, counts } = analyseStudy(study);
      runner.onreply?.({ seq, ok: true, findings, pairs, counts });
    },
  };
  return runner;
}

describe('AnalysisState', () => {
  it('has the expected defaults', () => {
    const study = new StudyState(demo);
    const analysis = new AnalysisState(study, heldRunner());
    expect(analysis.findings).toEqual([]);
    expect(analysis.pending).toBe(false);
    expect(analysis.base?.bands.size).toBe(demo.devices!.length);
    expect(analysis.selectedFinding).toBeUndefined();
  });

  it('shows the fault levels worked out when the study was opened, and keeps them through a setting edit', () => {
    const study = new StudyState(demo);
    const analysis = new AnalysisState(study, heldRunner());
    const built = study.builtFaults(study.network!);
    expect(built).toBeDefined();
    expect(analysis.base?.faults).toBe(built);
    const mainIndex = demo.devices!.findIndex((d) => d.id === 'MAIN');
    study.edit(['devices', mainIndex, 'characteristic', 'shortTime', 'delay'], 0.3, 'delay');
    expect(study.builtFaults(study.network!)).toBeUndefined();
    expect(analysis.base?.faults).toBe(built);
  });

  it('request() sends the study once at a time and merges the findings that come back', () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    expect(analysis.pending).toBe(true);
    // An edit while the first run is out waits; two edits leave only the newest waiting.
    study.edit(['name'], 'Edited once', 'name');
    analysis.request();
    study.edit(['name'], 'Edited twice', 'name');
    analysis.request();
    expect(runner.requests).toHaveLength(1);
    runner.answer(0);
    expect(runner.requests).toHaveLength(2);
    expect(runner.requests[1].study.name).toBe('Edited twice');
    expect(analysis.pending).toBe(true);
    runner.answer(1);
    expect(analysis.pending).toBe(false);
    const expected = analyseStudy(study.study!);
    expect(analysis.findings.map((f) => f.id)).toEqual(expected.findings.map((f) => f.id));
    expect(analysis.analysis?.counts).toEqual(expected.counts);
  });

  it("shows none of the last study's findings once another replaces it, even one with problems that cannot be checked", () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    runner.answer(0);
    expect(analysis.findings.length).toBeGreaterThan(0);
    // A kept copy whose pickup was being retyped: it has problems, so nothing is sent to the checks.
    const mainIndex = demo.devices!.findIndex((d) => d.id === 'MAIN');
    const kept = structuredClone(demo);
    (kept.devices![mainIndex].characteristic as Record<string, unknown>).longTime = 'abc';
    study.restore(kept, { unsaved: true, savedAt: '2026-12-01T22:00:00Z' });
    analysis.request();
    expect(study.study).toBeUndefined();
    expect(runner.requests).toHaveLength(1);
    expect(analysis.findings).toEqual([]);
    expect(analysis.findingCounts.size).toBe(0);
  });

  it('is not checking a restored copy with problems, even while the run of the study before it is still out', () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    expect(analysis.pending).toBe(true);
    const mainIndex = demo.devices!.findIndex((d) => d.id === 'MAIN');
    const kept = structuredClone(demo);
    (kept.devices![mainIndex].characteristic as Record<string, unknown>).longTime = 'abc';
    study.restore(kept, { unsaved: true, savedAt: '2026-12-01T22:00:00Z' });
    analysis.request();
    // The panel says the study is not checked, not that it is being checked.
    expect(analysis.pending).toBe(false);
    runner.answer(0);
    expect(analysis.pending).toBe(false);
    expect(analysis.findings).toEqual([]);
    // Mended: its run is out, and pending until it comes back.
    study.restore(demo, { unsaved: true, savedAt: '2026-12-01T22:05:00Z' });
    analysis.request();
    expect(analysis.pending).toBe(true);
    runner.answer(1);
    expect(analysis.pending).toBe(false);
  });

  it('shows nothing of a run for the study before while the newly opened one is checked', () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    const fused = JSON.parse(
      readFileSync(new URL('../../../demo/harrowmere-fused.json', import.meta.url), 'utf8'),
    ) as StudyInput;
    study.load(fused);
    analysis.request();
    runner.answer(0);
    expect(analysis.findings).toEqual([]);
    expect(analysis.pending).toBe(true);
    runner.answer(1);
    expect(analysis.findings.map((f) => f.id)).toEqual(analyseStudy(study.study!).findings.map((f) => f.id));
  });

  it("shows none of the last study's findings when the checks of the newly opened one fail", () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    runner.answer(0);
    study.load(JSON.parse(readFileSync(new URL('../../../demo/harrowmere-fused.json', import.meta.url), 'utf8')));
    analysis.request();
    runner.onreply?.({ seq: runner.requests[1].seq, ok: false, message: 'out of memory' });
    expect(analysis.error).toBe('The checks failed: out of memory');
    expect(analysis.findings).toEqual([]);
  });

  it('selectFinding() highlights the devices a finding names; findingCounts counts per device', () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    runner.answer(0);
    const fail = analysis.findings.find((f) => f.severity === 'fail')!;
    analysis.selectFinding(fail.id);
    expect([...analysis.highlighted]).toEqual(fail.subjects);
    const named = analysis.findings.filter((f) => f.subjects.includes(fail.subjects[0]));
    expect(analysis.findingCounts.get(fail.subjects[0])?.all).toBe(named.length);
  });

  it('a failed run is reported and ends the wait', () => {
    const study = new StudyState(demo);
    const runner = heldRunner();
    const analysis = new AnalysisState(study, runner);
    analysis.request();
    runner.onreply?.({ seq: -1, ok: false, message: 'worker script failed to load' });
    expect(analysis.pending).toBe(false);
    expect(analysis.error).toBe('The checks failed: worker script failed to load');
  });

  it('workFor() shows a transformer, a bus, or the bus a device sits on', () => {
    const study = new StudyState(demo);
    const analysis = new AnalysisState(study, heldRunner());
    expect(analysis.workFor({ kind: 'transformer', id: 'T1' })?.title).toMatch(/^Transformer T1/);
    expect(analysis.workFor({ kind: 'bus', id: 'SWBD' })?.work.length).toBeGreaterThan(0);
    expect(analysis.workFor({ kind: 'device', id: 'MAIN' })?.title).toBe('Bus SWBD: available fault current');
    expect(analysis.workFor(undefined)).toBeUndefined();
  });

  describe("when the checks' worker fails", () => {
    /** A stand-in for the checks' worker: it answers as analysis.worker.ts does, when told, or fails. */
    class ChecksWorker {
      static started: ChecksWorker[] = [];
      held: WorkerRequest[] = [];
      onmessage: ((event: { data: unknown }) => void) | null = null;
      onerror: ((event: { message?: string }) => void) | null = null;
      #study: Study | undefined;
      #memo = new AnalysisMemo();
      #tracker = new ChangeTracker();
      constructor() {
        ChecksWorker.started.push(this);
      }
      postMessage(message: WorkerRequest) {
        this.held.push(message);
      }
      terminate() {}
      answer() {
        const message = this.held.shift()!;
        const study = 'delta' in message ? studyWithDelta(this.#study!, message.delta) : message.study;
        this.#study = study;
        this.onmessage!({
          data: { seq: message.seq, ok: true, changes: this.#tracker.changesOf(checksOf(study, this.#memo)) },
        });
      }
      fail() {
        this.onerror!({});
      }
    }
    afterEach(() => {
      vi.unstubAllGlobals();
      ChecksWorker.started = [];
    });
    const selective = JSON.parse(
      readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
    ) as StudyInput;

    it('analyses the edit that waited on the next worker, and counts findings from its reply alone', () => {
      vi.stubGlobal('Worker', ChecksWorker);
      // The MCC feeder's short-time delay at 0.1 s, where the selective demo has 0.2 s: more findings fail.
      const index = selective.devices!.findIndex((d) => d.id === 'FDR-MCC');
      const study = new StudyState({
        ...selective,
        devices: selective.devices!.map((d, i) =>
          i === index ? { ...d, characteristic: { ...d.characteristic, shortTime: { pickup: 6, delay: 0.1 } } } : d,
        ),
      } as StudyInput);
      const analysis = new AnalysisState(study, workerRunner());
      analysis.request();
      ChecksWorker.started[0].answer();
      const countsBefore = analysis.findingCounts;
      // Back to 0.2 s: findings the first reply had go away. The worker fails on it, with another edit waiting.
      study.edit(['devices', index, 'characteristic', 'shortTime', 'delay'], 0.2, 'delay');
      analysis.request();
      study.edit(['devices', index, 'name'], 'MCC feeder', 'name');
      analysis.request();
      ChecksWorker.started[0].fail();
      expect(analysis.error).toMatch(/^The checks failed: the checks worker could not start/);
      // The edit that waited goes to a new worker, and the page waits for it.
      expect(ChecksWorker.started).toHaveLength(2);
      expect(analysis.pending).toBe(true);
      ChecksWorker.started[1].answer();
      expect(analysis.pending).toBe(false);
      expect(analysis.error).toBeUndefined();
      const expected = analyseStudy(study.study!).findings;
      expect(analysis.findings.map((f) => f.id)).toEqual(expected.map((f) => f.id));
      expect(analysis.findingCounts).toEqual(findingCountsOf(analysis.findings));
      expect(analysis.findingCounts).not.toEqual(countsBefore);
    });
  });
});
