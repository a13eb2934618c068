import { describe, it, expect } from 'vitest';
import { INRUSH, inferInrushMultiple, inrushMarkersOf } from '../../../src/engine/withstand/inrush.ts';
import { assertInDelta } from '../../asserts.ts';
import { transformerOf } from './fixtures.ts';

describe('inrushMarkersOf', () => {
  it('has the expected defaults', () => {
    // common practice (common practice): 8 × FLA at 0.1 s up to ~3000 kVA, 10–12 × above; 25 × at 0.01 s for small units
    expect(INRUSH).toMatchObject({
      multiple: 8,
      largeUnitMultiple: 12,
      seconds: 0.1,
      halfCycleMultiple: 25,
      halfCycleSeconds: 0.01,
    });
    const markers = inrushMarkersOf(transformerOf());
    expect(markers).toHaveLength(1);
    expect(markers[0]).toMatchObject({ kind: 'inrush', volts: 13_800, seconds: 0.1, elementId: 'T1' });
    assertInDelta(markers[0].amps, 8 * 104.592, 1e-5);
    expect(markers[0].label).toBe('inrush 8 × FLA at 0.1 s (common practice)');
  });

  it('inrushMarkersOf(hand-worked Category II transformer, conservative) gives 12 × FLA at 0.1 s and 25 × FLA at 0.01 s at 13.8 kV', () => {
    // hand-worked IEEE C57.109 Category II case inrush markers (common practice; amps computed): 1255.11 A / 2614.81 A at 13.8 kV
    const [point, halfCycle] = inrushMarkersOf(transformerOf(), { multiple: 12, halfCyclePoint: true });
    assertInDelta(point.amps, 1255.11, 1e-5);
    expect(point.seconds).toBe(0.1);
    assertInDelta(halfCycle.amps, 2614.81, 1e-5);
    expect(halfCycle.seconds).toBe(0.01);
    expect(halfCycle.volts).toBe(13_800);
    expect(halfCycle.label).toMatch(/^inrush 25 × FLA at 0\.01 s \(common practice\)$/);
  });

  it('inferInrushMultiple switches from 8 × to 12 × above 3000 kVA', () => {
    expect(inferInrushMultiple(3_000_000)).toBe(8);
    expect(inferInrushMultiple(3_000_001)).toBe(12);
    const [large] = inrushMarkersOf(transformerOf({ rating: '5 MVA', primary: '13.8 kV', secondary: '4.16 kV' }));
    assertInDelta(large.amps, (12 * 5e6) / (Math.sqrt(3) * 13_800), 1e-12);
  });

  it('inrushMarkersOf adds the 25 × half-cycle point for dry-type units and units of 500 kVA or less', () => {
    // hand-worked reflection case (112.5 kVA, 480–208 V) unit: 112.5 kVA 480 V Δ–208Y/120 V dry-type, primary FLA 135.316 A (computed)
    const dry = inrushMarkersOf(
      transformerOf({ rating: 112.5, primary: 480, secondary: 208, impedance: 3.5, construction: 'dry' }),
    );
    expect(dry.map((m) => m.seconds)).toEqual([0.1, 0.01]);
    assertInDelta(dry[0].amps, 8 * 135.316, 1e-5);
    assertInDelta(dry[1].amps, 25 * 135.316, 1e-5);
    expect(dry[1].volts).toBe(480);
    expect(inrushMarkersOf(transformerOf({ rating: 500 }))).toHaveLength(2);
    expect(inrushMarkersOf(transformerOf({ rating: 501 }))).toHaveLength(1);
    expect(inrushMarkersOf(transformerOf({ rating: 300 }), { halfCyclePoint: false })).toHaveLength(1);
  });

  it('inrushMarkersOf uses the primary FLA of a single-phase unit, S / V', () => {
    const [point] = inrushMarkersOf(
      transformerOf({ rating: 50, phases: 1, primary: 7200, secondary: 240, impedance: 2 }),
    );
    assertInDelta(point.amps, (8 * 50_000) / 7200, 1e-12);
  });

  it('inrushMarkersOf rejects a multiple of 1 or less and a non-boolean half-cycle choice', () => {
    expect(() => inrushMarkersOf(transformerOf(), { multiple: 0.5 })).toThrow(
      /^options\.multiple: expected a multiple of full-load current greater than 1, got "0\.5"$/,
    );
    expect(() => inrushMarkersOf(transformerOf(), { halfCyclePoint: 'yes' as unknown as boolean })).toThrow(
      /^options\.halfCyclePoint: expected true or false, got "yes"$/,
    );
    expect(() => inrushMarkersOf({ ...transformerOf(), primary: 0 })).toThrow(
      /^transformers\.T1\.primary: expected a voltage in V greater than 0, got "0"$/,
    );
  });
});
