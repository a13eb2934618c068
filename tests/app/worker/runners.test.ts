import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { inlineRunner, inlineSettingsRunner } from '../../../src/app/worker/runners.ts';
import { settingWindowOf } from '../../../src/engine/window/index.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import type { AnalyseReply, QuestionReply } from '../../../src/app/worker/protocol.ts';
import type { SettingsAnswer } from '../../../src/app/worker/settingsQuestions.ts';
import { resultsWith } from '../../../src/app/worker/changes.ts';

const study = parseStudy(readFileSync(new URL('../../../demo/harrowmere-overlap.json', import.meta.url), 'utf8'));

describe('runners', () => {
  it('has the expected defaults', () => {
    expect(inlineRunner().onreply).toBeUndefined();
  });

  it('inlineRunner() answers on a later task with the engine findings, as plain data', async () => {
    const runner = inlineRunner();
    const reply = new Promise<AnalyseReply>((resolve) => (runner.onreply = resolve));
    let answered = false;
    void reply.then(() => (answered = true));
    runner.post({ seq: 7, study });
    expect(answered).toBe(false);
    const got = await reply;
    const expected = analyseStudy(study);
    expect(got.seq).toBe(7);
    if (!got.ok || !('changes' in got)) throw new Error('expected the changes since the previous reply');
    expect(got.changes.counts).toEqual(expected.counts);
    // What crosses a thread must survive structured cloning: no closures in findings or pairs.
    const results = resultsWith(undefined, structuredClone(got.changes));
    expect(JSON.parse(JSON.stringify(results.findings))).toEqual(JSON.parse(JSON.stringify(expected.findings)));
    expect(results.pairs.map((p) => `${p.upstream}/${p.downstream}`)).toEqual(
      expected.pairs.map((p) => `${p.upstream}/${p.downstream}`),
    );
  });

  it('inlineRunner() reports a failed run with its message', async () => {
    const runner = inlineRunner();
    const reply = new Promise<AnalyseReply>((resolve) => (runner.onreply = resolve));
    runner.post({
      seq: 1,
      study: { ...study, devices: [{ ...study.devices[0], characteristic: { kind: 'nonsense' } }] } as never,
    });
    const got = await reply;
    expect(got).toMatchObject({ seq: 1, ok: false });
    expect(got.ok ? '' : got.message).not.toBe('');
  });

  it('inlineSettingsRunner() answers a question on a later task, and a refusal with its message', async () => {
    const runner = inlineSettingsRunner();
    expect(runner.onreply).toBeUndefined();
    const replies: QuestionReply<SettingsAnswer>[] = [];
    const two = new Promise<void>((resolve) => {
      runner.onreply = (reply) => {
        replies.push(reply);
        if (replies.length === 2) resolve();
      };
    });
    runner.post({ seq: 3, study, question: { kind: 'window', deviceId: 'MAIN' } });
    // A device the engine cannot read: the window's trial throws, and the runner says why.
    const broken = { ...study, devices: [{ ...study.devices[1], characteristic: { kind: 'nonsense' } }] } as never;
    runner.post({ seq: 4, study: broken, question: { kind: 'window', deviceId: 'MAIN' } });
    expect(replies).toEqual([]);
    await two;
    expect(replies[0]).toEqual({
      seq: 3,
      ok: true,
      answer: { kind: 'window', window: settingWindowOf(study, 'MAIN') },
    });
    expect(replies[1]).toMatchObject({ seq: 4, ok: false });
    expect(replies[1].ok ? '' : replies[1].message).not.toBe('');
  });
});
