import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { faultLevelsOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { abs, add, baseAmps3, baseOhms, div, par, polar, scale, type C } from './perUnit.ts';
import { deltaWyeInput, singlePhaseInput } from './sequenceReference.ts';

// Reference solutions worked by hand in per unit on the transformer's base (IEEE 141 / IEEE 399 per-unit
// method) with symmetrical components (IEEE 399 short-circuit chapter): I_3φ = 1/|Z1|,
// I_LL = √3/|Z1 + Z2|, I_LG = 3/|Z1 + Z2 + Z0| (pu of base current), Z2 = Z1. Required: within 0.5 %;
// checked here to 1e-6, since the hand solution and the engine take the same data.

const levelsOf = (input: StudyInput) => faultLevelsOf(networkOf(parseStudy(input)));
const TOL = 1e-6;

describe('sequence-network reference: 1500 kVA Δ–Yg 12.47 kV–480 V, 250 MVA X/R 12 source', () => {
  const S = 1.5e6;
  const ib = baseAmps3(S, 480);
  const zs = polar(S / 250e6, 12); // utility: S_base / S_sc
  const zt = polar(0.0575, 6);
  const z1 = add(zs, zt);
  // 100 ft of 2 × 500 kcmil Cu in steel: NFPA 70 Ch. 9 Table 9, R 0.029 and X 0.048 Ω/1000 ft at 75 °C.
  const zc75: C = scale([0.029 * 0.1, 0.048 * 0.1], 1 / 2 / baseOhms(S, 480));
  // The maximum fault takes R at 20 °C (IEC 60909-0) by Table 8's copper coefficient.
  const zc: C = [zc75[0] * ((234.5 + 20) / (234.5 + 75)), zc75[1]];

  it('at the secondary: 3φ, L-L and L-G (the delta traps the source Z0, so Z0 = Z_T, common practice)', () => {
    const lv = levelsOf(deltaWyeInput()).buses.get('LV')!;
    assertInDelta(lv.max.threePhase, ib / abs(z1), TOL);
    assertInDelta(lv.max.lineToLine, (Math.sqrt(3) * ib) / abs(scale(z1, 2)), TOL);
    assertInDelta(lv.max.lineToGround, (3 * ib) / abs(add(z1, z1, zt)), TOL);
    assertInDelta(lv.max.lineToGroundXr, (2 * z1[1] + zt[1]) / (2 * z1[0] + zt[0]), TOL);
    // Z0 below Z1 here: the bolted L-G exceeds 3φ at the terminals of a Δ–Yg unit on a stiff source.
    expect(lv.max.lineToGround).toBeGreaterThan(lv.max.threePhase);
    assertInDelta(lv.max.largest, lv.max.lineToGround, 0);
  });

  it('after 100 ft of cable, with Z0 = 3 · Z1 for the cable (common practice) or with R0/X0 entered', () => {
    const pnl = levelsOf(deltaWyeInput()).buses.get('PNL')!;
    const z1p = add(z1, zc);
    assertInDelta(pnl.max.threePhase, ib / abs(z1p), TOL);
    assertInDelta(pnl.max.lineToGround, (3 * ib) / abs(add(z1p, z1p, zt, scale(zc, 3))), TOL);
    expect(pnl.max.lineToGround).toBeLessThan(pnl.max.threePhase);

    const input = deltaWyeInput();
    input.cables![0].zeroSequence = { resistance: 0.18, reactance: 0.11 }; // Ω/1000 ft, invented cable data
    const entered = levelsOf(input).buses.get('PNL')!;
    const zc0: C = scale([0.18 * 0.1, 0.11 * 0.1], 1 / 2 / baseOhms(S, 480));
    assertInDelta(entered.max.lineToGround, (3 * ib) / abs(add(z1p, z1p, zt, zc0)), TOL);
  });

  it('minimum: cable R at 90 °C (NEC Ch. 9 Table 8 coefficients), same source, no tolerance', () => {
    const pnl = levelsOf(deltaWyeInput()).buses.get('PNL')!;
    const hot: C = [zc75[0] * ((234.5 + 90) / (234.5 + 75)), zc75[1]];
    const z1p = add(z1, hot);
    assertInDelta(pnl.min.threePhase, ib / abs(z1p), TOL);
    assertInDelta(pnl.min.lineToGround, (3 * ib) / abs(add(z1p, z1p, zt, scale(hot, 3))), TOL);
  });

  it('at the 12.47 kV bus: a source with no zero-sequence data is solidly grounded with Z0 = Z1, so I_LG = I_3φ', () => {
    const mv = levelsOf(deltaWyeInput()).buses.get('MV')!;
    assertInDelta(mv.max.lineToGround, 250e6 / (Math.sqrt(3) * 12470), TOL);
    assertInDelta(mv.max.threePhase, 250e6 / (Math.sqrt(3) * 12470), TOL);
  });

  it('a source line-to-ground level sets Z0 (|2·Z1 + Z0| = √3·V / I_LG): that level comes back at the source bus', () => {
    const input = deltaWyeInput();
    input.source = { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12, lineToGround: '8 kA' } };
    assertInDelta(levelsOf(input).buses.get('MV')!.max.lineToGround, 8000, TOL);
    input.source.max.lineToGround = '20 kA'; // above 1.5 × 11.6 kA: no positive Z0 gives it
    expect(() => levelsOf(input)).toThrow(
      /study\.source\.max\.lineToGround: expected a line-to-ground level at most 1\.5 times/,
    );
  });

  it('a source line-to-ground level through a 6 Ω neutral resistor at 4.16 kV (400 A) comes back as 400 A at the source bus', () => {
    const input = deltaWyeInput();
    input.buses![0].voltage = '4.16 kV';
    input.transformers![0].primary = '4.16 kV';
    input.source = {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '12 kA', xr: 10, lineToGround: '400 A' },
      grounding: { kind: 'resistance', ohms: 6 },
    };
    assertInDelta(levelsOf(input).buses.get('MV')!.max.lineToGround, 400, TOL);
  });

  it('Yg–Yg passes the source zero sequence through: X0/X1 = R0/R1 = 3 at the source', () => {
    const input = deltaWyeInput();
    input.transformers![0].connection = 'wye-wye';
    input.source = { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12, x0x1: 3, r0r1: 3 } };
    const lv = levelsOf(input).buses.get('LV')!;
    assertInDelta(lv.max.lineToGround, (3 * ib) / abs(add(z1, z1, scale(zs, 3), zt)), TOL);
  });

  it('a minimum source without ratios keeps the maximum’s X0/X1 and R0/R1', () => {
    const input = deltaWyeInput();
    input.transformers![0].connection = 'wye-wye';
    input.source = {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '250 MVA', xr: 12, x0x1: 3, r0r1: 3 },
      min: { available: '100 MVA', xr: 12 },
    };
    const zsMin = polar(S / 100e6, 12);
    const z1min = add(zsMin, zt);
    const lv = levelsOf(input).buses.get('LV')!;
    assertInDelta(lv.min.lineToGround, (3 * ib) / abs(add(z1min, z1min, scale(zsMin, 3), zt)), TOL);
  });

  it('a minimum source without an X/R takes the maximum’s: 100 MVA under 250 MVA X/R 12 is X/R 12 too', () => {
    const input = deltaWyeInput();
    input.source = {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '250 MVA', xr: 12 },
      min: { available: '100 MVA' },
    };
    const levels = levelsOf(input);
    assertInDelta(levels.buses.get('MV')!.min.xr, 12, TOL);
    // At the secondary: 1 / |Z_U,min + Z_T| with Z_U,min = 1.5 / 100 pu at X/R 12, not all reactance.
    assertInDelta(levels.buses.get('LV')!.min.threePhase, ib / abs(add(polar(S / 100e6, 12), zt)), TOL);
  });

  it('a minimum source without zero-sequence data keeps the Z0 the maximum’s line-to-ground level fixes, in ohms: 8 kA under 12 kA / 5 kA gives 4390.2 A', () => {
    // At 12.47 kV, X/R 10: |Z1,max| = 0.599948 Ω, |Z0| = √3 · 12 470 V / 5000 A − 2 × 0.599948 Ω = 3.119845 Ω;
    // |Z1,min| = 0.899922 Ω, so I_LG,min = √3 · 12 470 V / (2 × 0.899922 + 3.119845) Ω (hand calculation,
    // symmetrical components, IEEE 399 short-circuit chapter).
    const input = deltaWyeInput();
    input.transformers![0].connection = 'wye-wye';
    input.source = {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '12 kA', xr: 10, lineToGround: '5 kA' },
      min: { available: '8 kA', xr: 10 },
    };
    const levels = levelsOf(input);
    const v = 12470;
    const z1max = polar(v / (Math.sqrt(3) * 12000), 10);
    const z1min = polar(v / (Math.sqrt(3) * 8000), 10);
    const z0 = polar((Math.sqrt(3) * v) / 5000 - 2 * abs(z1max), 10);
    const mv = levels.buses.get('MV')!;
    assertInDelta(mv.max.lineToGround, 5000, TOL);
    assertInDelta(mv.min.lineToGround, (Math.sqrt(3) * v) / abs(add(z1min, z1min, z0)), TOL);
    assertInDelta(mv.min.lineToGround, 4390.24, 1e-6);
    // Through the Yg–Yg unit the kept Z0 reaches the panel: every minimum stays below its maximum.
    for (const bus of levels.buses.values()) expect(bus.min.lineToGround).toBeLessThan(bus.max.lineToGround);
  });

  it('a minimum line-to-ground fault never exceeds the maximum at the same bus (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2000, max: 40000, noNaN: true }),
        fc.double({ min: 0.1, max: 1.45, noNaN: true }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        fc.double({ min: 1, max: 30, noNaN: true }),
        (amps, groundShare, weaken, xr) => {
          const input = deltaWyeInput();
          input.transformers![0].connection = 'wye-wye';
          input.source = {
            kind: 'utility',
            id: 'U',
            bus: 'MV',
            max: { available: `${amps} A`, xr, lineToGround: `${amps * groundShare} A` },
            min: { available: `${amps * weaken} A` },
          };
          const levels = levelsOf(input);
          return [...levels.buses.values()].every((b) => b.min.lineToGround <= b.max.lineToGround * (1 + 1e-12));
        },
      ),
      { numRuns: 100 },
    );
  });

  it('a fault at the panel draws through the transformer only the source side’s share: a motor on the 480 V bus feeds it without passing the transformer', () => {
    // 451 A FLA at 4 × (common practice), X/R 6, on LV; 200 A FLA on the panel. Current division in the
    // positive-sequence network (IEEE 399 / IEEE 141: motors are parallel sources at their buses).
    const input = deltaWyeInput();
    input.motors = [
      { id: 'M1', bus: 'LV', fullLoadAmps: 451 },
      { id: 'M2', bus: 'PNL', fullLoadAmps: 200 },
    ];
    const levels = levelsOf(input);
    const motor = (fla: number) => polar(480 / (Math.sqrt(3) * 4 * fla) / baseOhms(S, 480), 6);
    const zm1 = motor(451);
    const toward = add(par(z1, zm1), zc); // M2 is at the fault: it feeds the bus, not the cable
    const arriving = ib / abs(toward);
    const throughT = arriving * abs(div(zm1, add(z1, zm1)));
    const pnl = levels.buses.get('PNL')!;
    assertInDelta(pnl.max.threePhase, ib / abs(par(toward, motor(200))), TOL);
    assertInDelta(pnl.reflected.find((r) => r.volts === 12470)!.maxAmps, (throughT * 480) / 12470, TOL);
    expect(pnl.reflected[0].maxAmps).toBeLessThan((pnl.max.threePhase * 480) / 12470);
    // At the secondary itself the figure is the transformer's own through-fault; the minimum has no motors.
    const lv = levels.buses.get('LV')!;
    assertInDelta(lv.reflected[0].maxAmps, levels.transformers.get('T')!.reflectedToPrimary, TOL);
    assertInDelta(lv.reflected[0].maxAmps, (ib / abs(z1)) * (480 / 12470), TOL);
    assertInDelta(pnl.reflected[0].minAmps, (pnl.min.threePhase * 480) / 12470, TOL);
  });

  it('a resistance-grounded secondary (1.2 Ω) limits L-G to about the resistor current: I = 3/|2·Z1 + Z_T + 3·R_n|', () => {
    const input = deltaWyeInput();
    input.transformers![0].grounding = { kind: 'resistance', ohms: 1.2 };
    const lv = levelsOf(input).buses.get('LV')!;
    const rn: C = [1.2 / baseOhms(S, 480), 0];
    assertInDelta(lv.max.lineToGround, (3 * ib) / abs(add(z1, z1, zt, scale(rn, 3))), TOL);
    expect(Math.abs(lv.max.lineToGround - 277.128 / 1.2) / (277.128 / 1.2)).toBeLessThan(0.01);
    input.transformers![0].grounding = { kind: 'reactance', ohms: 0.5 };
    const xn: C = [0, 0.5 / baseOhms(S, 480)];
    assertInDelta(
      levelsOf(input).buses.get('LV')!.max.lineToGround,
      (3 * ib) / abs(add(z1, z1, zt, scale(xn, 3))),
      TOL,
    );
    input.transformers![0].grounding = { kind: 'ungrounded' };
    expect(levelsOf(input).buses.get('PNL')!.max.lineToGround).toBe(0);
  });

  it('Δ–Δ and Y–Δ secondaries have no zero-sequence path', () => {
    for (const connection of ['delta-delta', 'wye-delta'] as const) {
      const input = deltaWyeInput();
      input.transformers![0].connection = connection;
      expect(levelsOf(input).buses.get('LV')!.max.lineToGround).toBe(0);
    }
  });

  it('the work writes every number with its unit', () => {
    const pnl = levelsOf(deltaWyeInput()).buses.get('PNL')!;
    const lg = pnl.work.find((s) => s.label === 'maximum: line-to-ground bolted fault')!;
    expect(lg.value).toBe(pnl.max.lineToGround);
    expect(lg.substituted).toMatch(/V \/ \|2 × \(.+\) Ω \+ \(.+\) Ω\|/);
    expect(pnl.work.some((s) => /C zero-sequence impedance/.test(s.label))).toBe(true);
  });
});

