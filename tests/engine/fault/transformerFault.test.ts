import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { faultLevelsOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { deltaWyeInput, singlePhaseInput } from './sequenceReference.ts';
import { case72Input, study } from './studies.ts';

const demo = faultLevelsOf(networkOf(parseStudy(readFileSync('demo/harrowmere-selective.json', 'utf8'))));

describe('transformerFaultOf', () => {
  it('has the expected defaults', () => {
    // No impedanceTolerance in the study: the infinite-bus value uses nameplate %Z (1804.22 A / 0.0575 = 31 377.7 A, IEEE 141 infinite-bus identity).
    assertInDelta(demo.transformers.get('T1')!.infiniteBusAmps, 31377.7, 1e-5);
  });

  it('demo 1500 kVA: FLA 1804.22 / 69.449 A, through-fault 1093.99 A at 12.47 kV, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const t1 = demo.transformers.get('T1')!;
    assertInDelta(t1.fullLoadAmps.secondary, 1804.22, 1e-6);
    assertInDelta(t1.fullLoadAmps.primary, 69.449, 1e-5);
    assertInDelta(t1.reflectedToPrimary, 1093.99, 1e-5);
    assertInDelta(t1.unbalanced.lineToLine.secondaryAmps, 24613.4, 1e-5);
    assertInDelta(t1.unbalanced.lineToLine.primaryLineAmps[0], 1093.99, 1e-5);
    assertInDelta(t1.sourceImpedancePu, 0.006, 1e-9); // 1.5 MVA / 250 MVA
    expect(t1.secondaryAmps).toBe(demo.buses.get('SWBD')!.max.threePhase);
    expect(t1.factors.withstandShift).toBe(1 / Math.sqrt(3)); // IEEE C37.91 0.58, exact
  });

  it('a secondary L-G fault on a Δ–Yg unit: the winding carries I_LG, two primary lines I_LG · (V_s/V_p) / √3 (symmetrical components, IEEE 399)', () => {
    const levels = faultLevelsOf(networkOf(study(deltaWyeInput())));
    const t = levels.transformers.get('T')!;
    const lg = levels.buses.get('LV')!.max.lineToGround;
    assertInDelta(t.unbalanced.lineToGround.secondaryAmps, lg, 1e-9);
    const line = (lg * 480) / 12470 / Math.sqrt(3);
    assertInDelta(t.unbalanced.lineToGround.primaryLineAmps[0], line, 1e-9);
    expect(t.unbalanced.lineToGround.primaryLineAmps.filter((a) => a > 1e-6 * line)).toHaveLength(2);
    // A Yg–Yg unit passes the zero sequence: one primary line carries I_LG · V_s / V_p.
    const input = deltaWyeInput();
    input.transformers![0].connection = 'wye-wye';
    const yy = faultLevelsOf(networkOf(study(input)));
    const lgYY = yy.buses.get('LV')!.max.lineToGround;
    assertInDelta(
      Math.max(...yy.transformers.get('T')!.unbalanced.lineToGround.primaryLineAmps),
      (lgYY * 480) / 12470,
      1e-9,
    );
  });

  it('a single-phase unit across two lines: the through-fault reflects by V_s / V_p into two primary lines', () => {
    const levels = faultLevelsOf(networkOf(study(singlePhaseInput())));
    const t = levels.transformers.get('T1P')!;
    const full = levels.buses.get('S')!.max.lineToLine;
    assertInDelta(t.reflectedToPrimary, (full * 240) / 12470, 1e-9);
    expect(t.unbalanced.lineToLine.primaryLineAmps).toEqual([t.reflectedToPrimary, t.reflectedToPrimary, 0]);
    assertInDelta(t.fullLoadAmps.secondary, 50e3 / 240, 1e-12);
  });

  it('112.5 kVA 480–208Y/120 3.5 %Z: FLA 312.269 / 135.316 A and infinite bus 8921.97 A, IEEE 141 / IEEE 399 per-unit method, hand calculation', () => {
    const t2 = demo.transformers.get('T2')!;
    assertInDelta(t2.fullLoadAmps.secondary, 312.269, 1e-5);
    assertInDelta(t2.fullLoadAmps.primary, 135.316, 1e-5);
    assertInDelta(t2.infiniteBusAmps, 8921.97, 1e-5);
    expect(t2.secondaryAmps).toBeLessThan(t2.infiniteBusAmps);
  });

  it('impedanceTolerance raises the maximum duty: 15 688.9 → 16 961.0 A infinite bus for 750 kVA (computed)', () => {
    const input = case72Input();
    input.transformers![0].impedanceTolerance = true;
    const levels = faultLevelsOf(networkOf(study(input)));
    assertInDelta(levels.transformers.get('T')!.infiniteBusAmps, 15688.9 / 0.925, 1e-5);
    expect(levels.buses.get('LV')!.max.threePhase).toBeGreaterThan(14916.9);
    assertInDelta(levels.buses.get('LV')!.min.threePhase, 14916.9, 1e-5); // minimum keeps nameplate %Z
  });

  it('the work shows each step with its source', () => {
    const t1 = demo.transformers.get('T1')!;
    expect(t1.work.map((s) => s.label)).toContain('T1 through-fault reflected to the primary');
    expect(t1.work.every((s) => s.source)).toBe(true);
  });
});
