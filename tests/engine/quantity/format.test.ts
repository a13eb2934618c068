import { describe, expect, it } from 'vitest';
import { formatAmps, formatSeconds, formatSI, formatVolts, significant } from '../../../src/engine/quantity/index.ts';

describe('quantity formatting', () => {
  it('has the expected defaults', () => {
    // Four significant figures; amps switch to kA at 10 000 A.
    expect(formatAmps(1804.22)).toBe('1804 A');
    expect(formatAmps(31377.7)).toBe('31.38 kA');
  });

  it('formatVolts uses kV from 1000 V', () => {
    expect(formatVolts(12470)).toBe('12.47 kV');
    expect(formatVolts(480)).toBe('480 V');
  });

  it('formatSeconds says "no operation" for Infinity', () => {
    expect(formatSeconds(0.0834)).toBe('0.0834 s');
    expect(formatSeconds(Infinity)).toBe('no operation');
  });

  it('significant drops trailing zeros', () => {
    expect(significant(0.3)).toBe('0.3');
    expect(significant(28421.08, 6)).toBe('28421.1');
    expect(formatSI(250e6, 'VA')).toBe('250 MVA');
  });

  it('never prints Infinity or NaN: an infinite value reads "no limit", NaN is refused', () => {
    expect(formatAmps(Infinity)).toBe('no limit');
    expect(significant(-Infinity)).toBe('no limit');
    expect(() => formatAmps(NaN)).toThrow(/^expected a number to format, got "NaN"$/);
  });
});
