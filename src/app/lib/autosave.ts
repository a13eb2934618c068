import { documentJsonOf } from './documentJson.ts';

/** The part of the Web Storage API autosave needs (so tests can pass a plain object). */
export interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

/** One thing wrong with a kept document, located by its field path (as `readStudy` reports it). */
export interface KeptProblem {
  path: string;
  message: string;
}

/**
 * What autosave keeps of one moment of work: the document exactly as the user left it (even when it
 * does not validate, say with a field cleared to retype it), its problems, and where it came from.
 */
export interface AutosaveRecord {
  /** The study document (file form), as written; it may have problems. */
  document: unknown;
  /** The file name it was opened from or saved to, if any. */
  fileName?: string;
  /** The view shown when it was kept. */
  viewId?: string;
  /** True when the document differed from the last file saved or opened. */
  unsaved: boolean;
  /** What was wrong with it when it was kept (empty when it was valid). */
  problems?: KeptProblem[];
  /** When it was kept, as an ISO time string (for the recovery offer). */
  savedAt: string;
}

/** A kept version as read back: the record, the study's name and its place in the order of writes. */
export interface KeptVersion extends AutosaveRecord {
  /** The study's name as written, or "Untitled study". */
  name: string;
  problems: KeptProblem[];
  /** Increases with every write; the largest is the newest. */
  sequence: number;
  /** The storage key it is kept under. */
  key: string;
}

/**
 * Says that the newest kept version is older than the work on the page: a later write was refused
 * (storage full or turned off), so nothing kept may pose as the current study.
 */
export interface StaleMark {
  /** When the first refused write happened (ISO time). */
  since: string;
  /** The name of the study whose write was refused. */
  name: string;
}

/** Everything kept: versions newest first, and the stale mark if a later write was refused. */
export interface KeptStudies {
  versions: KeptVersion[];
  stale?: StaleMark;
}

/** What became of one write. */
export type KeepOutcome =
  | {
      kept: true;
      /** Older versions removed to make room for this one. */
      dropped: number;
    }
  | {
      kept: false;
      /** Why, in words: "the browser's storage is full". */
      reason: string;
      /**
       * What was done about the older copies: `marked` (kept, marked out of date) or `removed`
       * (storage refused even the mark, so they were removed rather than left posing as current).
       */
      older: 'marked' | 'removed' | 'none';
    };

/** How many versions are kept (the slots are written in turn, the oldest replaced first). */
export const AUTOSAVE_SLOTS = 5;
/** The keys' stem; the suffix changes only if the record's shape does. */
export const AUTOSAVE_PREFIX = 'discern.autosave.v2';
/** Where the previous single-copy autosave kept its record (still read, so no kept work is missed). */
export const LEGACY_AUTOSAVE_KEY = 'discern.autosave.v1';
/** A kept document carries at most this many of its problems (the offer shows a count and the first few). */
const KEPT_PROBLEMS = 20;

const slotKey = (slot: number) => `${AUTOSAVE_PREFIX}.${slot}`;
const STALE_KEY = `${AUTOSAVE_PREFIX}.stale`;

/**
 * Reads every kept version (newest first) and the stale mark. A damaged or foreign record is left
 * out rather than trusted; a document is kept as written, so it is validated again when restored.
 *
 * @example const { versions, stale } = readKept(localStorage) // versions[0] is the newest
 */
export function readKept(storage: StorageLike | undefined): KeptStudies {
  if (!storage) return { versions: [] };
  const versions: KeptVersion[] = [];
  for (let slot = 0; slot < AUTOSAVE_SLOTS; slot++) {
    const version = versionOf(read(storage, slotKey(slot)), slotKey(slot));
    if (version) versions.push(version);
  }
  const legacy = versionOf(read(storage, LEGACY_AUTOSAVE_KEY), LEGACY_AUTOSAVE_KEY);
  if (legacy) versions.push({ ...legacy, sequence: -1 });
  versions.sort((a, b) => b.sequence - a.sequence);
  const stale = staleOf(read(storage, STALE_KEY));
  return stale ? { versions, stale } : { versions };
}

