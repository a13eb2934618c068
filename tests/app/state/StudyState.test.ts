import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { StudyState } from '../../../src/app/state/StudyState.svelte.ts';
import { withValueAt } from '../../../src/app/lib/documentPath.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

const text = readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8');
const demo = JSON.parse(text) as StudyInput;
const mainIndex = demo.devices!.findIndex((d) => d.id === 'MAIN');
const sensor = ['devices', mainIndex, 'characteristic', 'sensor'];

describe('StudyState', () => {
  it('has the expected defaults', () => {
    const state = new StudyState(demo, 'harrowmere-selective.json');
    expect(state.document).toBe(demo);
    expect(state.dirty).toBe(false);
    expect(state.problems).toEqual([]);
    expect(state.view?.id).toBe(demo.views![0].id);
    expect(state.selection).toBeUndefined();
    expect(state.network?.devices.has('MAIN')).toBe(true);
  });

  it('edit() changes one field as written, marks the study dirty and can be undone', () => {
    const state = new StudyState(demo);
    state.edit(sensor, '1600 A', 'sensor of MAIN');
    expect(state.valueAt(sensor)).toBe('1600 A');
    expect(state.study?.devices[mainIndex].characteristic).toMatchObject({ sensor: 1600 });
    expect(state.dirty).toBe(true);
    state.history.undo();
    expect(state.document).toBe(demo);
    expect(state.dirty).toBe(false);
  });

  it('a mistyped field names its path while study keeps the last valid parse', () => {
    const state = new StudyState(demo);
    const before = state.study;
    state.edit(sensor, 'lots', 'sensor of MAIN');
    expect(state.problems.map((p) => `${p.path}: ${p.message}`)).toEqual([
      expect.stringMatching(
        new RegExp(
          `^study\\.devices\\[${mainIndex}\\]\\.characteristic\\.sensor: expected a current such as "25 kA", got "lots"$`,
        ),
      ),
    ]);
    expect(state.study).toEqual(before);
  });

  it('open() refuses a bad file and leaves the study, its history and its selection untouched', () => {
    const state = new StudyState(demo, 'harrowmere-selective.json');
    state.edit(sensor, 1600, 'sensor of MAIN');
    state.selection = { kind: 'device', id: 'MAIN' };
    const bad = JSON.stringify({
      ...demo,
      transformers: [{ ...demo.transformers![0], impedance: '-5' }, ...demo.transformers!.slice(1)],
    });
    expect(state.open(bad, 'bad.json')).toBe(false);
    expect(state.refused?.fileName).toBe('bad.json');
    expect(state.refused?.problems.map((p) => `${p.path}: ${p.message}`)).toContain(
      'study.transformers[0].impedance: expected a percentage of at least 0.5, got "-5"',
    );
    expect(state.valueAt(sensor)).toBe(1600);
    expect(state.history.canUndo).toBe(true);
    expect(state.selection).toEqual({ kind: 'device', id: 'MAIN' });
  });

  it('open() asks before replacing a study with a good file, and only then', () => {
    const state = new StudyState(demo);
    let asked = 0;
    const other = JSON.stringify({ ...demo, name: 'Other' });
    expect(state.open(other, 'other.json', { confirmDiscard: () => (asked++, false) })).toBe(false);
    expect(state.document.name).toBe(demo.name);
    expect(state.open(other, 'other.json', { confirmDiscard: () => (asked++, true) })).toBe(true);
    expect(asked).toBe(2);
    expect(state.document.name).toBe('Other');
    expect(state.history.canUndo).toBe(false);
    expect(state.fileName).toBe('other.json');
  });

  it('newView() adds a sheet for a device and the devices above it; addDeviceToView() adds one more', () => {
    const state = new StudyState(demo);
    state.newView('FDR-DOCK');
    expect(state.view?.devices).toEqual(['R-T1', 'MAIN', 'FDR-DOCK']);
    state.addDeviceToView('FDR-MCC');
    state.addDeviceToView('FDR-MCC');
    expect(state.view?.devices).toEqual(['R-T1', 'MAIN', 'FDR-DOCK', 'FDR-MCC']);
    state.removeDeviceFromView('R-T1');
    expect(state.view?.devices).toEqual(['MAIN', 'FDR-DOCK', 'FDR-MCC']);
    state.history.undo();
    state.history.undo();
    state.history.undo();
    expect(state.study?.views).toHaveLength(demo.views!.length);
  });

  it('deleteView() removes the current sheet and shows the next', () => {
    const state = new StudyState(demo);
    state.viewId = demo.views![0].id;
    state.deleteView();
    expect(state.study?.views.map((v) => v.id)).toEqual(demo.views!.slice(1).map((v) => v.id));
    expect(state.view?.id).toBe(demo.views![1].id);
  });

  it('load() with unsaved keeps a recovered study dirty; markSaved() makes it clean', () => {
    const state = new StudyState(demo);
    state.load(demo, 'recovered.json', { unsaved: true, viewId: demo.views!.at(-1)!.id });
    expect(state.dirty).toBe(true);
    expect(state.view?.id).toBe(demo.views!.at(-1)!.id);
    state.markSaved('saved.json');
    expect(state.dirty).toBe(false);
    expect(state.fileName).toBe('saved.json');
  });

  it('counts each study shown (opened, started or recovered, under any name), not a save', () => {
    const state = new StudyState(demo, 'study.json');
    const first = state.opened;
    state.load(demo, 'study.json');
    expect(state.opened).toBe(first + 1);
    state.newStudy();
    state.newStudy();
    expect(state.opened).toBe(first + 3);
    state.markSaved('plant.json');
    expect(state.opened).toBe(first + 3);
  });

  it('newStudy() starts from one bus and no devices', () => {
    const state = new StudyState(demo);
    state.newStudy();
    expect(state.problems).toEqual([]);
    expect(state.study?.devices).toEqual([]);
    expect(state.view).toBeUndefined();
  });

  it('load() refuses a document with problems and keeps the study on screen whole', () => {
    const state = new StudyState(demo, 'harrowmere-selective.json');
    state.edit(sensor, 1600, 'sensor of MAIN');
    expect(state.load({ ...demo, name: '' }, 'unnamed.json')).toBe(false);
    expect(state.refused).toMatchObject({ fileName: 'unnamed.json', problems: [{ path: 'study.name' }] });
    expect(state.document.name).toBe(demo.name);
    expect(state.valueAt(sensor)).toBe(1600);
    expect(state.network?.devices.has('MAIN')).toBe(true);
  });

  it('restore() brings a kept copy back exactly as kept, problems and all, with nothing of the old study', () => {
    const state = new StudyState(demo, 'harrowmere-selective.json');
    const kept = structuredClone(demo);
    kept.name = 'Kept mid-edit';
    (kept.devices![mainIndex].characteristic as { sensor: unknown }).sensor = '';
    const shown = state.restore(kept, { fileName: 'kept.json', unsaved: true, savedAt: '2026-12-01T22:00:00Z' });
    expect(shown).toBe(true);
    expect(state.document).toBe(kept);
    expect(state.valueAt(sensor)).toBe('');
    expect(state.problems.map((p) => p.path)).toEqual([`study.devices[${mainIndex}].characteristic.sensor`]);
    // The old study's parse does not stand in for the kept one: no tree until the problem is fixed.
    expect(state.study).toBeUndefined();
    expect(state.network).toBeUndefined();
    expect(state.recovered).toEqual({ savedAt: '2026-12-01T22:00:00Z', problems: 1 });
    expect(state.dirty).toBe(true);
    state.edit(sensor, '2000 A', 'sensor of MAIN');
    expect(state.study?.name).toBe('Kept mid-edit');
    state.markSaved('kept.json');
    expect(state.recovered).toBeUndefined();
  });

  it('the recovered mark goes when another study replaces the restored one', () => {
    const state = new StudyState(demo);
    state.restore(demo, { unsaved: true, savedAt: '2026-12-01T22:00:00Z' });
    expect(state.recovered).toEqual({ savedAt: '2026-12-01T22:00:00Z', problems: 0 });
    state.newStudy();
    expect(state.recovered).toBeUndefined();
  });

  it('deleteItem(cable) removes the cable, its bus and what hangs below in one undo step', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'cable', id: 'C-MCC' };
    state.deleteItem({ kind: 'cable', id: 'C-MCC' });
    expect(state.problems).toEqual([]);
    expect(state.network?.buses.has('MCC')).toBe(false);
    expect(state.network?.devices.has('MCC-M1')).toBe(false);
    expect(state.selection).toBeUndefined();
    expect(state.history.undoLabel).toBe('delete cable C-MCC');
    state.history.undo();
    expect(state.document).toBe(demo);
  });

  it('an edit that makes the reader throw is a problem of the study, never an error out of the state', () => {
    const state = new StudyState(demo);
    const hostile = {
      get discern(): number {
        throw new RangeError('Maximum call stack size exceeded');
      },
    };
    state.edit(['source'], hostile, 'source');
    expect(state.problems.map((p) => p.path)).toEqual(['study']);
    expect(state.study?.name).toBe(demo.name);
  });

  it('typing a new id for the selected device renames it everywhere in one undo step, and the editor stays on it', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    const id = ['devices', mainIndex, 'id'];
    state.edit(id, 'MAI', 'id of MAIN');
    expect(state.problems).toEqual([]);
    expect(state.selection).toEqual({ kind: 'device', id: 'MAI' });
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
    expect(state.study?.views.find((v) => v.id === 'service')?.devices).toContain('MAI');
    expect(state.network?.devices.has('MAI')).toBe(true);
    state.history.undo();
    expect(state.document).toBe(demo);
  });

  it('a half-typed or taken id stands as written, the editor stays on the item by its place, and typing on renames', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    const id = ['devices', mainIndex, 'id'];
    state.edit(id, 'R-T1', 'id of MAIN');
    expect(state.problems.map((p) => p.path)).toContain(`study.devices[${mainIndex}].id`);
    // R-T1 is the first device, so only its place keeps the editor on the one being typed.
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
    state.edit(id, 'MAIN 2', 'id of MAIN');
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
    expect(state.valueAt(['views', 0, 'devices'])).toContain('MAIN');
    state.edit(id, 'MAIN-2', 'id of MAIN');
    expect(state.problems).toEqual([]);
    expect(state.selection).toEqual({ kind: 'device', id: 'MAIN-2' });
    expect(state.valueAt(['views', 0, 'devices'])).toContain('MAIN-2');
  });

  it('an id left half-typed while another field is edited still renames every reference once it is typed whole', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    const id = ['devices', mainIndex, 'id'];
    state.edit(id, '', 'id of MAIN');
    state.edit(['devices', mainIndex, 'name'], 'Main breaker', 'name of MAIN');
    state.edit(id, 'MAIN-2', 'id of MAIN');
    expect(state.problems).toEqual([]);
    expect(state.valueAt(['views', 0, 'devices'])).toContain('MAIN-2');
  });

  it("the Delete of an item held by its place while its id is another item's deletes nothing", () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    state.edit(['devices', mainIndex, 'id'], 'R-T1', 'id of MAIN');
    const before = state.document;
    state.deleteItem(state.selection!);
    expect(state.document).toBe(before);
  });

  it('undoing and redoing a rename takes the selection and the sheet shown with it', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    state.edit(['devices', mainIndex, 'id'], 'MAI', 'id of MAIN');
    state.undo();
    expect(state.selection).toEqual({ kind: 'device', id: 'MAIN' });
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
    state.redo();
    expect(state.selection).toEqual({ kind: 'device', id: 'MAI' });
    state.viewId = demo.views![1].id;
    state.edit(['views', 1, 'id'], 'renamed', 'id of a sheet');
    state.undo();
    expect(state.view?.id).toBe(demo.views![1].id);
  });

  it('undo brings back the sheet that was shown: after a new sheet, and after deleting the sheet shown', () => {
    const state = new StudyState(demo);
    const office = demo.views![2].id;
    state.viewId = office;
    state.newView('MAIN');
    expect(state.viewId).not.toBe(office);
    state.undo();
    expect(state.view?.id).toBe(office);
    state.deleteView();
    expect(state.view?.id).not.toBe(office);
    state.undo();
    expect(state.view?.id).toBe(office);
    state.redo();
    expect(state.view?.id).not.toBe(office);
  });

  it("undo of an id typed as another item's brings the editor back to the item by its place", () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    state.edit(['devices', mainIndex, 'id'], 'R-T1', 'id of MAIN');
    state.undo();
    expect(state.selection).toEqual({ kind: 'device', id: 'MAIN' });
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
  });

  it('a half-typed id survives another id renamed, another id cleared and a setting written: typing on renames', () => {
    const state = new StudyState(demo);
    const id = ['devices', mainIndex, 'id'];
    const feeder = demo.devices!.findIndex((d) => d.id === 'FDR-MCC');
    state.edit(id, '', 'id of MAIN');
    state.edit(['devices', feeder, 'id'], 'FDR-MCC2', 'id of FDR-MCC');
    state.edit(['devices', feeder, 'id'], '', 'id of FDR-MCC2');
    state.history.commit(withValueAt(state.document, ['devices', mainIndex, 'name'], 'Main'), 'a setting');
    state.edit(id, 'MAIN-2', 'id of MAIN');
    state.edit(['devices', feeder, 'id'], 'FDR-MCC3', 'id of FDR-MCC');
    expect(state.problems).toEqual([]);
    expect(state.valueAt(['views', 0, 'devices'])).toEqual(expect.arrayContaining(['MAIN-2', 'FDR-MCC3']));
  });

  it('a half-typed id is kept when an edit adds a sheet or takes away an item after it: its item stays in place', () => {
    const state = new StudyState(demo);
    const id = ['devices', mainIndex, 'id'];
    state.edit(id, '', 'id of MAIN');
    const views = state.valueAt(['views']) as unknown[];
    state.edit(['views'], [...views, { id: 'extra', referenceVoltage: 480, devices: ['R-T1'] }], 'a sheet');
    state.deleteItem({ kind: 'device', id: 'EM-BR' });
    state.edit(id, 'MAIN-2', 'id of MAIN');
    expect(state.problems).toEqual([]);
    expect(state.valueAt(['views', 0, 'devices'])).toContain('MAIN-2');
  });

  it('undo keeps the selection on an item chosen by an id two items share for now', () => {
    const state = new StudyState(demo);
    const feeder = demo.devices!.findIndex((d) => d.id === 'FDR-MCC');
    state.edit(['devices', mainIndex, 'id'], 'FDR-MCC', 'id of MAIN');
    state.selection = { kind: 'device', id: 'FDR-MCC', at: feeder };
    state.undo();
    expect(state.selectionPath).toEqual(['devices', feeder]);
    // Chosen by the id alone (the tree's click), it is not moved to the first item that had it.
    state.redo();
    state.selection = { kind: 'device', id: 'FDR-MCC' };
    state.undo();
    expect(state.selectionPath).toEqual(['devices', feeder]);
  });

  it('a deletion that moves the items forgets a half-typed id, so typing at its old place renames the item now there', () => {
    const state = new StudyState(demo);
    const feeder = demo.devices!.findIndex((d) => d.id === 'FDR-MCC');
    state.edit(['devices', feeder, 'id'], '', 'id of FDR-MCC');
    state.deleteItem({ kind: 'device', id: 'R-T1' });
    // MCC-M1 now stands where FDR-MCC stood.
    expect(state.valueAt(['devices', feeder, 'id'])).toBe('MCC-M1');
    state.edit(['devices', feeder, 'id'], 'COMP-1', 'id of MCC-M1');
    expect(state.valueAt(['views', 0, 'devices'])).toEqual(['MAIN', 'FDR-MCC', 'COMP-1']);
  });

  it('undo of an edit that renames nothing leaves the selection the same object (the panels bring a new one into view)', () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    const selected = state.selection;
    state.edit(['name'], 'Renamed study', 'name');
    state.undo();
    expect(state.selection).toBe(selected);
  });

  it("redo of an id typed as another item's keeps the editor on the item typed into", () => {
    const state = new StudyState(demo);
    state.selection = { kind: 'device', id: 'MAIN' };
    state.edit(['devices', mainIndex, 'id'], 'R-T1', 'id of MAIN');
    state.undo();
    state.redo();
    expect(state.selectionPath).toEqual(['devices', mainIndex]);
  });

  it('undo shows the sheet shown with each version, the first sheet included, and never names a sheet gone', () => {
    const state = new StudyState(demo);
    const first = state.view?.id;
    state.newView('FDR-MCC');
    state.undo();
    expect(state.viewId).toBe(first);
    state.edit(['name'], 'Renamed study', 'name');
    state.viewId = demo.views![2].id;
    state.undo();
    expect(state.view?.id).toBe(first);
  });

  it('renaming the sheet shown keeps it on the sheet', () => {
    const state = new StudyState(demo);
    state.viewId = demo.views![1].id;
    state.edit(['views', 1, 'id'], 'renamed', 'id of a sheet');
    expect(state.viewId).toBe('renamed');
    expect(state.view?.id).toBe('renamed');
  });
});
