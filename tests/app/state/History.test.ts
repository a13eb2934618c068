import { describe, it, expect } from 'vitest';
import { History } from '../../../src/app/state/History.svelte.ts';

describe('History', () => {
  it('has the expected defaults', () => {
    const history = new History({ pickup: '800 A' });
    expect(history.current).toEqual({ pickup: '800 A' });
    expect(history.canUndo).toBe(false);
    expect(history.canRedo).toBe(false);
    expect(history.undoLabel).toBeUndefined();
  });

  it('undo() and redo() walk back and forth over committed documents', () => {
    const first = { pickup: '800 A' };
    const second = { pickup: '900 A' };
    const history = new History(first);
    history.commit(second, 'pickup of MAIN', { at: 0 });
    expect(history.canUndo).toBe(true);
    expect(history.undoLabel).toBe('pickup of MAIN');
    history.undo();
    expect(history.current).toBe(first);
    expect(history.redoLabel).toBe('pickup of MAIN');
    history.redo();
    expect(history.current).toBe(second);
    expect(history.canRedo).toBe(false);
  });

  it('commit() merges quick edits of one field into one undo step', () => {
    const history = new History({ pickup: 800 });
    history.commit({ pickup: 810 }, 'pickup', { key: 'pickup', at: 0 });
    history.commit({ pickup: 820 }, 'pickup', { key: 'pickup', at: 400 });
    history.commit({ pickup: 830 }, 'pickup', { key: 'pickup', at: 800 });
    history.undo();
    expect(history.current).toEqual({ pickup: 800 });
    expect(history.canUndo).toBe(false);
  });

  it('commit() keeps separate steps for different fields or after a pause', () => {
    const history = new History({ pickup: 800, delay: 0.3 });
    history.commit({ pickup: 810, delay: 0.3 }, 'pickup', { key: 'pickup', at: 0 });
    history.commit({ pickup: 810, delay: 0.4 }, 'delay', { key: 'delay', at: 100 });
    history.commit({ pickup: 810, delay: 0.5 }, 'delay', { key: 'delay', at: 5000 });
    history.undo();
    expect(history.current).toEqual({ pickup: 810, delay: 0.4 });
    history.undo();
    expect(history.current).toEqual({ pickup: 810, delay: 0.3 });
    history.undo();
    expect(history.current).toEqual({ pickup: 800, delay: 0.3 });
  });

  it('commit() after an undo drops the redo stack', () => {
    const history = new History(1);
    history.commit(2, 'two', { at: 0 });
    history.undo();
    history.commit(3, 'three', { at: 10 });
    expect(history.canRedo).toBe(false);
    history.redo();
    expect(history.current).toBe(3);
  });

  it('reset() forgets every step', () => {
    const history = new History(1);
    history.commit(2, 'two', { at: 0 });
    history.reset(5);
    expect(history.current).toBe(5);
    expect(history.canUndo).toBe(false);
  });
});
