/**
 * The one mapping from a deposit checkout's outcome to its answer, for the two client routes
 * (by link, and signed in): 200 `{ url }`, 404 unknown, 409 not yet approved / no deposit /
 * already paid, 503 deposits off, 502 the payment service refused or could not be reached.
 */
import { json, problem } from '~/lib/http/problem.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import type { CheckoutResult } from './deposits.server.ts';

type CheckoutFailure = Exclude<CheckoutResult, { ok: true }>;

const ANSWERS: FailureAnswers<CheckoutFailure> = {
  not_found: (f) => problem(404, f.message),
  not_approved: (f) => problem(409, f.message),
  no_deposit: (f) => problem(409, f.message),
  already_paid: (f) => problem(409, f.message),
  off: (f) => problem(503, f.message),
  service: (f) => problem(502, f.message),
};

export function checkoutAnswer(result: CheckoutResult): Response {
  return result.ok ? json({ url: result.url }) : failureAnswer(result, ANSWERS);
}
