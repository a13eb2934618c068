import type { Study } from '../../engine/study/index.ts';
import type { SettingsRunner } from '../worker/runners.ts';
import type { SettingsAnswer, SettingsQuestion } from '../worker/settingsQuestions.ts';

/** An answer, or why there is none. */
export type SettingsOutcome = { ok: true; answer: SettingsAnswer } | { ok: false; message: string };

interface Asked {
  seq: number;
  study: Study;
  question: SettingsQuestion;
  reply: (outcome: SettingsOutcome) => void;
  cancelled: boolean;
}

/**
 * Asks the settings' runner one question at a time. Of the questions asked meanwhile only the newest
 * of each kind is sent next (a user stepping through the tree wants the window of the device they
 * stopped on, not of each they passed); the others, and any cancelled, are never answered.
 *
 * @example const cancel = asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (outcome) => show(outcome))
 */
export class SettingsAsker {
  #runner: SettingsRunner;
  #seq = 0;
  #inFlight: Asked | undefined;
  #waiting = new Map<SettingsQuestion['kind'], Asked>();

  constructor(runner: SettingsRunner) {
    this.#runner = runner;
    runner.onreply = (reply) => {
      // A worker that failed to load answers with seq -1: it stands for the question in flight.
      const asked = this.#inFlight;
      if (!asked || (reply.seq !== asked.seq && reply.seq >= 0)) return;
      this.#inFlight = undefined;
      if (!asked.cancelled)
        asked.reply(reply.ok ? { ok: true, answer: reply.answer } : { ok: false, message: reply.message });
      this.#next();
    };
  }

  /** Asks `question` of `study`; `reply` is called once with the outcome unless the returned function cancels it first. */
  ask(study: Study, question: SettingsQuestion, reply: (outcome: SettingsOutcome) => void): () => void {
    const asked: Asked = { seq: ++this.#seq, study, question, reply, cancelled: false };
    // A question of this kind still waiting is dropped unanswered.
    this.#waiting.set(question.kind, asked);
    if (!this.#inFlight) this.#next();
    return () => {
      asked.cancelled = true;
      if (this.#waiting.get(question.kind) === asked) this.#waiting.delete(question.kind);
    };
  }

  #next(): void {
    const [first] = this.#waiting.values();
    if (!first) return;
    this.#waiting.delete(first.question.kind);
    this.#inFlight = first;
    this.#runner.post({ seq: first.seq, study: first.study, question: first.question });
  }
}