describe('sequence-network reference: 50 kVA single-phase 12.47 kV–120/240 V 2.1 %Z', () => {
  const S = 50e3;
  // Single-phase base currents S / V; per unit on the transformer's own base.
  const i240 = S / 240;
  const i120 = S / 120;
  const zs = polar(S / 250e6, 12); // one sequence impedance of the source on the 50 kVA base
  const zt = polar(0.021, 2);
  // Half winding at 120 V on the full kVA: 1.5 × R and 1.2 × X (common practice).
  const zh: C = [1.5 * zt[0], 1.2 * zt[1]];
  // 50 ft of 2/0 Cu in PVC: R 0.10, X 0.043 Ω/1000 ft (NFPA 70 Ch. 9 Table 9, R at 75 °C), loop of 2 × 50 ft;
  // the maximum fault takes R at 20 °C (IEC 60909-0) by Table 8's copper coefficient.
  const loop: C = [0.1 * 0.1 * ((234.5 + 20) / (234.5 + 75)), 0.043 * 0.1];

  it('across two lines: the loop sees Z1 + Z2 of the source; full-winding and half-winding faults', () => {
    const levels = levelsOf(singlePhaseInput());
    const s = levels.buses.get('S')!;
    expect(s.phases).toBe(1);
    expect(s.system).toBe('single-phase 120/240 V centre-tapped');
    assertInDelta(s.max.lineToLine, i240 / abs(add(scale(zs, 2), zt)), TOL);
    assertInDelta(s.max.threePhase, s.max.lineToLine, 0);
    // The source referred to the half winding keeps its per-unit value on the 120 V base.
    assertInDelta(s.max.lineToGround, i120 / abs(add(scale(zs, 2), zh)), TOL);
    // About 9.7 kA at 240 V (not the 5.6 kA a three-phase reading gives) and about 1.6 × that at 120 V.
    expect(s.max.lineToLine).toBeGreaterThan(9600);
    expect(s.max.lineToGround / s.max.lineToLine).toBeGreaterThan(1.5);
    // The full-winding fault reflects to the primary by 240 / 12 470.
    assertInDelta(s.reflected.find((r) => r.volts === 12470)!.maxAmps, (s.max.lineToLine * 240) / 12470, TOL);
  });

  it('after a two-wire cable loop (2 × length), both faults fall', () => {
    const p = levelsOf(singlePhaseInput()).buses.get('P')!;
    assertInDelta(p.max.lineToLine, i240 / abs(add(scale(zs, 2), zt, scale(loop, 1 / baseOhms(S, 240)))), TOL);
    assertInDelta(p.max.lineToGround, i120 / abs(add(scale(zs, 2), zh, scale(loop, 1 / baseOhms(S, 120)))), TOL);
  });

  it('primary line to neutral (7.2 kV winding on 12.47Y kV): the loop sees (Z1 + Z2 + Z0) / 3 at V_LN', () => {
    const input = singlePhaseInput();
    input.transformers![0].primary = '7200 V';
    const s = levelsOf(input).buses.get('S')!;
    // Source per-phase ohms Z1 = Z0 = 12 470² / 250 MVA; (2·Z1 + Z0)/3 = Z1, on the winding's voltage base,
    // the system line-to-neutral voltage 12 470/√3 (bases from nominal system voltages, IEEE 399 practice).
    const zsLoop = scale(polar(12470 ** 2 / 250e6, 12), 1 / baseOhms(S, 12470 / Math.sqrt(3)));
    assertInDelta(s.max.lineToLine, i240 / abs(add(zsLoop, zt)), TOL);
    // The primary line carries I · 240 / 7200 (within the 7200 V rating's rounding of 12 470/√3).
    assertInDelta(s.reflected.find((r) => r.volts === 12470)!.maxAmps, (s.max.lineToLine * 240) / 7200, 1e-4);
  });

  it('a two-wire 480 V secondary has one fault; an ungrounded one has no ground fault', () => {
    const input = singlePhaseInput();
    input.buses = [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'S', voltage: 480 },
      { id: 'P', voltage: 480 },
    ];
    input.transformers![0].secondary = '480 V';
    const s = levelsOf(input).buses.get('S')!;
    expect(s.system).toBe('single-phase 480 V two-wire');
    assertInDelta(s.max.lineToLine, S / 480 / abs(add(scale(zs, 2), zt)), TOL);
    assertInDelta(s.max.lineToGround, s.max.lineToLine, TOL);
    input.transformers![0].grounding = { kind: 'ungrounded' };
    expect(levelsOf(input).buses.get('S')!.max.lineToGround).toBe(0);
  });

  it('entered half-winding multipliers replace the common-practice 1.5 and 1.2', () => {
    const input = singlePhaseInput();
    input.transformers![0].halfWinding = { r: 2, x: 1.5 };
    const s = levelsOf(input).buses.get('S')!;
    assertInDelta(s.max.lineToGround, i120 / abs(add(scale(zs, 2), [2 * zt[0], 1.5 * zt[1]])), TOL);
  });
});
