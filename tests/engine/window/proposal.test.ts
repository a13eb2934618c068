import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy, readStudy } from '../../../src/engine/study/index.ts';
import { PROPOSAL_ORDER, proposeSettings, withSettingChanges } from '../../../src/engine/window/index.ts';

const overlapText = readFileSync('demo/harrowmere-overlap.json', 'utf8');
const overlap = parseStudy(overlapText);

describe('proposeSettings', () => {
  it('has the expected defaults: every adjustable device, loads first, fuses and breakers left alone, the rule stated', () => {
    const proposal = proposeSettings(overlap);
    expect(proposal.orderRule).toBe(PROPOSAL_ORDER);
    expect(proposal.order).not.toContain('EM-BR');
    expect(proposal.order.at(-1)).toBe('R-T1');
    expect(proposal.order.indexOf('MCC-M1')).toBeLessThan(proposal.order.indexOf('FDR-MCC'));
    expect(proposal.order.indexOf('FDR-MCC')).toBeLessThan(proposal.order.indexOf('MAIN'));
    expect(proposal.changes.every((c) => c.from !== c.to)).toBe(true);
  });

  it('counts the failures before as the check does, the NFPA 70 selective-coordination finding of a marked device included', () => {
    // The overlap demo with its emergency breaker marked (a study without scenarios).
    const marked = {
      ...overlap,
      devices: overlap.devices.map((d) => (d.id === 'EM-BR' ? { ...d, system: 'emergency' as const } : d)),
    };
    const checked = analyseScenarios(marked).findings;
    expect(checked.some((f) => f.kind === 'code-selectivity')).toBe(true);
    expect(proposeSettings(marked).failsBefore).toBe(checked.filter((f) => f.severity === 'fail').length);
  });

  it('clears every coordination failure of the overlap demo, and the proposed file reads back to the same settings', () => {
    const before = analyseStudy(overlap).findings.filter((f) => f.kind === 'coordination' && f.severity === 'fail');
    expect(before.length).toBeGreaterThan(0);
    const proposal = proposeSettings(overlap);
    const after = analyseStudy(proposal.study).findings.filter((f) => f.severity === 'fail');
    expect(after.map((f) => f.title)).toEqual([]);
    expect(proposal.failsAfter).toBe(0);
    expect(proposal.cleared.map((f) => f.id)).toEqual(expect.arrayContaining(before.map((f) => f.id)));

    const written = withSettingChanges(JSON.parse(overlapText), proposal.changes);
    const reread = readStudy(written);
    expect(reread.problems).toEqual([]);
    expect(reread.study!.devices.map((d) => d.characteristic)).toEqual(
      proposal.study.devices.map((d) => d.characteristic),
    );
    // The input document is untouched.
    expect(JSON.parse(overlapText)).toEqual(JSON.parse(readFileSync('demo/harrowmere-overlap.json', 'utf8')));
  });

  // A trip unit whose published band runs 0.05 s below each set delay cannot be set to a 0.05 s delay:
  // the schema rejects it, so the proposal must not write it.
  it('writes only delays above the band below them, so the proposed file reads back without problems', () => {
    const input = JSON.parse(readFileSync('demo/harrowmere-full.json', 'utf8'));
    const feeder = input.devices.find((d: { id: string }) => d.id === 'FDR-EM');
    feeder.characteristic.tolerance = { shortTimeBelow: 0.05 };
    const proposal = proposeSettings(parseStudy(input));
    const delays = proposal.changes.filter((c) => c.deviceId === 'FDR-EM' && c.key === 'shortTime.delay');
    for (const c of delays) expect(c.to as number).toBeGreaterThan(0.05);
    const reread = readStudy(withSettingChanges(input, proposal.changes));
    expect(reread.problems).toEqual([]);
  });

  it('sets only the devices of one path when asked, keeping the device above fixed as a constraint', () => {
    const view = overlap.views.find((v) => v.id === 'emergency')!;
    const proposal = proposeSettings(overlap, { deviceIds: view.devices });
    expect(new Set(proposal.changes.map((c) => c.deviceId))).toEqual(new Set(['FDR-EM', 'MAIN']));
    expect(proposal.order).toEqual(['FDR-EM', 'MAIN']);
  });
});
