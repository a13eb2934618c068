import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { viewInputOf } from '../../../src/plot/viewInput.ts';
import { assertInDelta } from '../../asserts.ts';
import { abs, add, baseAmps3, baseOhms, polar, scale } from '../fault/perUnit.ts';
import { deltaWyeInput } from '../fault/sequenceReference.ts';

/** The Δ–Yg reference unit with a primary relay: CT 100:5, definite time, pickup 5 A (100 A), 0.5 s (invented). */
function protectedUnit(): StudyInput {
  return {
    ...deltaWyeInput(),
    devices: [
      {
        id: 'R',
        feeds: 'T',
        characteristic: {
          kind: 'relay',
          ct: '100:5',
          timeOvercurrent: { curve: 'definite-time', pickup: 5, delay: 0.5 },
        },
      },
    ],
  };
}

// Per unit on 1500 kVA (IEEE 141 / IEEE 399); secondary L-G by symmetrical components (IEEE 399),
// Z0 = Z_T behind the delta; two primary lines carry I_LG · (480 / 12 470) / √3 (IEEE C37.91 0.58 factor).
const S = 1.5e6;
const z1 = add(polar(S / 250e6, 12), polar(0.0575, 6));
const zt = polar(0.0575, 6);

describe('transformerFindings', () => {
  it('checks the secondary line-to-ground case up to the primary line current the sequence networks give, curve × 1/√3', () => {
    const findings = analyseStudy(parseStudy(protectedUnit())).findings.filter(
      (f) => f.kind === 'transformer-withstand' && f.id.includes('secondary line-to-ground'),
    );
    expect(findings.length).toBeGreaterThan(0);
    const lg = (3 * baseAmps3(S, 480)) / abs(add(z1, z1, zt));
    const top = Math.max(...findings.map((f) => f.range!.toAmps));
    assertInDelta(top, (lg * 480) / 12470 / Math.sqrt(3), 1e-9);
    expect(findings[0].title).toMatch(/curve × 0\.577\)$/);
  });

  it('a 1.2 Ω resistance-grounded secondary brings the line-to-ground case below the curve: no such finding', () => {
    const input = protectedUnit();
    input.transformers![0].grounding = { kind: 'resistance', ohms: 1.2 };
    const analysis = analyseStudy(parseStudy(input));
    const lg = (3 * baseAmps3(S, 480)) / abs(add(z1, z1, zt, scale([1.2 / baseOhms(S, 480), 0], 3)));
    assertInDelta(analysis.faults.buses.get('LV')!.max.lineToGround, lg, 1e-9);
    expect(analysis.findings.some((f) => f.id.includes('secondary line-to-ground'))).toBe(false);
  });

  it('a source too weak to drive a through-fault onto the curve gives a note, not a refused study, and no curve on the sheet', () => {
    // A 10 MVA, 7 % unit (Category III, IEEE C57.109) on a 15 MVA source: Z_S = 10/15 pu on the unit's base,
    // I_max = 1/(0.07 + 0.667) = 1.36 pu, below the 2 pu where the liquid-immersed curve starts.
    const input = protectedUnit();
    input.source = { kind: 'utility', id: 'U', bus: 'MV', max: { available: '15 MVA', xr: 12 } };
    Object.assign(input.transformers![0], { rating: '10 MVA', impedance: '7 %' });
    input.views = [
      { id: 'unit', title: 'Primary relay and unit', referenceVoltage: 480, devices: ['R'], withstand: ['T'] },
    ];
    const analysis = analyseStudy(parseStudy(input));
    const notes = analysis.findings.filter((f) => f.kind === 'transformer-withstand');
    expect(notes.map((f) => [f.severity, f.id])).toEqual([['info', 'transformer-withstand:T:weak-source']]);
    expect(notes[0].explanation).toMatch(/at most 1\.36 times its rated current .* below the 2 times rated current/);
    expect(viewInputOf(analysis, 'unit').withstand).toEqual([]);
  });
});
