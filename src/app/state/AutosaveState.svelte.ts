import { untrack } from 'svelte';
import type { StudyInput } from '../../engine/study/index.ts';
import {
  needsOffer,
  StudyKeeper,
  type AutosaveRecord,
  type KeepOutcome,
  type KeptStudies,
  type KeptVersion,
  type StorageLike,
} from '../lib/autosave.ts';
import type { Scheduler } from '../lib/idle.ts';
import type { StudyState } from './StudyState.svelte.ts';

/** How the last write went. */
export type AutosaveStatus =
  | { kind: 'idle' }
  | { kind: 'kept'; at: string }
  | { kind: 'refused'; at: string; reason: string; older: 'marked' | 'removed' | 'none' };

/**
 * Autosave: after every committed edit, at the next idle moment, the document as written (valid or
 * not) and its problems are kept in the browser's storage, in turn over a few slots. On start, kept
 * work that no file holds is offered back (`offer`) and nothing is written until the user restores
 * or discards it, so neither the demo nor another study can push it out unasked. A refused write is
 * reported at once in `status`.
 *
 * @example const autosave = new AutosaveState(study, localStorage, idleScheduler(window)); autosave.start(readKept(localStorage)); $effect(() => autosave.request());
 */
export class AutosaveState {
  /** How the last write went. */
  status: AutosaveStatus = $state.raw({ kind: 'idle' });
  /** Kept work offered back on start, until the user restores or discards it. */
  offer: KeptStudies | undefined = $state.raw();
  #study: StudyState;
  #keeper: StudyKeeper;
  #schedule: Scheduler;
  #cancel: (() => void) | undefined;
  #write: (() => void) | undefined;
  #clock: () => string;

  /** `clock` gives the time of each write as an ISO string (a parameter so tests can fix it). */
  constructor(
    study: StudyState,
    storage: StorageLike | undefined,
    schedule: Scheduler,
    clock: () => string = () => new Date().toISOString(), // eslint-disable-line svelte/prefer-svelte-reactivity -- a time stamp, not state
  ) {
    this.#clock = clock;
    this.#study = study;
    this.#keeper = new StudyKeeper(storage);
    this.#schedule = schedule;
  }

  /**
   * Decides what the workbench opens on: kept work no file holds is offered back; a clean kept copy
   * of a file is simply reopened; with nothing kept, the study already loaded (the demo) stays.
   */
  start(kept: KeptStudies): void {
    const newest = kept.versions[0];
    if (!newest) return;
    if (!needsOffer(kept)) {
      const document = newest.document as StudyInput;
      if (this.#study.load(document, newest.fileName, { viewId: newest.viewId })) return;
      this.#study.refused = undefined;
    }
    this.offer = kept;
  }

  /** Brings back one kept version (as kept, problems and all) and ends the offer. Returns true when shown. */
  restore(version: KeptVersion): boolean {
    const shown = this.#study.restore(version.document as StudyInput, version);
    if (shown) this.offer = undefined;
    return shown;
  }

  /** Forgets every kept version (the user said so) and ends the offer; the study on screen stays. */
  discard(): void {
    this.#keeper.discardAll();
    this.offer = undefined;
  }

  /**
   * Schedules keeping the document as it stands at the next idle moment (a write not yet done
   * takes this newer document instead). Call it from an `$effect` so it follows every edit; it does nothing while an offer waits.
   */
  request(): void {
    if (this.offer) return;
    const study = this.#study;
    const record = {
      document: study.document,
      fileName: study.fileName,
      viewId: study.view?.id,
      unsaved: study.dirty,
      problems: study.problems,
    };
    untrack(() => {
      // A write already waiting takes the newer record: edits in a stream (a drag) are still kept
      // every idle moment, not put off until the stream stops.
      this.#write = () => this.#keep(record);
      this.#cancel ??= this.#schedule(() => this.flush());
    });
  }

  /** Does the scheduled write now (the page is being hidden or unloaded). */
  flush(): void {
    const write = this.#write;
    this.#write = undefined;
    this.#cancel?.();
    this.#cancel = undefined;
    write?.();
  }

  #keep(record: Omit<AutosaveRecord, 'savedAt'>): void {
    const at = this.#clock();
    const outcome: KeepOutcome = this.#keeper.keep({ ...record, savedAt: at });
    if (outcome.kept) this.status = { kind: 'kept', at };
    else if (this.status.kind !== 'refused') {
      this.status = { kind: 'refused', at, reason: outcome.reason, older: outcome.older };
    } else if (outcome.older === 'removed' && this.status.older !== 'removed') {
      this.status = { ...this.status, older: 'removed' };
    }
  }
}
