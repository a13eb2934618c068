/** The part of the Web Storage API autosave needs (so tests can pass a plain object). */
export interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

/** What autosave keeps: the document as the user wrote it, and whether it had unsaved changes. */
export interface AutosaveRecord {
  /** The study document (file form). */
  document: unknown;
  /** The file name it was opened from or saved to, if any. */
  fileName?: string;
  /** The view shown when it was kept. */
  viewId?: string;
  /** True when the document differed from the last file saved or opened. */
  unsaved: boolean;
  /** When it was kept, as an ISO time string (for the recovery notice). */
  savedAt: string;
}

/** The storage key; the suffix changes only if the record's shape does. */
export const AUTOSAVE_KEY = 'discern.autosave.v1';

/**
 * Keeps the record; returns false (instead of throwing) when storage is full or refused, so an
 * edit never fails because autosave did.
 *
 * @example writeAutosave(localStorage, { document, unsaved: true, savedAt: new Date().toISOString() })
 */
export function writeAutosave(storage: StorageLike, record: AutosaveRecord): boolean {
  try {
    storage.setItem(AUTOSAVE_KEY, JSON.stringify(record));
    return true;
  } catch {
    return false;
  }
}

/**
 * Reads the kept record, or `undefined` when there is none or it is not one of ours (a damaged
 * record is ignored rather than trusted; the study is validated again when it is loaded).
 *
 * @example const record = readAutosave(localStorage)
 */
export function readAutosave(storage: StorageLike): AutosaveRecord | undefined {
  let text: string | null;
  try {
    text = storage.getItem(AUTOSAVE_KEY);
  } catch {
    return undefined;
  }
  if (!text) return undefined;
  try {
    const record = JSON.parse(text) as Partial<AutosaveRecord>;
    if (record === null || typeof record !== 'object' || typeof record.document !== 'object') return undefined;
    if (typeof record.savedAt !== 'string') return undefined;
    return {
      document: record.document,
      fileName: typeof record.fileName === 'string' ? record.fileName : undefined,
      viewId: typeof record.viewId === 'string' ? record.viewId : undefined,
      unsaved: record.unsaved === true,
      savedAt: record.savedAt,
    };
  } catch {
    return undefined;
  }
}

/** Forgets the kept record. @example clearAutosave(localStorage) */
export function clearAutosave(storage: StorageLike): void {
  try {
    storage.removeItem(AUTOSAVE_KEY);
  } catch {
    // storage refused: nothing kept, nothing to forget
  }
}
