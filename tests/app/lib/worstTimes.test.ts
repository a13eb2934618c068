import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../src/engine/checks/finding.ts';
import { worstTimesOf } from '../../../src/app/lib/worstTimes.ts';

const finding = (kind: string, subjects: string[]): Finding =>
  ({
    id: `${kind}:1`,
    kind,
    severity: 'fail',
    title: 't',
    subjects,
    explanation: 'e',
    worst: { amps: 2810, marginSeconds: -0.1, ratio: 0.9, upTime: 0.2, downTime: 0.3 },
  }) as Finding;
const names = new Map([
  ['GEN-CB', 'Generator breaker'],
  ['FDR', 'Feeder'],
  ['T1', 'Service transformer'],
  ['R-T1', 'T1 primary relay'],
]);
const nameOf = (id: string) => names.get(id) ?? id;

describe('worstTimesOf', () => {
  it('names a pair upstream first, at constant currents and on the generator decaying current alike', () => {
    for (const kind of ['coordination', 'generator-decrement'])
      expect(worstTimesOf(finding(kind, ['GEN-CB', 'FDR']), nameOf)).toBe(
        'Generator breaker may operate from 0.2 s; Feeder clears by 0.3 s',
      );
  });

  it('says so where the upstream device does not operate on the current', () => {
    const never = finding('generator-decrement', ['GEN-CB', 'FDR']);
    never.worst!.upTime = Infinity;
    expect(worstTimesOf(never, nameOf)).toBe('Generator breaker does not operate; Feeder clears by 0.3 s');
  });

  it('names a damage curve and the device that must clear before it', () => {
    expect(worstTimesOf(finding('transformer-withstand', ['R-T1', 'T1']), nameOf)).toBe(
      "Service transformer's damage curve at 0.2 s; T1 primary relay clears by 0.3 s",
    );
  });
});
