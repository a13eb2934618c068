import { afterEach, describe, it, expect, vi } from 'vitest';
import { readFileSync } from 'node:fs';
import {
  inlineRunner,
  inlineSettingsRunner,
  settingsWorkerRunner,
  workerRunner,
} from '../../../src/app/worker/runners.ts';
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

  describe('a worker that fails', () => {
    /** A stand-in for the browser's Worker: it keeps what it is sent and fails when told. */
    class HeldWorker {
      static started: HeldWorker[] = [];
      sent: unknown[] = [];
      terminated = false;
      onmessage: ((event: { data: unknown }) => void) | null = null;
      onerror: ((event: { message?: string }) => void) | null = null;
      constructor(readonly url: URL) {
        HeldWorker.started.push(this);
      }
      postMessage(message: unknown) {
        this.sent.push(message);
      }
      terminate() {
        this.terminated = true;
      }
    }
    afterEach(() => {
      vi.unstubAllGlobals();
      HeldWorker.started = [];
    });

    it('is let go with a plain reason when its script does not load, and the next question starts another, the study whole', () => {
      vi.stubGlobal('Worker', HeldWorker);
      const runner = settingsWorkerRunner();
      const replies: QuestionReply<SettingsAnswer>[] = [];
      runner.onreply = (reply) => replies.push(reply);
      const question = { kind: 'window', deviceId: 'MAIN' } as const;
      runner.post({ seq: 1, study, question });
      const [first] = HeldWorker.started;
      // A script that fails to load fires an event without a message.
      first.onerror!({});
      expect(first.terminated).toBe(true);
      expect(replies).toEqual([{ seq: -1, ok: false, message: 'the settings worker could not start' }]);
      runner.post({ seq: 2, study, question });
      expect(HeldWorker.started).toHaveLength(2);
      expect(HeldWorker.started[1].sent).toEqual([{ seq: 2, question, study }]);
      // Once it has the study, the next crosses as its changes.
      runner.post({ seq: 3, study, question });
      expect(HeldWorker.started[1].sent[1]).toEqual({ seq: 3, question, delta: { fields: {}, items: {} } });
    });

    it('says nothing more for a worker it let go: neither a reply it had sent on its way nor a second error', () => {
      vi.stubGlobal('Worker', HeldWorker);
      const runner = settingsWorkerRunner();
      const replies: QuestionReply<SettingsAnswer>[] = [];
      runner.onreply = (reply) => replies.push(reply);
      runner.post({ seq: 1, study, question: { kind: 'window', deviceId: 'MAIN' } });
      const [first] = HeldWorker.started;
      first.onerror!({ message: 'Uncaught TypeError' });
      first.onmessage!({ data: { seq: 1, ok: true, answer: { kind: 'window' } } });
      first.onerror!({ message: 'Uncaught TypeError' });
      expect(replies).toEqual([{ seq: -1, ok: false, message: 'Uncaught TypeError' }]);
    });

    it("the checks' worker too: the next study is sent to a new worker, whole", () => {
      vi.stubGlobal('Worker', HeldWorker);
      const runner = workerRunner();
      const replies: AnalyseReply[] = [];
      runner.onreply = (reply) => replies.push(reply);
      runner.post({ seq: 1, study });
      HeldWorker.started[0].onerror!({ message: 'Uncaught SyntaxError' });
      expect(replies).toEqual([{ seq: -1, ok: false, message: 'Uncaught SyntaxError' }]);
      runner.post({ seq: 2, study });
      expect(HeldWorker.started.map((w) => w.terminated)).toEqual([true, false]);
      expect(HeldWorker.started[1].sent).toEqual([{ seq: 2, study }]);
    });
  });
});
