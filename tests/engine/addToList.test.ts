import { describe, expect, it } from 'vitest';
import { addToList } from '../../src/engine/addToList.ts';

describe('addToList', () => {
  it('keeps the values of each key in the order given, in one list per key', () => {
    const motorsOn = new Map<string, string[]>();
    for (const [bus, motor] of [
      ['MCC', 'M1'],
      ['MCC-2', 'M2'],
      ['MCC', 'M3'],
    ])
      addToList(motorsOn, bus, motor);
    expect([...motorsOn]).toEqual([
      ['MCC', ['M1', 'M3']],
      ['MCC-2', ['M2']],
    ]);
  });

  it('adds to the list it keeps, not a copy', () => {
    const lists = new Map<string, number[]>();
    addToList(lists, 'a', 1);
    const kept = lists.get('a');
    addToList(lists, 'a', 2);
    expect(lists.get('a')).toBe(kept);
    expect(kept).toEqual([1, 2]);
  });
});
