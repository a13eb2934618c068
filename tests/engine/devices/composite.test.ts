import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../asserts.ts';
import { compositeEdge, definiteElement, i2tElement, uniqueAscending } from '../../../src/engine/devices/composite.ts';

describe('composite', () => {
  it('has the expected defaults', () => {
    const edge = compositeEdge([definiteElement(600, 0.5)]);
    expect(edge.time(600)).toBe(0.5);
    expect(edge.time(599)).toBe(Infinity);
    expect(edge.minAmps).toBe(600);
    expect(edge.breakpoints).toEqual([600]);
  });

  it('compositeEdge takes the fastest element, floors it and adds the interrupting time (IEEE C37.112 definite-time practice)', () => {
    const edge = compositeEdge([definiteElement(600, 0.5), definiteElement(3000, 0.005)], 0.016, 0.083);
    assertInDelta(edge.time(1000), 0.583);
    assertInDelta(edge.time(4000), 0.099);
    expect(edge.time(100)).toBe(Infinity);
  });

  it('compositeEdge marks where an I²t ramp hands over to a flat element', () => {
    // Long-time 10 s at 4800 A meets a 0.3 s definite delay at 4800 · √(10/0.3) = 27 713 A (computed).
    const edge = compositeEdge([i2tElement(800, 10, 4800), definiteElement(20000, 0.3)]);
    assertInDelta(edge.breakpoints[2], 4800 * Math.sqrt(10 / 0.3), 1e-12);
    expect(edge.breakpoints.length).toBe(3);
  });

  it('i2tElement is flat above flatFrom and continuous there', () => {
    const element = i2tElement(3200, 0.3, 8000, 8000);
    assertInDelta(element.time(4800), 0.3 * (8000 / 4800) ** 2);
    expect(element.time(8000)).toBe(0.3);
    expect(element.time(1e9)).toBe(0.3);
    expect(element.joins).toEqual([8000]);
  });

  it('uniqueAscending drops repeats, rounding twins and non-finite values', () => {
    expect(uniqueAscending([600, Infinity, 60, 600, 0, -1, NaN, 600 * (1 + 1e-14)])).toEqual([60, 600]);
  });
});
