import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../asserts.ts';
import {
  compositeEdge,
  definiteElement,
  i2tElement,
  inverseShapeTime,
  uniqueAscending,
} from '../../../src/engine/devices/composite.ts';

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

  it('inverseShapeTime takes M^p − 1 from a lower pickup’s power up to rounding, and never a negative time', () => {
    // IEEE moderately inverse, dial 3, pickup 630 A (600 A + 5 %), its power taken from 570 A (600 A − 5 %).
    const [a, b, p, dial] = [0.0515, 0.114, 0.02, 3];
    const base = { kind: 'inverse' as const, dial, a, b, p, cap: Infinity, capTime: dial * b };
    const shared = inverseShapeTime({ ...base, inversePickup: 1 / 630, referenceInverse: 1 / 570 });
    const own = inverseShapeTime({ ...base, inversePickup: 1 / 630, referenceInverse: 1 / 630 });
    for (const amps of [631, 700, 1260, 6300, 63000]) {
      // IEEE C37.112 eq. 1, t = dial · (a / (M^p − 1) + b), the plain way.
      const plain = dial * (a / Math.expm1(p * Math.log(amps * (1 / 630))) + b);
      assertInDelta(shared(amps), plain, 1e-12);
      expect(own(amps)).toBe(plain);
    }
    expect(shared(630)).toBe(Infinity);
    expect(shared(600)).toBe(Infinity);
    // One ulp above the pickup rounding decides between a huge time and Infinity, never a negative one.
    const justAbove = shared(630 * (1 + 2 ** -52));
    expect(justAbove > 1e6).toBe(true);
  });

  it('uniqueAscending drops repeats, rounding twins and non-finite values', () => {
    expect(uniqueAscending([600, Infinity, 60, 600, 0, -1, NaN, 600 * (1 + 1e-14)])).toEqual([60, 600]);
  });
});
