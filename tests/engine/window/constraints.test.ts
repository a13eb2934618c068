import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { constraintsOf, trialOf } from '../../../src/engine/window/index.ts';
import { assertInDelta } from '../../asserts.ts';

/**
 * A 480 V switchboard with 30 kA available at X/R 10 and a moulded-case feeder breaker on it with the
 * interrupting rating given. Invented data.
 */
function feederStudy(interruptingRating: string): StudyInput {
  return {
    discern: 1,
    name: 'feeder on a 30 kA switchboard',
    source: { kind: 'utility', id: 'U', bus: 'SWBD', max: { available: '30 kA', xr: 10 } },
    buses: [
      { id: 'SWBD', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'SWBD', to: 'PNL', size: '500 kcmil', length: '50 ft' }],
    devices: [
      {
        id: 'FDR',
        feeds: 'C1',
        interruptingRating,
        characteristic: { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 4 } },
      },
    ],
  };
}

// UL 489 test power factor 20 % above 20 kA (from memory): (X/R)test = tan(acos(0.2)) = 4.898979. Peak ratio at X/R 10
// (IEEE 1015-2006): MF = (1 + e^(−π/10)) / (1 + e^(−π/4.898979)) = 1.133 39, duty 1.133 39 × 30 kA = 34.0 kA (computed).
const FACTOR = (1 + Math.exp(-Math.PI / 10)) / (1 + Math.exp(-Math.PI / Math.tan(Math.acos(0.2))));

const interrupting = (study: StudyInput) => {
  const trial = trialOf(parseStudy(study));
  const constraint = constraintsOf(trial, 'FDR').find((c) => c.id === 'interrupting')!;
  return { constraint, result: constraint.evaluate(trial) };
};
const check = (study: StudyInput) =>
  analyseStudy(parseStudy(study)).findings.find((f) => f.id === 'interrupting-duty:FDR')!;

describe('constraintsOf: interrupting duty', () => {
  it('has the expected defaults: the X/R multiplying factor of the rating basis, reported not set', () => {
    const { constraint } = interrupting(feederStudy('35 kA'));
    expect(constraint.favours).toBe('fixed');
    expect(constraint.label).toBe('interrupt 34 kA, the largest fault where it sits corrected for X/R');
    expect(constraint.source).toMatch(/^NFPA 70 110\.9; moulded-case breaker, UL 489 test circuit power factor 20 %/);
  });

  it('fails a 32 kA breaker on 30 kA symmetrical at X/R 10, as the NFPA 70 110.9 check does', () => {
    // 32 kA is above the 30 kA symmetrical current but below the 34.0 kA duty.
    const { result } = interrupting(feederStudy('32 kA'));
    expect(result.ok).toBe(false);
    assertInDelta(result.margin, 32_000 - FACTOR * 30_000, 1e-6);
    expect(result.text).toBe('rated 32 kA, duty 34 kA');
    expect(check(feederStudy('32 kA')).severity).toBe('fail');
  });

  it('passes a 35 kA breaker there, as the check does', () => {
    const { result } = interrupting(feederStudy('35 kA'));
    expect(result.ok).toBe(true);
    assertInDelta(result.margin, 35_000 - FACTOR * 30_000, 1e-6);
    expect(check(feederStudy('35 kA')).severity).toBe('ok');
  });

  it('reports an infinite source as unbounded, not met and not failed, as the check warns', () => {
    const study = { ...feederStudy('35 kA'), source: { kind: 'infinite', id: 'U', bus: 'SWBD' } } as StudyInput;
    const { result } = interrupting(study);
    expect(result).toMatchObject({ ok: true, clean: false, text: 'rated 35 kA; the fault here is unbounded' });
    expect(check(study).severity).toBe('warning');
  });

  it('reads the symmetrical fault for a device without an interrupting rating', () => {
    const study = feederStudy('35 kA');
    delete study.devices![0].interruptingRating;
    const { constraint, result } = interrupting(study);
    expect(constraint.label).toBe('interrupt 30 kA, the largest symmetrical fault where it sits');
    expect(result).toMatchObject({ ok: true, text: 'no interrupting rating given' });
  });
});
