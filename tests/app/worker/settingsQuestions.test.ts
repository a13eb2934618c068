import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { answerOf } from '../../../src/app/worker/settingsQuestions.ts';
import { treeHolding } from '../../../src/engine/scenario/index.ts';
import { parseStudy, type Study } from '../../../src/engine/study/index.ts';
import { proposeSettings, settingWindowOf } from '../../../src/engine/window/index.ts';

const demo = (name: string): Study =>
  parseStudy(readFileSync(new URL(`../../../demo/${name}.json`, import.meta.url), 'utf8'));

/** What crosses a thread: the answer as structured cloning gives it to the other side. */
const crossed = <T>(value: T): T => structuredClone(value);

describe('answerOf', () => {
  it("answers a window question with the engine's setting window, whole across a thread", () => {
    const study = demo('harrowmere-full');
    const answer = answerOf(study, { kind: 'window', deviceId: 'MAIN' });
    if (answer.kind !== 'window' || !answer.window) throw new Error('expected a window');
    expect(crossed(answer)).toEqual({ kind: 'window', window: settingWindowOf(study, 'MAIN') });
    expect(answer.window.maps.length).toBeGreaterThan(0);
  });

  it("works a switched study's window in the chosen scenario's tree, else the first that energises the device", () => {
    const study = demo('harrowmere-standby');
    const generatorSide = treeHolding(study, 'GEN-CB', 'on-generator')!;
    expect(answerOf(study, { kind: 'window', deviceId: 'GEN-CB', scenarioId: 'on-generator' })).toEqual({
      kind: 'window',
      window: settingWindowOf(generatorSide, 'GEN-CB'),
    });
    // The generator's breaker is dark on the utility: its window is that of the first scenario feeding it.
    expect(answerOf(study, { kind: 'window', deviceId: 'GEN-CB', scenarioId: 'normal' })).toEqual({
      kind: 'window',
      window: settingWindowOf(treeHolding(study, 'GEN-CB')!, 'GEN-CB'),
    });
  });

  it('gives no window for a device the study no longer has (deleted while the question crossed)', () => {
    expect(answerOf(demo('harrowmere-full'), { kind: 'window', deviceId: 'GONE' })).toEqual({ kind: 'window' });
  });

  it('summarises a proposal with what the panel shows, and leaves the findings behind', () => {
    const study = demo('harrowmere-overlap');
    const answer = answerOf(study, { kind: 'proposal' });
    const proposal = proposeSettings(study);
    expect(crossed(answer)).toEqual({
      kind: 'proposal',
      proposal: {
        changes: proposal.changes,
        failsBefore: proposal.failsBefore,
        failsAfter: proposal.failsAfter,
        kept: proposal.devices
          .filter((d) => !d.exists)
          .map((d) => ({ deviceId: d.deviceId, deviceName: d.deviceName, explanation: d.noWindow?.explanation })),
      },
    });
    expect(proposal.changes.length).toBeGreaterThan(3);
    expect(Object.keys(answer.kind === 'proposal' ? answer.proposal : {})).not.toContain('remaining');
  });

  it("proposes for the sheet's devices alone when asked for them", () => {
    const study = demo('harrowmere-overlap');
    const deviceIds = study.views[0].devices;
    const answer = answerOf(study, { kind: 'proposal', deviceIds });
    if (answer.kind !== 'proposal') throw new Error('expected a proposal');
    expect(answer.proposal.changes).toEqual(proposeSettings(study, { deviceIds }).changes);
    expect(answer.proposal.changes.every((c) => deviceIds.includes(c.deviceId))).toBe(true);
  });
});
