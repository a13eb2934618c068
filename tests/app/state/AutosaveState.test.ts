import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { AutosaveState } from '../../../src/app/state/AutosaveState.svelte.ts';
import { StudyState } from '../../../src/app/state/StudyState.svelte.ts';
import { readKept, StudyKeeper, type StorageLike } from '../../../src/app/lib/autosave.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
) as StudyInput;
const mainIndex = demo.devices!.findIndex((d) => d.id === 'MAIN');
const sensor = ['devices', mainIndex, 'characteristic', 'sensor'];

function memoryStorage(): StorageLike & { items: Map<string, string>; refuse: boolean } {
  const items = new Map<string, string>();
  const storage = {
    items,
    refuse: false,
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => {
      if (storage.refuse && value.length > 200) throw new DOMException('full', 'QuotaExceededError');
      items.set(key, value);
    },
    removeItem: (key: string) => void items.delete(key),
  };
  return storage;
}

/** A scheduler that holds tasks until `run()`, so a test decides when the page is idle. */
function heldScheduler() {
  const tasks = new Set<() => void>();
  const schedule = (task: () => void) => {
    tasks.add(task);
    return () => void tasks.delete(task);
  };
  const run = () => {
    for (const task of [...tasks]) {
      tasks.delete(task);
      task();
    }
  };
  return { schedule, run, tasks };
}

const clock = () => '2026-12-01T22:00:00.000Z';

/** A workbench's study and autosave over `storage`, started as the App starts them. */
function startWith(storage: StorageLike) {
  const study = new StudyState(demo, 'harrowmere-selective.json');
  const idle = heldScheduler();
  const autosave = new AutosaveState(study, storage, idle.schedule, clock);
  autosave.start(readKept(storage));
  return { study, autosave, idle };
}

describe('AutosaveState', () => {
  it('has the expected defaults: nothing kept, nothing offered, nothing written until idle', () => {
    const storage = memoryStorage();
    const { autosave, idle } = startWith(storage);
    expect(autosave.offer).toBeUndefined();
    expect(autosave.status).toEqual({ kind: 'idle' });
    autosave.request();
    expect(storage.items.size).toBe(0);
    idle.run();
    expect(autosave.status).toEqual({ kind: 'kept', at: clock() });
    expect(readKept(storage).versions[0]).toMatchObject({ name: demo.name, unsaved: false, problems: [] });
  });

  it('every committed edit is kept, the latest one winning when several wait for the same idle moment', () => {
    const storage = memoryStorage();
    const { study, autosave, idle } = startWith(storage);
    study.edit(sensor, '1600 A', 'sensor of MAIN');
    autosave.request();
    study.edit(sensor, '', 'sensor of MAIN');
    autosave.request();
    expect(idle.tasks.size).toBe(1);
    idle.run();
    const [kept] = readKept(storage).versions;
    expect((kept.document as StudyInput).devices![mainIndex].characteristic).toMatchObject({ sensor: '' });
    expect(kept.problems.map((p) => p.path)).toEqual([`study.devices[${mainIndex}].characteristic.sensor`]);
    expect(kept.unsaved).toBe(true);
  });

  it('a stream of edits (a drag) does not put the write off: the waiting write takes the newest edit', () => {
    const storage = memoryStorage();
    const study = new StudyState(demo);
    let scheduled = 0;
    const idle = heldScheduler();
    const autosave = new AutosaveState(study, storage, (task) => (scheduled++, idle.schedule(task)), clock);
    for (const amps of ['1600 A', '1700 A', '1800 A']) {
      study.edit(sensor, amps, 'sensor of MAIN');
      autosave.request();
    }
    expect(scheduled).toBe(1);
    idle.run();
    const [kept] = readKept(storage).versions;
    expect((kept.document as StudyInput).devices![mainIndex].characteristic).toMatchObject({ sensor: '1800 A' });
    study.edit(sensor, '1900 A', 'sensor of MAIN');
    autosave.request();
    expect(scheduled).toBe(2);
  });

  it('flush() writes at once (the page is going away) and leaves nothing scheduled', () => {
    const storage = memoryStorage();
    const { study, autosave, idle } = startWith(storage);
    study.edit(sensor, '1600 A', 'sensor of MAIN');
    autosave.request();
    autosave.flush();
    expect(idle.tasks.size).toBe(0);
    expect(readKept(storage).versions).toHaveLength(1);
  });

  it('kept unsaved work is offered back on start, and nothing overwrites it until the user chooses', () => {
    const storage = memoryStorage();
    const kept = structuredClone(demo);
    kept.name = 'Mid-edit';
    new StudyKeeper(storage).keep({ document: kept, unsaved: true, savedAt: clock() });
    const before = new Map(storage.items);
    const { study, autosave, idle } = startWith(storage);
    expect(autosave.offer?.versions.map((v) => v.name)).toEqual(['Mid-edit']);
    expect(study.document.name).toBe(demo.name);
    autosave.request();
    idle.run();
    autosave.flush();
    expect(storage.items).toEqual(before);
    expect(autosave.restore(autosave.offer!.versions[0])).toBe(true);
    expect(autosave.offer).toBeUndefined();
    expect(study.document).toEqual(kept);
    expect(study.dirty).toBe(true);
  });

  it('discard() forgets the kept copies; the study on screen stays', () => {
    const storage = memoryStorage();
    new StudyKeeper(storage).keep({ document: { ...demo, name: 'Mid-edit' }, unsaved: true, savedAt: clock() });
    const { study, autosave } = startWith(storage);
    autosave.discard();
    expect(autosave.offer).toBeUndefined();
    expect(readKept(storage).versions).toEqual([]);
    expect(study.document).toBe(demo);
  });

  it('a clean kept copy of a file simply reopens, with no offer', () => {
    const storage = memoryStorage();
    const other = { ...demo, name: 'Opened from a file' };
    new StudyKeeper(storage).keep({ document: other, fileName: 'other.json', unsaved: false, savedAt: clock() });
    const { study, autosave } = startWith(storage);
    expect(autosave.offer).toBeUndefined();
    expect(study.document).toEqual(other);
    expect(study.fileName).toBe('other.json');
    expect(study.dirty).toBe(false);
  });

  it('a refused write sets a status that says why and what became of the older copy', () => {
    const storage = memoryStorage();
    const { study, autosave, idle } = startWith(storage);
    autosave.request();
    idle.run();
    storage.refuse = true;
    study.edit(sensor, '1600 A', 'sensor of MAIN');
    autosave.request();
    idle.run();
    expect(autosave.status).toEqual({
      kind: 'refused',
      at: clock(),
      reason: "the browser's storage is full",
      older: 'marked',
    });
    storage.refuse = false;
    study.edit(sensor, '2000 A', 'sensor of MAIN');
    autosave.request();
    idle.run();
    expect(autosave.status).toEqual({ kind: 'kept', at: clock() });
  });
});
