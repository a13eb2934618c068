import { describe, expect, it } from 'vitest';
import { EDGE_TOLERANCE, thresholdOf } from '../../../src/engine/window/index.ts';

describe('thresholdOf', () => {
  it('has the expected defaults: the whole range, both ends read, continuous to EDGE_TOLERANCE', () => {
    const reads: number[] = [];
    const found = thresholdOf({ min: 1, max: 10 }, (v) => (reads.push(v), v >= 3.2));
    expect(found.kind).toBe('from');
    expect(reads.slice(0, 2)).toEqual([1, 10]);
    if (found.kind === 'from') {
      expect(found.value).toBeGreaterThanOrEqual(3.2);
      expect(found.value / 3.2 - 1).toBeLessThan(EDGE_TOLERANCE);
    }
  });

  it('returns the exact step of a stepped setting, on the holding side', () => {
    const steps = { min: 0.05, max: 0.5, values: [0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5] };
    expect(thresholdOf(steps, (v) => v > 0.22)).toEqual({ kind: 'from', value: 0.25 });
    expect(thresholdOf(steps, (v) => v < 0.22)).toEqual({ kind: 'upTo', value: 0.2 });
  });

  it('says everywhere and nowhere, reading only the deciding end when it knows which way the condition goes', () => {
    const reads: number[] = [];
    expect(thresholdOf({ min: 1, max: 10 }, (v) => (reads.push(v), true), { favours: 'slower' })).toEqual({
      kind: 'everywhere',
    });
    expect(reads).toEqual([1]);
    expect(thresholdOf({ min: 1, max: 10 }, () => false)).toEqual({ kind: 'nowhere' });
  });

  it('brackets with a known pivot: a condition holding at the present value is bisected below it only', () => {
    const reads: number[] = [];
    const found = thresholdOf({ min: 1, max: 100 }, (v) => (reads.push(v), v >= 7), {
      favours: 'slower',
      pivot: { value: 10, holds: true },
    });
    expect(found.kind).toBe('from');
    expect(reads.every((v) => v <= 10)).toBe(true);
  });
});
