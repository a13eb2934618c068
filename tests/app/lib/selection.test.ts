import { describe, it, expect } from 'vitest';
import { COLLECTION_OF, parseProblemPath, pathOfSelection, selectionOfPath } from '../../../src/app/lib/selection.ts';

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
