import type { Study } from '../../engine/study/index.ts';
import type { QuestionReply, QuestionRequest } from './protocol.ts';
import { studyWithDelta } from './studyDelta.ts';

/**
 * Makes the calling worker answer questions about the study with `answerOf`, keeping the last study
 * sent so that the next request's changes apply to it. `transfersOf` names what of an answer moves to
 * the page rather than being copied (a report's PDF bytes).
 *
 * @example serveQuestions(answerOf)
 */
export function serveQuestions<Q, A>(
  answerOf: (study: Study, question: Q) => A | Promise<A>,
  transfersOf: (answer: A) => Transferable[] = () => [],
): void {
  const scope = self as unknown as {
    onmessage: ((event: MessageEvent<QuestionRequest<Q>>) => void) | null;
    postMessage(reply: QuestionReply<A>, transfer?: Transferable[]): void;
  };
  let current: Study | undefined;
  scope.onmessage = async ({ data }) => {
    const { seq } = data;
    try {
      if ('delta' in data && !current) throw new Error('expected a whole study before its changes, got changes');
      const study = 'delta' in data ? studyWithDelta(current!, data.delta) : data.study;
      current = study;
      const answer = await answerOf(study, data.question);
      scope.postMessage({ seq, ok: true, answer }, transfersOf(answer));
    } catch (error) {
      scope.postMessage({ seq, ok: false, message: (error as Error).message });
    }
  };
}
