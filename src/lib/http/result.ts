/**
 * The one way a service says no, and the one way a route turns that into an answer.
 *
 * A service that can refuse returns `{ ok: true, … } | Failure<…>`: a reason code plus whatever the
 * answer needs (the board as it is now, the field to name…). The route keeps its success answer
 * and hands a failure to `failureAnswer` with one answer per reason; the compiler checks the table
 * covers every reason the service can give.
 */
export type Failure<Reason extends string = string, Detail extends object = object> = { ok: false; reason: Reason } & Detail;

export type FailureAnswers<F extends Failure> = { [R in F['reason']]: (failure: F & { reason: R }) => Response };

export function failureAnswer<F extends Failure>(failure: F, answers: FailureAnswers<F>): Response {
  const answer = answers[failure.reason as F['reason']] as (failure: F) => Response;
  return answer(failure);
}
