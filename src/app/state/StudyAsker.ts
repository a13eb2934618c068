import type { Study } from '../../engine/study/index.ts';
import type { QuestionRunner } from '../worker/runners.ts';

/** An answer, or why there is none. */
export type Outcome<A> = { ok: true; answer: A } | { ok: false; message: string };

interface Asked<Q, A> {
  seq: number;
  study: Study;
  question: Q;
  reply: (outcome: Outcome<A>) => void;
  cancelled: boolean;
}

/**
 * Asks a worker questions about the study (a setting window, a proposal, a report), one at a time,
 * in the order asked. With `newestOnly`, of the questions of one kind asked meanwhile only the newest
 * is sent (a user stepping through the tree wants the window of the device they stopped on, not of
 * each they passed) and the others are never answered; a cancelled question is never answered either.
 *
 * @example const cancel = asker.ask(study, { kind: 'window', deviceId: 'MAIN' }, (outcome) => show(outcome))
 */
export class StudyAsker<Q extends { kind: string }, A> {
  #runner: QuestionRunner<Q, A>;
  #newestOnly: boolean;
  #seq = 0;
  #inFlight: Asked<Q, A> | undefined;
  #waiting: Asked<Q, A>[] = [];

  constructor(runner: QuestionRunner<Q, A>, options: { newestOnly?: boolean } = {}) {
    this.#runner = runner;
    this.#newestOnly = options.newestOnly ?? false;
    runner.onreply = (reply) => {
      // A worker that failed to load answers with seq -1: it stands for the question in flight.
      const asked = this.#inFlight;
      if (!asked || (reply.seq !== asked.seq && reply.seq >= 0)) return;
      this.#inFlight = undefined;
      try {
        if (!asked.cancelled)
          asked.reply(reply.ok ? { ok: true, answer: reply.answer } : { ok: false, message: reply.message });
      } finally {
        // The next question goes, whatever this one's reply did.
        this.#next();
      }
    };
  }

  /** Asks `question` of `study`; `reply` is called once with the outcome unless the returned function cancels it first. */
  ask(study: Study, question: Q, reply: (outcome: Outcome<A>) => void): () => void {
    const asked: Asked<Q, A> = { seq: ++this.#seq, study, question, reply, cancelled: false };
    // A question of this kind still waiting is dropped unanswered.
    if (this.#newestOnly) this.#waiting = this.#waiting.filter((waiting) => waiting.question.kind !== question.kind);
    this.#waiting.push(asked);
    if (!this.#inFlight) this.#next();
    return () => {
      asked.cancelled = true;
      this.#waiting = this.#waiting.filter((waiting) => waiting !== asked);
    };
  }

  /** `ask` as a promise, for a question that is never cancelled nor replaced (an asker without `newestOnly`). */
  answer(study: Study, question: Q): Promise<A> {
    return new Promise((resolve, reject) =>
      this.ask(study, question, (outcome) =>
        outcome.ok ? resolve(outcome.answer) : reject(new Error(outcome.message)),
      ),
    );
  }

  #next(): void {
    const first = this.#waiting.shift();
    if (!first) return;
    this.#inFlight = first;
    this.#runner.post({ seq: first.seq, study: first.study, question: first.question });
  }
}
