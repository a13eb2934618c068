import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  faultLevelsOf,
  MAXIMUM_FAULT_TEMPERATURE,
  MINIMUM_FAULT_TEMPERATURE,
  motorFullLoadAmps,
} from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { case72Input, study } from './studies.ts';

const levelsOf = (input: StudyInput) => faultLevelsOf(networkOf(study(input)));
const demoText = readFileSync('demo/harrowmere-selective.json', 'utf8');

describe('faultLevelsOf', () => {
  it('has the expected defaults', () => {
    // Minimum fault: conductors at operating temperature (common practice; NEC Ch. 9 Table 8 coefficients); min source defaults to max.
    expect(MINIMUM_FAULT_TEMPERATURE).toBe(90);
    // Maximum fault: conductors at 20 °C, as IEC 60909-0:2016 takes them for the maximum short-circuit currents.
    expect(MAXIMUM_FAULT_TEMPERATURE).toBe(20);
    const levels = levelsOf(case72Input());
    const lv = levels.buses.get('LV')!;
    assertInDelta(lv.min.threePhase, lv.max.threePhase, 1e-12); // no cable, no motors, same source
    expect(levels.diagnostics).toEqual([]);
  });

  it('750 kVA secondary fault is 14 916.9 A, X/R 5.174, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const lv = levelsOf(case72Input()).buses.get('LV')!;
    assertInDelta(lv.max.threePhase, 14916.9, 1e-5);
    assertInDelta(lv.max.xr, 5.174, 1e-3);
    assertInDelta(lv.max.lineToLine, 0.8660254 * 14916.9, 1e-5);
    const at416 = lv.reflected.find((r) => r.volts === 4160)!;
    assertInDelta(at416.maxAmps, 1721.18, 1e-5);
  });

  it('the panel after 100 ft of 2 × 500 kcmil is 13 088.8 A, X/R 4.375, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    // The cable, NEC Chapter 9 Table 9 (steel conduit): R 0.029 and X 0.048 Ω/1000 ft at 75 °C, so for
    // 100 ft of 2 sets 0.00145 + j0.0024 Ω; for the maximum fault at 20 °C (IEC 60909-0) R is
    // 0.00145 × (234.5 + 20) / (234.5 + 75) = 0.0011923 Ω. Added to the secondary's 0.0035255 + j0.0182405 Ω:
    // Z = 0.0047178 + j0.0206405 Ω, |Z| = 0.0211729 Ω, I = 480 / (√3 × 0.0211729) = 13 088.8 A.
    const pnl = levelsOf(case72Input()).buses.get('PNL')!;
    assertInDelta(pnl.max.threePhase, 13088.8, 1e-5);
    assertInDelta(pnl.max.xr, 4.375, 1e-3);
    assertInDelta(pnl.max.impedance.r, 0.0047178, 1e-4);
    assertInDelta(pnl.max.impedance.x, 0.0206405, 1e-5);
    // At 75 °C, as Table 9 states it, the panel would read 13 052.5 A: 0.3 % less.
    const corrected = pnl.work.find((step) => /maximum: C resistance at 20 °C/.test(step.label))!;
    expect(corrected.source).toMatch(/IEC 60909-0 takes line resistance at 20 °C/);
    expect(pnl.work.find((step) => /minimum: C resistance at 90 °C/.test(step.label))!.source).toMatch(
      /operating temperature, common practice/,
    );
  });

  it("takes a study's own conductor temperatures: the panel at 75 °C maximum is 13 052.5 A, at 150 °C minimum 13 000.5 A, hand calculation", () => {
    // The same panel, NEC Chapter 9 Table 9 (Table 8 note coefficients): at 75 °C, Table 9's own temperature,
    // R = 0.00145 Ω, Z = 0.0049755 + j0.0206405 Ω, |Z| = 0.0212317 Ω, I = 480 / (√3 × 0.0212317) = 13 052.5 A.
    // At 150 °C (a conductor at the end of a fault, IEC 60909-0:2016 for the minimum currents) R = 0.00145 ×
    // (234.5 + 150) / 309.5 = 0.0018014 Ω, Z = 0.0053269 + j0.0206405 Ω, |Z| = 0.0213168 Ω, I = 13 000.5 A.
    const input = { ...case72Input(), conductorTemperatures: { maximumFault: 75, minimumFault: 150 } };
    const pnl = levelsOf(input).buses.get('PNL')!;
    assertInDelta(pnl.max.threePhase, 13052.5, 1e-5);
    assertInDelta(pnl.min.threePhase, 13000.5, 1e-5);
    // At Table 9's own 75 °C there is nothing to correct; the minimum's step names the study's setting.
    expect(pnl.work.some((step) => /maximum: C resistance at/.test(step.label))).toBe(false);
    expect(pnl.work.find((step) => /minimum: C resistance at 150 °C/.test(step.label))!.source).toMatch(
      /the study's conductor temperature \(conductorTemperatures.minimumFault\)/,
    );
  });

  it('utility alone at the 4.16 kV bus is 34 696.5 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    assertInDelta(levelsOf(case72Input()).buses.get('MV')!.max.threePhase, 34696.5, 1e-5);
  });

  it('minimum uses the weaker source and R at 90 °C, so it is lower', () => {
    const input = case72Input();
    input.source = {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '250 MVA', xr: 15 },
      min: { available: '100 MVA', xr: 10 },
    };
    const pnl = levelsOf(input).buses.get('PNL')!;
    expect(pnl.min.threePhase).toBeLessThan(pnl.max.threePhase);
    expect(pnl.work.some((s) => /resistance at 90 °C/.test(s.label))).toBe(true);
  });

  it('motors add 4 × 451 A ≈ 1804 A first-cycle at the 750 kVA secondary, IEEE 141 / IEEE 399 per-unit method, hand calculation, ±3 % for phase angle', () => {
    const input = case72Input();
    input.motors = [{ id: 'M', bus: 'LV', fullLoadAmps: 451 }];
    const lv = levelsOf(input).buses.get('LV')!;
    expect(Math.abs(lv.max.motorAmps - 1804) / 1804).toBeLessThan(0.03);
    expect(lv.min.motorAmps).toBe(0);
    assertInDelta(lv.min.threePhase, 14916.9, 1e-5);
  });

  it('the worked calculation gives motors worked out alike one contribution step, "each", and counts a long list of ids', () => {
    // Twelve 20 hp motors and one 50 hp at the 750 kVA secondary: as a hand calculation writes it,
    // 4 × I_FL once for the twelve alike (NEC Table 430.250 at 460 V for a 480 V system: 27 A and 65 A).
    const input = case72Input();
    input.motors = [
      ...Array.from({ length: 12 }, (_, i) => ({ id: `M${i + 1}`, bus: 'LV', hp: 20 })),
      { id: 'BIG', bus: 'LV', hp: 50 },
    ];
    const lv = levelsOf(input).buses.get('LV')!;
    const contributions = lv.work.filter((s) => /first-cycle contribution/.test(s.label));
    expect(contributions.map((s) => s.label)).toEqual([
      'maximum: M1, M2, M3, M4, M5, M6, M7, M8 and 4 more (12 motors of 20 hp) first-cycle contribution at 480 V, each',
      'maximum: BIG (50 hp) first-cycle contribution at 480 V',
    ]);
    expect(contributions.map((s) => s.value)).toEqual([4 * 27, 4 * 65]);
    const reduced = lv.work.find((s) => /motor branches at and below the bus/.test(s.label))!;
    expect(reduced.label).toBe(
      'maximum: motor branches at and below the bus (M1, M2, M3, M4, M5, M6, M7, M8 and 5 more), reduced',
    );
    // The grouping changes the text alone: all 13 motors still feed the fault, 12 × 108 A + 260 A at the
    // terminals (±3 % for phase angle, as for the single motor above).
    expect(Math.abs(lv.max.motorAmps - 1556) / 1556).toBeLessThan(0.03);
  });

  it('the demo study: 28 421 A at the 1500 kVA secondary before motors, IEEE 141 / IEEE 399 per-unit method, hand calculation; motors add less than 4 × their FLA', () => {
    const study = parseStudy(demoText);
    const demo = faultLevelsOf(networkOf(study));
    const swbd = demo.buses.get('SWBD')!;
    const t1 = demo.transformers.get('T1')!;
    assertInDelta(swbd.max.threePhase - swbd.max.motorAmps, 28421.1, 1e-5);
    assertInDelta(t1.reflectedToPrimary, 1093.99, 1e-5);
    // Every demo motor sits below SWBD behind cable, so the first-cycle addition is positive but below Σ 4 × FLA.
    const terminalSum = study.motors.reduce((sum, m) => sum + 4 * motorFullLoadAmps(m, 480), 0);
    expect(swbd.max.motorAmps).toBeGreaterThan(0);
    expect(swbd.max.motorAmps).toBeLessThan(terminalSum);
    // MV bus: utility alone 11 574.8 A (IEEE 141 / IEEE 399 per-unit method, hand calculation) plus the motors seen through T1; minimum is 150 MVA alone.
    const mv = demo.buses.get('MV')!;
    assertInDelta(mv.min.threePhase, (12470 / Math.sqrt(3)) * (150e6 / 12470 ** 2), 1e-9);
    expect(mv.max.threePhase).toBeGreaterThan(11574.8);
    assertInDelta(mv.max.threePhase - mv.max.motorAmps, 11574.8, 1e-5);
  });

  it('line-to-ground falls below three-phase after a cable (Z0 = 3 · Z1) and is 0 below a delta-delta transformer', () => {
    const input = case72Input();
    const levels = levelsOf(input);
    expect(levels.buses.get('PNL')!.max.lineToGround).toBeLessThan(levels.buses.get('PNL')!.max.threePhase);
    input.transformers![0].connection = 'delta-delta';
    const delta = levelsOf(input);
    expect(delta.buses.get('LV')!.max.lineToGround).toBe(0);
    expect(delta.buses.get('PNL')!.min.lineToGround).toBe(0);
    expect(delta.buses.get('PNL')!.max.lineToGroundXr).toBeNaN();
    expect(delta.buses.get('PNL')!.work.some((s) => /ungrounded/.test(s.label))).toBe(true);
  });

  it('an infinite source gives an unbounded fault at its bus and says so', () => {
    const input = case72Input();
    input.source = { kind: 'infinite', id: 'U', bus: 'MV' };
    const levels = levelsOf(input);
    expect(levels.buses.get('MV')!.max.threePhase).toBe(Infinity);
    assertInDelta(levels.buses.get('LV')!.max.threePhase, 15688.9, 1e-5); // infinite bus, IEEE 141 / IEEE 399 per-unit method, hand calculation
    expect(levels.diagnostics[0]).toMatch(/^U: infinite source/);
  });

  it('the work ends at the number it reports', () => {
    const pnl = levelsOf(case72Input()).buses.get('PNL')!;
    const step = pnl.work.find((s) => s.label === 'maximum: three-phase bolted fault')!;
    expect(step.value).toBe(pnl.max.threePhase);
    expect(step.substituted).toMatch(/^I_3φ = 480 V \/ \(1\.7320508 × 0\.021172\d* Ω\)/);
  });

  it('fault current never rises as cable length, %Z or source weakening is added (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.double({ min: 0, max: 4, noNaN: true }),
        fc.double({ min: 20, max: 1000, noNaN: true }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        (feet, extraFeet, pct, extraPct, mva, weaken) => {
          const make = (l: number, z: number, s: number) => {
            const input = case72Input();
            input.source = { kind: 'utility', id: 'U', bus: 'MV', max: { available: s, xr: 15 } };
            input.transformers![0].impedance = z;
            input.cables![0].length = l;
            input.motors = [{ id: 'M', bus: 'PNL', fullLoadAmps: 200 }];
            return levelsOf(input).buses.get('PNL')!.max.threePhase;
          };
          const base = make(feet, pct, mva);
          return (
            make(feet + extraFeet, pct, mva) <= base * (1 + 1e-12) &&
            make(feet, pct + extraPct, mva) <= base * (1 + 1e-12) &&
            make(feet, pct, mva * weaken) <= base * (1 + 1e-12)
          );
        },
      ),
      { numRuns: 100 },
    );
  });

  it('results do not depend on the order of buses, cables and motors (property)', () => {
    const raw = JSON.parse(demoText) as StudyInput;
    const reference = faultLevelsOf(networkOf(parseStudy(raw)));
    fc.assert(
      fc.property(
        fc.shuffledSubarray(raw.buses, { minLength: raw.buses.length }),
        fc.shuffledSubarray(raw.cables!, { minLength: raw.cables!.length }),
        fc.shuffledSubarray(raw.motors!, { minLength: raw.motors!.length }),
        fc.shuffledSubarray(raw.transformers!, { minLength: raw.transformers!.length }),
        (buses, cables, motors, transformers) => {
          const shuffled = faultLevelsOf(networkOf(parseStudy({ ...raw, buses, cables, motors, transformers })));
          for (const [id, bus] of reference.buses) {
            const other = shuffled.buses.get(id)!;
            assertInDelta(other.max.threePhase, bus.max.threePhase, 1e-9);
            assertInDelta(other.min.threePhase, bus.min.threePhase, 1e-9);
            assertInDelta(other.max.motorAmps, bus.max.motorAmps, 1e-6);
          }
          for (const [id, t] of reference.transformers)
            assertInDelta(shuffled.transformers.get(id)!.reflectedToPrimary, t.reflectedToPrimary, 1e-9);
        },
      ),
      { numRuns: 50 },
    );
  });
});
