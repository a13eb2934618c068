import { describe, it, expect } from 'vitest';
import {
  AUTOSAVE_KEY,
  clearAutosave,
  readAutosave,
  writeAutosave,
  type StorageLike,
} from '../../../src/app/lib/autosave.ts';

function memoryStorage(): StorageLike & { items: Map<string, string> } {
  const items = new Map<string, string>();
  return {
    items,
    getItem: (key) => items.get(key) ?? null,
    setItem: (key, value) => void items.set(key, value),
    removeItem: (key) => void items.delete(key),
  };
}

describe('autosave', () => {
  it('has the expected defaults', () => {
    expect(AUTOSAVE_KEY).toBe('discern.autosave.v1');
    expect(readAutosave(memoryStorage())).toBeUndefined();
  });

  it('writeAutosave() then readAutosave() gives the record back', () => {
    const storage = memoryStorage();
    const record = {
      document: { name: 'Harrowmere' },
      fileName: 'h.json',
      viewId: 'V1',
      unsaved: true,
      savedAt: '2026-12-01T22:00:00Z',
    };
    expect(writeAutosave(storage, record)).toBe(true);
    expect(readAutosave(storage)).toEqual(record);
    clearAutosave(storage);
    expect(readAutosave(storage)).toBeUndefined();
  });

  it('readAutosave() ignores a damaged or foreign record', () => {
    const storage = memoryStorage();
    storage.setItem(AUTOSAVE_KEY, '{not json');
    expect(readAutosave(storage)).toBeUndefined();
    storage.setItem(AUTOSAVE_KEY, JSON.stringify({ document: 'text', savedAt: 'x' }));
    expect(readAutosave(storage)).toBeUndefined();
    storage.setItem(AUTOSAVE_KEY, JSON.stringify({ document: {} }));
    expect(readAutosave(storage)).toBeUndefined();
  });

  it('writeAutosave() returns false when storage refuses (full), without throwing', () => {
    const full: StorageLike = {
      getItem: () => null,
      setItem: () => {
        throw new Error('QuotaExceededError');
      },
      removeItem: () => {},
    };
    expect(writeAutosave(full, { document: {}, unsaved: false, savedAt: 'now' })).toBe(false);
  });
});