/**
 * Writes versions in turn over {@link AUTOSAVE_SLOTS} slots, never over the newest kept one, so a
 * write that fails half way or keeps a bad state cannot destroy the only copy. Remembers the slots
 * between writes (read once, at construction).
 *
 * @example const keeper = new StudyKeeper(localStorage); keeper.keep({ document, unsaved: true, savedAt })
 */
export class StudyKeeper {
  #storage: StorageLike | undefined;
  /** The sequence number kept in each slot (-1 when empty). */
  #sequences: number[];

  constructor(storage: StorageLike | undefined) {
    this.#storage = storage;
    this.#sequences = Array.from({ length: AUTOSAVE_SLOTS }, () => -1);
    for (const version of readKept(storage).versions) {
      const slot = slotOf(version.key);
      if (slot !== undefined) this.#sequences[slot] = version.sequence;
    }
  }

  /**
   * Keeps one version. When storage refuses, older versions are removed to make room (the newest
   * always stays) and the write is tried again; when it still refuses, the kept versions are marked
   * out of date (or, if even that is refused, removed) so none of them poses as the current study.
   */
  keep(record: AutosaveRecord): KeepOutcome {
    const storage = this.#storage;
    if (!storage) return { kept: false, reason: 'the browser offers no storage to this page', older: 'none' };
    const sequence = Math.max(...this.#sequences) + 1;
    const { document, ...rest } = record;
    // The document's text reuses what earlier keeps wrote of the list items an edit left alone.
    const others = JSON.stringify({ ...rest, problems: (record.problems ?? []).slice(0, KEPT_PROBLEMS), sequence });
    const documentText = documentJsonOf(document) as string | undefined;
    const text = documentText === undefined ? others : `{"document":${documentText},${others.slice(1)}`;
    const slot = this.#oldestSlot();
    let dropped = 0;
    for (;;) {
      try {
        storage.setItem(slotKey(slot), text);
        this.#sequences[slot] = sequence;
        forget(storage, STALE_KEY);
        return { kept: true, dropped };
      } catch (error) {
        const victim = this.#droppableSlot(slot);
        if (victim === undefined) return this.#refused(storage, record, error);
        forget(storage, slotKey(victim));
        this.#sequences[victim] = -1;
        dropped++;
      }
    }
  }

  /** Forgets every kept version and the stale mark (the user chose to discard them). */
  discardAll(): void {
    const storage = this.#storage;
    if (!storage) return;
    for (let slot = 0; slot < AUTOSAVE_SLOTS; slot++) forget(storage, slotKey(slot));
    forget(storage, STALE_KEY);
    forget(storage, LEGACY_AUTOSAVE_KEY);
    this.#sequences.fill(-1);
  }

  /** An empty slot, else the one with the oldest version. */
  #oldestSlot(): number {
    const empty = this.#sequences.indexOf(-1);
    if (empty >= 0) return empty;
    let oldest = 0;
    this.#sequences.forEach((sequence, slot) => {
      if (sequence < this.#sequences[oldest]) oldest = slot;
    });
    return oldest;
  }

  /** The oldest kept slot other than `writing` and the newest, whose removal may make room. */
  #droppableSlot(writing: number): number | undefined {
    const newest = Math.max(...this.#sequences);
    let victim: number | undefined;
    this.#sequences.forEach((sequence, slot) => {
      if (slot === writing || sequence < 0 || sequence === newest) return;
      if (victim === undefined || sequence < this.#sequences[victim]) victim = slot;
    });
    return victim;
  }

  #refused(storage: StorageLike, record: AutosaveRecord, error: unknown): KeepOutcome {
    const reason = refusalOf(error);
    const hasOlder = this.#sequences.some((sequence) => sequence >= 0) || read(storage, LEGACY_AUTOSAVE_KEY) !== null;
    if (!hasOlder) return { kept: false, reason, older: 'none' };
    const mark: StaleMark = { since: record.savedAt, name: nameOf(record.document) };
    // A mark already there keeps its first time: the kept copy is out of date since then.
    if (read(storage, STALE_KEY) !== null) return { kept: false, reason, older: 'marked' };
    try {
      storage.setItem(STALE_KEY, JSON.stringify(mark));
      return { kept: false, reason, older: 'marked' };
    } catch {
      this.discardAll();
      return { kept: false, reason, older: 'removed' };
    }
  }
}

