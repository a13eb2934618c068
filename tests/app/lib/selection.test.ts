import { describe, it, expect } from 'vitest';
import {
  COLLECTION_OF,
  parseProblemPath,
  pathOfSelection,
  selectionAfterIdEdit,
  selectionOfPath,
} from '../../../src/app/lib/selection.ts';

const document = {
  source: { kind: 'utility', id: 'UTIL', bus: 'MV' },
  buses: [{ id: 'MV' }, { id: 'SWBD' }],
  devices: [{ id: 'R-T1' }, { id: 'MAIN' }],
};

describe('selection', () => {
  it('has the expected defaults', () => {
    expect(COLLECTION_OF.device).toBe('devices');
    expect(pathOfSelection(document, undefined)).toBeUndefined();
  });

  it('pathOfSelection() finds an item by kind and id', () => {
    expect(pathOfSelection(document, { kind: 'device', id: 'MAIN' })).toEqual(['devices', 1]);
    expect(pathOfSelection(document, { kind: 'source', id: 'UTIL' })).toEqual(['source']);
    expect(pathOfSelection(document, { kind: 'device', id: 'GONE' })).toBeUndefined();
    expect(pathOfSelection(document, { kind: 'motor', id: 'M1' })).toBeUndefined();
  });

  it('pathOfSelection() prefers the item at the selection’s place while it has the selected id', () => {
    const twice = { devices: [{ id: 'MAIN' }, { id: 'MAIN' }] };
    expect(pathOfSelection(twice, { kind: 'device', id: 'MAIN', at: 1 })).toEqual(['devices', 1]);
    expect(pathOfSelection(twice, { kind: 'device', id: 'MAIN' })).toEqual(['devices', 0]);
    // A place that no longer holds the id (the list changed) falls back to the id.
    expect(pathOfSelection(document, { kind: 'device', id: 'MAIN', at: 0 })).toEqual(['devices', 1]);
  });

  it('selectionAfterIdEdit() follows a new id, or holds the place of a half-typed one', () => {
    const main = { kind: 'device', id: 'MAIN' } as const;
    expect(selectionAfterIdEdit(main, ['devices', 1, 'id'], 'MAIN-2', true)).toEqual({ kind: 'device', id: 'MAIN-2' });
    expect(selectionAfterIdEdit(main, ['devices', 1, 'id'], 'MAIN 2', false)).toEqual({
      kind: 'device',
      id: 'MAIN 2',
      at: 1,
    });
    expect(selectionAfterIdEdit({ kind: 'source', id: 'UTIL' }, ['source', 'id'], 'GRID!', false)).toEqual({
      kind: 'source',
      id: 'GRID!',
    });
  });

  it('selectionOfPath() names the item owning a field', () => {
    expect(selectionOfPath(document, ['devices', 1, 'characteristic', 'sensor'])).toEqual({
      kind: 'device',
      id: 'MAIN',
    });
    expect(selectionOfPath(document, ['source', 'max'])).toEqual({ kind: 'source', id: 'UTIL' });
    expect(selectionOfPath(document, ['name'])).toBeUndefined();
  });

  it('parseProblemPath() reads a problem path back into a document path', () => {
    expect(parseProblemPath('study.devices[2].characteristic.pickup')).toEqual([
      'devices',
      2,
      'characteristic',
      'pickup',
    ]);
    expect(parseProblemPath('study')).toEqual([]);
  });
});
