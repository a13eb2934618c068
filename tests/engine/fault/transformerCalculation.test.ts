import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { transformerCalculation } from '../../../src/engine/fault/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { abs, add, polar } from './perUnit.ts';

const t750 = { rating: 750e3, primary: 4160, secondary: 480, impedance: 5.75, xr: 5 };

describe('transformerCalculation', () => {
  it('has the expected defaults', () => {
    // Three-phase, infinite source, nameplate %Z: the secondary fault is the infinite-bus value.
    const r = transformerCalculation({ rating: 1.5e6, primary: 12470, secondary: 480, impedance: 5.75 });
    expect(r.faultAmps.secondary).toBe(r.faultAmps.infiniteBus);
    expect(r.perUnit.source).toBe(0);
    expect(r.xr).toBe(Infinity);
  });

  it('1500 kVA 480 V 5.75 %Z infinite source: 1804.22 A, 31 377.7 A; 33 921.9 A at −7.5 %, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const r = transformerCalculation({ rating: 1.5e6, primary: 12470, secondary: 480, impedance: 5.75 });
    assertInDelta(r.fullLoadAmps.secondary, 1804.22, 1e-6);
    assertInDelta(r.faultAmps.infiniteBus, 31377.7, 1e-5);
    const t = transformerCalculation({
      rating: 1.5e6,
      primary: 12470,
      secondary: 480,
      impedance: 5.75,
      impedanceTolerance: true,
    });
    assertInDelta(t.faultAmps.infiniteBus, 33921.9, 1e-5);
  });

  it('750 kVA with a 250 MVA X/R 15 source: 14 916.9 A, 1721.18 A at 4.16 kV, X/R 5.174, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const r = transformerCalculation({ ...t750, source: { va: 250e6 }, sourceXr: 15 });
    assertInDelta(r.fullLoadAmps.secondary, 902.11, 1e-5);
    assertInDelta(r.fullLoadAmps.primary, 104.09, 1e-5);
    assertInDelta(r.faultAmps.infiniteBus, 15688.9, 1e-5);
    assertInDelta(r.faultAmps.secondary, 14916.9, 1e-5);
    assertInDelta(r.faultAmps.reflectedToPrimary, 1721.18, 1e-5);
    assertInDelta(r.perUnit.total, 0.06047563, 1e-6);
    assertInDelta(r.xr, 5.174, 1e-3);
  });

  it('112.5 kVA 480–208 V 3.5 %Z: 8921.97 A, 3866.18 A reflected, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const r = transformerCalculation({ rating: 112.5e3, primary: 480, secondary: 208, impedance: 3.5 });
    assertInDelta(r.fullLoadAmps.secondary, 312.269, 1e-5);
    assertInDelta(r.fullLoadAmps.primary, 135.316, 1e-5);
    assertInDelta(r.faultAmps.secondary, 8921.97, 1e-5);
    assertInDelta(r.faultAmps.reflectedToPrimary, 3866.18, 1e-5);
  });

  it('demo 1500 kVA, 250 MVA X/R 12 given as 11 574.8 A: 28 421.1 A and 1093.99 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const base = { rating: 1.5e6, primary: 12470, secondary: 480, impedance: 5.75, xr: 6, sourceXr: 12 };
    const byMva = transformerCalculation({ ...base, source: { va: 250e6 } });
    const byAmps = transformerCalculation({ ...base, source: { amps: 11574.8 } });
    assertInDelta(byMva.faultAmps.secondary, 28421.1, 1e-5);
    assertInDelta(byAmps.faultAmps.secondary, 28421.1, 1e-5);
    assertInDelta(byMva.faultAmps.reflectedToPrimary, 1093.99, 1e-5);
    assertInDelta(byMva.xr, 6.3, 1e-3);
    expect(byAmps.work.some((s) => s.formula === 'S_sc = √3 · V_pri · I_sc')).toBe(true);
  });

  it('single-phase: FLA = S / V and infinite bus = FLA / Z_pu (textbook identities, IEEE 141)', () => {
    const r = transformerCalculation({ rating: 50e3, primary: 7200, secondary: 240, impedance: 2, phases: 1 });
    assertInDelta(r.fullLoadAmps.secondary, 208.333, 1e-5);
    assertInDelta(r.faultAmps.infiniteBus, 10416.7, 1e-5);
    const finite = transformerCalculation({
      rating: 50e3,
      primary: 7200,
      secondary: 240,
      impedance: 2,
      phases: 1,
      source: { va: 100e6 },
    });
    assertInDelta(finite.perUnit.source, 0.001, 1e-12); // 2 · S_T / S_sc (computed)
  });

  it('the work lists each formula with its numbers and ends at the reflected value', () => {
    const r = transformerCalculation({ ...t750, source: { va: 250e6 }, sourceXr: 15 });
    expect(r.work.at(-1)!.value).toBe(r.faultAmps.reflectedToPrimary);
    expect(r.work.at(-1)!.substituted).toBe('I_pri = 14916.9 A × 480 V / 4160 V');
  });

  it('a weaker source never raises the secondary fault (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 2000, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (mva, f) => {
          const strong = transformerCalculation({ ...t750, source: { va: mva * 1e6 }, sourceXr: 15 });
          const weak = transformerCalculation({ ...t750, source: { va: mva * 1e6 * f }, sourceXr: 15 });
          return weak.faultAmps.secondary <= strong.faultAmps.secondary * (1 + 1e-12);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('single-phase 50 kVA 2.1 %Z X/R 2, 250 MVA X/R 12: L-N half-winding fault by 1.5 × R and 1.2 × X (common practice), per-unit hand solution', () => {
    // Per unit on 50 kVA: source loop Z1 + Z2 = 2 · S_T / S_sc across two lines, 3 · S_T / S_sc line to
    // neutral with Z0 = Z1 (symmetrical components, IEEE 399); the half winding keeps the source per unit on the 120 V base.
    const zs = polar(2 * (50e3 / 250e6), 12);
    const zt = polar(0.021, 2);
    const base = { rating: 50e3, primary: 12470, secondary: 240, impedance: 2.1, xr: 2, phases: 1 as const };
    const r = transformerCalculation({ ...base, source: { va: 250e6 }, sourceXr: 12 });
    assertInDelta(r.faultAmps.secondary, 50e3 / 240 / abs(add(zs, zt)), 1e-9);
    assertInDelta(r.faultAmps.lineToNeutral!, 50e3 / 120 / abs(add(zs, [1.5 * zt[0], 1.2 * zt[1]])), 1e-9);
    const ln = transformerCalculation({
      ...base,
      primary: 7200,
      primaryConnection: 'line-to-neutral',
      source: { va: 250e6 },
      sourceXr: 12,
    });
    assertInDelta(ln.faultAmps.secondary, 50e3 / 240 / abs(add(polar(3 * (50e3 / 250e6), 12), zt)), 1e-9);
    expect(transformerCalculation({ ...base, centreTapped: false }).faultAmps.lineToNeutral).toBeUndefined();
  });
});
