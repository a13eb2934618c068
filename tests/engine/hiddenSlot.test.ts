import { describe, expect, it } from 'vitest';
import { hiddenSlot } from '../../src/engine/hiddenSlot.ts';

describe('hiddenSlot', () => {
  it('has the expected defaults: nothing kept on an object it was never given', () => {
    expect(hiddenSlot<number>().get({})).toBeUndefined();
  });

  it('keeps a value on its object, out of its keys, JSON, clones and deep equality; a second set replaces it', () => {
    const slot = hiddenSlot<{ pair: string }>();
    const subjects = ['MAIN', 'FEEDER'];
    slot.set(subjects, { pair: 'first' });
    slot.set(subjects, { pair: 'MAIN over FEEDER' });
    expect(slot.get(subjects)).toEqual({ pair: 'MAIN over FEEDER' });
    expect(Reflect.ownKeys(subjects)).toEqual(['0', '1', 'length']);
    expect(JSON.stringify(subjects)).toBe('["MAIN","FEEDER"]');
    expect(slot.get(structuredClone(subjects))).toBeUndefined();
    expect(subjects).toEqual(['MAIN', 'FEEDER']);
  });

  it('keeps each slot apart: two slots on one object hold their own values', () => {
    const [names, counts] = [hiddenSlot<string>(), hiddenSlot<number>()];
    const target = {};
    names.set(target, 'relay R1');
    counts.set(target, 3);
    expect([names.get(target), counts.get(target)]).toEqual(['relay R1', 3]);
    expect(names.get({})).toBeUndefined();
  });
});
