import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';

/**
 * A 480 V bus where the utility gives 20 kA three-phase and 24 kA line to ground, a 4 AWG copper
 * cable from it protected by a 100 A breaker with a long-time element only. Invented settings.
 */
function cableStudy(): StudyInput {
  return {
    discern: 1,
    name: 'worked cable',
    source: { kind: 'utility', id: 'U', bus: 'A', max: { available: '20 kA', lineToGround: '24 kA' } },
    buses: [
      { id: 'A', voltage: 480 },
      { id: 'B', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'A', to: 'B', size: '4 AWG', length: '100 ft' }],
    devices: [
      { id: 'CB', feeds: 'C1', characteristic: { kind: 'trip-unit', sensor: 100, longTime: { pickup: 1, delay: 10 } } },
    ],
  };
}

describe('cableFindings', () => {
  it('checks the cable up to the largest fault at its supply end, a ground fault where that is larger', () => {
    // The faulted conductor carries the whole line-to-ground current (symmetrical components, IEEE Std
    // 399): 24 kA, not the 20 kA of a three-phase fault, is the top of the range (ICEA P-32-382).
    const findings = analyseStudy(parseStudy(cableStudy())).findings.filter((f) => f.kind === 'cable-withstand');
    expect(findings.length).toBeGreaterThan(0);
    expect(findings.map((f) => f.severity)).toContain('fail');
    assertInDelta(Math.max(...findings.map((f) => f.range!.toAmps)), 24_000, 1e-9);
  });
});
