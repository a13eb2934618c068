import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { scaleValue, stepValue } from '../../../src/app/lib/stepValue.ts';

describe('stepValue', () => {
  it('has the expected defaults', () => {
    // Fine steps, never below zero.
    expect(stepValue(800, { direction: 1 })).toBe(810);
    expect(stepValue(0, { direction: -1 })).toBe(0);
  });

  it('stepValue() moves the second significant digit, keeping the unit text', () => {
    expect(stepValue('800 A', { direction: 1 })).toBe('810 A');
    expect(stepValue('0.3 s', { direction: -1 })).toBe('0.29 s');
    expect(stepValue('12.47 kV', { direction: 1 })).toBe('13.47 kV');
    expect(stepValue('5 cycles', { direction: 1 })).toBe('5.1 cycles');
    expect(stepValue('5.75 %', { direction: 1 })).toBe('5.85 %');
  });

  it('stepValue() with coarse moves the first significant digit', () => {
    expect(stepValue(800, { direction: 1, coarse: true })).toBe(900);
    expect(stepValue('2000 A', { direction: -1, coarse: true })).toBe('1000 A');
  });

  it('stepValue() steps down from a power of ten by the finer step below it', () => {
    expect(stepValue(1, { direction: -1 })).toBe(0.99);
    expect(stepValue(100, { direction: -1 })).toBe(99);
  });

  it('stepValue() leaves text that does not start with a number alone', () => {
    expect(stepValue('delta-wye', { direction: 1 })).toBeUndefined();
    expect(stepValue(true, { direction: 1 })).toBeUndefined();
  });

  it('stepValue() up then down returns to the start for values off a power of ten', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.011, max: 1e5, noNaN: true }), (x) => {
        const value = Number(x.toPrecision(3));
        const up = stepValue(value, { direction: 1 }) as number;
        const back = stepValue(up, { direction: -1 }) as number;
        // A step up can cross into the next decade, where the step is ten times larger.
        return up > value && (Math.abs(back - value) < 1e-9 * value || back < value);
      }),
      { numRuns: 300 },
    );
  });

  it('scaleValue() rounds to three significant figures and keeps the unit text', () => {
    expect(scaleValue('5 cycles', 2)).toBe('10 cycles');
    expect(scaleValue(0.4, 1.123456)).toBe(0.449);
    expect(scaleValue('delta-wye', 2)).toBeUndefined();
  });
});