/**
 * Why storage refused a write, in the user's words.
 * @example refusalOf(new DOMException('…', 'QuotaExceededError')) // "the browser's storage is full"
 */
export function refusalOf(error: unknown): string {
  const name = (error as { name?: unknown } | null)?.name;
  return name === 'QuotaExceededError' || name === 'NS_ERROR_DOM_QUOTA_REACHED'
    ? "the browser's storage is full"
    : 'the browser refused to store it (private browsing or storage turned off)';
}

/**
 * The study's name as written in a document, for lists and messages.
 * @example nameOf({ name: 'Harrowmere' }) // 'Harrowmere'
 */
export function nameOf(document: unknown): string {
  const name = (document as { name?: unknown } | null)?.name;
  return typeof name === 'string' && name.trim() !== '' ? name : 'Untitled study';
}

/**
 * Whether kept work must be offered back on start: true when the newest kept version holds work
 * that no file has (unsaved edits or problems) or a later write was refused; false when it is a
 * clean copy of a file, which can simply be reopened, or when nothing is kept.
 *
 * @example needsOffer(readKept(localStorage)) // true after a reload with unsaved edits
 */
export function needsOffer(kept: KeptStudies): boolean {
  const newest = kept.versions[0];
  if (!newest) return false;
  return kept.stale !== undefined || newest.unsaved || newest.problems.length > 0;
}

function read(storage: StorageLike, key: string): string | null {
  try {
    return storage.getItem(key);
  } catch {
    return null;
  }
}

function forget(storage: StorageLike, key: string): void {
  try {
    storage.removeItem(key);
  } catch {
    // storage refused: nothing to forget that could be read back either
  }
}

function slotOf(key: string): number | undefined {
  const match = key.startsWith(`${AUTOSAVE_PREFIX}.`) ? Number(key.slice(AUTOSAVE_PREFIX.length + 1)) : NaN;
  return Number.isInteger(match) ? match : undefined;
}

function versionOf(text: string | null, key: string): KeptVersion | undefined {
  if (!text) return undefined;
  let record: Partial<KeptVersion>;
  try {
    record = JSON.parse(text) as Partial<KeptVersion>;
  } catch {
    return undefined;
  }
  if (record === null || typeof record !== 'object') return undefined;
  const document = record.document;
  if (document === null || typeof document !== 'object' || Array.isArray(document)) return undefined;
  if (typeof record.savedAt !== 'string') return undefined;
  const problems = Array.isArray(record.problems)
    ? record.problems.filter((p): p is KeptProblem => typeof p?.path === 'string' && typeof p?.message === 'string')
    : [];
  return {
    document,
    name: nameOf(document),
    fileName: typeof record.fileName === 'string' ? record.fileName : undefined,
    viewId: typeof record.viewId === 'string' ? record.viewId : undefined,
    unsaved: record.unsaved === true,
    problems,
    savedAt: record.savedAt,
    sequence: typeof record.sequence === 'number' && Number.isFinite(record.sequence) ? record.sequence : 0,
    key,
  };
}

function staleOf(text: string | null): StaleMark | undefined {
  if (!text) return undefined;
  try {
    const mark = JSON.parse(text) as Partial<StaleMark> | null;
    if (typeof mark?.since !== 'string') return undefined;
    return { since: mark.since, name: typeof mark.name === 'string' ? mark.name : 'Untitled study' };
  } catch {
    return undefined;
  }
}
