import { describe, it, expect } from 'vitest';
import {
  AUTOSAVE_PREFIX,
  AUTOSAVE_SLOTS,
  LEGACY_AUTOSAVE_KEY,
  nameOf,
  needsOffer,
  readKept,
  refusalOf,
  StudyKeeper,
  type AutosaveRecord,
  type StorageLike,
} from '../../../src/app/lib/autosave.ts';

/** Storage in memory; `limit` refuses any value longer than it, as a nearly full quota does. */
function memoryStorage(limit = Infinity): StorageLike & { items: Map<string, string>; limit: number } {
  const items = new Map<string, string>();
  const storage = {
    items,
    limit,
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => {
      if (value.length > storage.limit) throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
      items.set(key, value);
    },
    removeItem: (key: string) => void items.delete(key),
  };
  return storage;
}

/** A record of a document named `name` whose `note` field pads it to about `size` characters. */
function record(name: string, options: Partial<AutosaveRecord> & { size?: number } = {}): AutosaveRecord {
  const { size = 0, ...rest } = options;
  return { document: { name, note: 'x'.repeat(size) }, unsaved: true, savedAt: '2026-12-01T22:00:00Z', ...rest };
}

describe('autosave', () => {
  it('has the expected defaults: five slots, nothing kept, nothing offered', () => {
    expect(AUTOSAVE_SLOTS).toBe(5);
    expect(AUTOSAVE_PREFIX).toBe('discern.autosave.v2');
    expect(readKept(memoryStorage())).toEqual({ versions: [] });
    expect(readKept(undefined)).toEqual({ versions: [] });
    expect(needsOffer(readKept(memoryStorage()))).toBe(false);
  });

  it('keep() stores the document as written with its problems, and readKept() gives it back', () => {
    const storage = memoryStorage();
    const problems = [{ path: 'study.devices[0].rating', message: 'expected a current such as "25 kA", got ""' }];
    const document = { name: 'Harrowmere', devices: [{ id: 'MAIN', rating: '' }] };
    const outcome = new StudyKeeper(storage).keep({
      document,
      fileName: 'h.json',
      viewId: 'V1',
      unsaved: true,
      problems,
      savedAt: '2026-12-01T22:00:00Z',
    });
    expect(outcome).toEqual({ kept: true, dropped: 0 });
    const [version] = readKept(storage).versions;
    expect(version).toMatchObject({ document, name: 'Harrowmere', fileName: 'h.json', viewId: 'V1', problems });
    expect(version.unsaved).toBe(true);
  });

  it('keep() writes the slots in turn, never over the newest, and readKept() lists them newest first', () => {
    const storage = memoryStorage();
    const keeper = new StudyKeeper(storage);
    for (let i = 1; i <= 7; i++) keeper.keep(record(`edit ${i}`));
    const names = readKept(storage).versions.map((v) => v.name);
    expect(names).toEqual(['edit 7', 'edit 6', 'edit 5', 'edit 4', 'edit 3']);
    // A keeper made later (the next page load) carries on from the newest.
    new StudyKeeper(storage).keep(record('edit 8'));
    expect(readKept(storage).versions.map((v) => v.name)).toEqual(['edit 8', 'edit 7', 'edit 6', 'edit 5', 'edit 4']);
  });

  it('a study too large for the room left drops the oldest versions first, keeping the newest', () => {
    const storage = memoryStorage();
    const keeper = new StudyKeeper(storage);
    for (let i = 1; i <= 3; i++) keeper.keep(record(`edit ${i}`, { size: 100 }));
    // Room for the new write only once two older copies are gone: the storage counts what it holds.
    const total = () => [...storage.items.values()].reduce((sum, v) => sum + v.length, 0);
    const setItem = storage.setItem;
    storage.setItem = (key, value) => {
      if (total() + value.length > 600) throw new DOMException('full', 'QuotaExceededError');
      setItem(key, value);
    };
    const outcome = keeper.keep(record('edit 4', { size: 200 }));
    expect(outcome).toEqual({ kept: true, dropped: 2 });
    expect(readKept(storage).versions.map((v) => v.name)).toEqual(['edit 4', 'edit 3']);
  });

  it('a refused write marks the kept copies out of date, so none poses as the current study', () => {
    const storage = memoryStorage();
    const keeper = new StudyKeeper(storage);
    keeper.keep(record('small'));
    storage.limit = 500;
    const outcome = keeper.keep(record('grown', { size: 1000, savedAt: '2026-12-01T22:05:00Z' }));
    expect(outcome).toEqual({ kept: false, reason: "the browser's storage is full", older: 'marked' });
    const kept = readKept(storage);
    expect(kept.versions.map((v) => v.name)).toEqual(['small']);
    expect(kept.stale).toEqual({ since: '2026-12-01T22:05:00Z', name: 'grown' });
    expect(needsOffer(kept)).toBe(true);
    // A later refusal keeps the first time; a later success lifts the mark.
    keeper.keep(record('grown', { size: 1000, savedAt: '2026-12-01T22:06:00Z' }));
    expect(readKept(storage).stale?.since).toBe('2026-12-01T22:05:00Z');
    storage.limit = Infinity;
    expect(keeper.keep(record('grown', { size: 1000 }))).toEqual({ kept: true, dropped: 0 });
    expect(readKept(storage).stale).toBeUndefined();
  });

  it('storage that refuses even the mark: the older copies are removed rather than left posing as current', () => {
    const storage = memoryStorage();
    const keeper = new StudyKeeper(storage);
    keeper.keep(record('first'));
    storage.limit = 0;
    expect(keeper.keep(record('second'))).toEqual({
      kept: false,
      reason: "the browser's storage is full",
      older: 'removed',
    });
    expect(readKept(storage)).toEqual({ versions: [] });
  });

  it('storage refused from the start (private browsing) says so, with no older copy to mark', () => {
    const refusing: StorageLike = {
      getItem: () => null,
      setItem: () => {
        throw new DOMException('denied', 'SecurityError');
      },
      removeItem: () => {},
    };
    expect(new StudyKeeper(refusing).keep(record('a'))).toEqual({
      kept: false,
      reason: 'the browser refused to store it (private browsing or storage turned off)',
      older: 'none',
    });
    expect(new StudyKeeper(undefined).keep(record('a'))).toMatchObject({ kept: false, older: 'none' });
  });

  it('readKept() leaves out damaged or foreign records and reads the earlier single copy', () => {
    const storage = memoryStorage();
    storage.setItem(`${AUTOSAVE_PREFIX}.0`, '{not json');
    storage.setItem(`${AUTOSAVE_PREFIX}.1`, JSON.stringify({ document: 'text', savedAt: 'x' }));
    storage.setItem(`${AUTOSAVE_PREFIX}.2`, JSON.stringify({ document: {} }));
    storage.setItem(`${AUTOSAVE_PREFIX}.3`, JSON.stringify({ document: [], savedAt: 'x' }));
    expect(readKept(storage)).toEqual({ versions: [] });
    storage.setItem(
      LEGACY_AUTOSAVE_KEY,
      JSON.stringify({ document: { name: 'Kept before' }, unsaved: true, savedAt: '2026-11-30T10:00:00Z' }),
    );
    expect(readKept(storage).versions).toMatchObject([{ name: 'Kept before', unsaved: true, problems: [] }]);
  });

  it('discardAll() forgets every version, the mark and the earlier single copy', () => {
    const storage = memoryStorage();
    storage.setItem(LEGACY_AUTOSAVE_KEY, JSON.stringify({ document: { name: 'old' }, savedAt: 'x' }));
    const keeper = new StudyKeeper(storage);
    keeper.keep(record('a'));
    keeper.keep(record('b'));
    keeper.discardAll();
    expect(storage.items.size).toBe(0);
  });

  it('needsOffer() is true for unsaved work or problems, false for a clean copy of a file', () => {
    const storage = memoryStorage();
    const keeper = new StudyKeeper(storage);
    keeper.keep(record('clean', { unsaved: false }));
    expect(needsOffer(readKept(storage))).toBe(false);
    keeper.keep(record('cleared field', { unsaved: false, problems: [{ path: 'study.name', message: 'x' }] }));
    expect(needsOffer(readKept(storage))).toBe(true);
    keeper.keep(record('edited', { unsaved: true }));
    expect(needsOffer(readKept(storage))).toBe(true);
  });

  it('nameOf() and refusalOf() put the study and the refusal in words', () => {
    expect(nameOf({ name: 'Harrowmere' })).toBe('Harrowmere');
    expect(nameOf({ name: '  ' })).toBe('Untitled study');
    expect(nameOf(null)).toBe('Untitled study');
    expect(refusalOf(new DOMException('x', 'QuotaExceededError'))).toBe("the browser's storage is full");
    expect(refusalOf(new Error('x'))).toMatch(/^the browser refused to store it/);
  });
});
