import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { StudyAsker, type Outcome } from '../../../src/app/state/StudyAsker.ts';
import type { QuestionRunner } from '../../../src/app/worker/runners.ts';
import { answerOf, type SettingsAnswer, type SettingsQuestion } from '../../../src/app/worker/settingsQuestions.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const study = parseStudy(readFileSync(new URL('../../../demo/harrowmere-full.json', import.meta.url), 'utf8'));

type SettingsRunner = QuestionRunner<SettingsQuestion, SettingsAnswer>;
type SettingsOutcome = Outcome<SettingsAnswer>;
type Posted = Parameters<SettingsRunner['post']>[0];

/** A runner that holds questions until the test answers them with the engine. */
function heldRunner() {
  const posted: Posted[] = [];
  const runner: SettingsRunner & {
    posted: Posted[];
    answer(i: number): void;
    fail(seq: number, message: string): void;
  } = {
    posted,
    post: (request) => void posted.push(request),
    onreply: undefined,
    answer(i) {
      const { seq, study, question } = posted[i];
      runner.onreply?.({ seq, ok: true, answer: answerOf(study, question) });
    },
    fail(seq, message) {
      runner.onreply?.({ seq, ok: false, message });
    },
  };
  return runner;
}

const windowOf = (outcome: SettingsOutcome | undefined) =>
  outcome?.ok && outcome.answer.kind === 'window' ? outcome.answer.window?.deviceId : undefined;

describe('StudyAsker', () => {
  it('has the expected defaults: nothing sent until asked', () => {
    const runner = heldRunner();
    new StudyAsker(runner, { newestOnly: true });
    expect(runner.posted).toEqual([]);
  });

  it('sends one question at a time, and with newestOnly, of those asked meanwhile only the newest of its kind', () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner, { newestOnly: true });
    const got: (string | undefined)[] = [];
    asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (o) => got.push(windowOf(o)));
    asker.ask(study, { kind: 'window', deviceId: 'FDR-MCC' }, (o) => got.push(windowOf(o)));
    asker.ask(study, { kind: 'window', deviceId: 'FDR-DOCK' }, (o) => got.push(windowOf(o)));
    expect(runner.posted.map((p) => p.question)).toEqual([{ kind: 'window', deviceId: 'MAIN' }]);
    runner.answer(0);
    // The user stepped past FDR-MCC to FDR-DOCK: FDR-MCC's window is never worked out.
    expect(runner.posted.map((p) => p.question)).toEqual([
      { kind: 'window', deviceId: 'MAIN' },
      { kind: 'window', deviceId: 'FDR-DOCK' },
    ]);
    runner.answer(1);
    expect(got).toEqual(['MAIN', 'FDR-DOCK']);
  });

  it('keeps a proposal asked while a window is worked out: questions of another kind are not dropped', () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner, { newestOnly: true });
    const kinds: string[] = [];
    asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (o) => kinds.push(o.ok ? o.answer.kind : 'error'));
    asker.ask(study, { kind: 'proposal' }, (o) => kinds.push(o.ok ? o.answer.kind : 'error'));
    asker.ask(study, { kind: 'window', deviceId: 'FDR-MCC' }, (o) => kinds.push(o.ok ? o.answer.kind : 'error'));
    runner.answer(0);
    runner.answer(1);
    runner.answer(2);
    expect(runner.posted.map((p) => p.question.kind)).toEqual(['window', 'proposal', 'window']);
    expect(kinds).toEqual(['window', 'proposal', 'window']);
  });

  it('never answers a cancelled question, whether it was waiting or already sent', () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner, { newestOnly: true });
    const got: (string | undefined)[] = [];
    const cancelSent = asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (o) => got.push(windowOf(o)));
    const cancelWaiting = asker.ask(study, { kind: 'proposal' }, () => got.push('proposal'));
    cancelSent();
    cancelWaiting();
    runner.answer(0);
    expect(got).toEqual([]);
    expect(runner.posted).toHaveLength(1);
    asker.ask(study, { kind: 'window', deviceId: 'FDR-MCC' }, (o) => got.push(windowOf(o)));
    runner.answer(1);
    expect(got).toEqual(['FDR-MCC']);
  });

  it("passes a failure's message on, and takes a worker that failed to load (seq -1) as the answer to the question sent", () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner, { newestOnly: true });
    const got: SettingsOutcome[] = [];
    asker.ask(study, { kind: 'proposal' }, (o) => got.push(o));
    asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (o) => got.push(o));
    runner.fail(runner.posted[0].seq, 'a study with scenarios');
    runner.fail(-1, 'the settings worker could not start');
    expect(got).toEqual([
      { ok: false, message: 'a study with scenarios' },
      { ok: false, message: 'the settings worker could not start' },
    ]);
    // The questions asked after it are sent and answered (the runner starts another worker).
    asker.ask(study, { kind: 'window', deviceId: 'FDR-MCC' }, (o) => got.push(o));
    runner.answer(2);
    expect(windowOf(got[2])).toBe('FDR-MCC');
  });

  it('sends the next question even when a reply throws', () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner);
    asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, () => {
      throw new Error('a broken reply');
    });
    asker.ask(study, { kind: 'window', deviceId: 'FDR-MCC' }, () => {});
    expect(() => runner.answer(0)).toThrow('a broken reply');
    expect(runner.posted.map((p) => p.question)).toEqual([
      { kind: 'window', deviceId: 'MAIN' },
      { kind: 'window', deviceId: 'FDR-MCC' },
    ]);
  });

  it('ignores a reply to a question it did not send', () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner, { newestOnly: true });
    const got: SettingsOutcome[] = [];
    asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (o) => got.push(o));
    runner.fail(99, 'stray');
    expect(got).toEqual([]);
    runner.answer(0);
    expect(got).toHaveLength(1);
  });

  it('without newestOnly, answers every question in the order asked, and as a promise', async () => {
    const runner = heldRunner();
    const asker = new StudyAsker(runner);
    const answers = [
      asker.answer(study, { kind: 'window', deviceId: 'MAIN' }),
      asker.answer(study, { kind: 'window', deviceId: 'FDR-MCC' }),
      asker.answer(study, { kind: 'window', deviceId: 'FDR-DOCK' }),
    ];
    for (let i = 0; i < 3; i++) runner.answer(i);
    const got = await Promise.all(answers);
    expect(got.map((answer) => (answer.kind === 'window' ? answer.window?.deviceId : undefined))).toEqual([
      'MAIN',
      'FDR-MCC',
      'FDR-DOCK',
    ]);
    const refused = asker.answer(study, { kind: 'proposal' });
    runner.fail(runner.posted[3].seq, 'a study with scenarios');
    await expect(refused).rejects.toThrow('a study with scenarios');
  });
});
