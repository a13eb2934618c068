import { describe, expect, it } from 'vitest';
import { DIMENSIONS, parsePercent, parseQuantity } from '../../../src/engine/quantity/index.ts';
import { assertInDelta } from '../../asserts.ts';

describe('parseQuantity', () => {
  it('has the expected defaults', () => {
    // A bare number is in the dimension's plain unit: kVA for power, feet for length, seconds for time.
    expect(DIMENSIONS.power.plain).toBe('kVA');
    expect(parseQuantity(1500, 'power')).toBe(1.5e6);
    assertInDelta(parseQuantity(100, 'length'), 30.48, 1e-12);
    expect(parseQuantity(0.3, 'time')).toBe(0.3);
    // Cycles at 60 Hz unless told otherwise.
    assertInDelta(parseQuantity('12 cycles', 'time'), 0.2, 1e-12);
  });

  it.each([
    ['13.8 kV', 'voltage', 13800],
    ['480 V', 'voltage', 480],
    ['1500 kVA', 'power', 1.5e6],
    ['1.5 MVA', 'power', 1.5e6],
    ['250 MVA', 'power', 250e6],
    ['11.6 kA', 'current', 11600],
    ['100 ft', 'length', 30.48],
    ['30 m', 'length', 30],
    ['0.3 s', 'time', 0.3],
    ['0.05 Ω', 'impedance', 0.05],
  ] as const)('reads "%s" as a %s of %d in SI units', (text, dimension, si) => {
    assertInDelta(parseQuantity(text, dimension), si, 1e-12);
  });

  it('reads "12 cycles" as 0.2 s at 60 Hz and 0.24 s at 50 Hz', () => {
    assertInDelta(parseQuantity('12 cycles', 'time', { frequency: 60 }), 0.2, 1e-12);
    assertInDelta(parseQuantity('12 cycles', 'time', { frequency: 50 }), 0.24, 1e-12);
  });

  it('a bare number takes the given plain unit: 250 in MVA', () => {
    expect(parseQuantity(250, 'power', { plainUnit: 'MVA' })).toBe(250e6);
    expect(parseQuantity('250', 'power', { plainUnit: 'MVA' })).toBe(250e6);
  });

  it.each([
    ['13.8 kVV', 'voltage', /^expected a voltage such as "13\.8 kV"$/],
    ['5 A', 'voltage', /^expected a voltage such as "13\.8 kV"$/],
    ['5 cycles', 'voltage', /^expected a voltage, not a time in cycles$/],
    ['ten feet', 'length', /^expected a length such as "100 ft"$/],
  ] as const)('refuses "%s" as a %s', (text, dimension, message) => {
    expect(() => parseQuantity(text, dimension)).toThrow(message);
  });

  it.each([
    ['1e400 MVA', 'power'],
    ['1e400 ft', 'length'],
    ['1e400 cycles', 'time'],
    ['1e400', 'current'],
  ] as const)('refuses "%s", which overflows to Infinity, as a %s', (text, dimension) => {
    expect(() => parseQuantity(text, dimension)).toThrow(new RegExp(`^expected a finite ${dimension}$`));
  });

  it('refuses a real power for an apparent one: "1500 kW" is not 1500 kVA without a power factor', () => {
    expect(() => parseQuantity('1500 kW', 'power')).toThrow(/^expected an apparent power in VA, kVA or MVA/);
    expect(() => parseQuantity('100 hp', 'power')).toThrow(/^expected an apparent power/);
  });

  it('refuses non-finite numbers and other types', () => {
    expect(() => parseQuantity(Infinity, 'current')).toThrow(/^expected a finite current$/);
    expect(() => parseQuantity(true, 'current')).toThrow(/^expected a current as a number or text with a unit$/);
  });
});

describe('parsePercent', () => {
  it('has the expected defaults', () => {
    expect(parsePercent(5.75)).toBe(5.75);
  });

  it('reads "5.75 %", "5.75%" and "5.75" as 5.75 percent', () => {
    expect(parsePercent('5.75 %')).toBe(5.75);
    expect(parsePercent('5.75%')).toBe(5.75);
    expect(parsePercent('5.75')).toBe(5.75);
  });

  it('refuses text that is not a percentage', () => {
    expect(() => parsePercent('five')).toThrow(/^expected a percentage such as "5\.75 %"$/);
    expect(() => parsePercent('5.75 pu')).toThrow(/^expected a percentage/);
  });
});
