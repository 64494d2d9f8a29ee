/**
 * What the two proof decision routes (POST /api/p/{token}/decision for a link, POST
 * /api/shared/{proofId}/decision for a signed-in client) share: the answer budget per visitor, the
 * body limit, and the one mapping from a decision's outcome to its answer.
 */
import { json, problem, type Checked } from '~/lib/http/problem.ts';
import { PROOF_DECISION_BUDGET } from '~/lib/http/rate-budgets.ts';
import { consume, type Counter } from '~/lib/http/rate-limit.server.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import type { DecideFailure, DecideResult } from './proofs.server.ts';

/** Room for the longest comment in multi-byte characters, plus the other fields. */
export const DECISION_BODY_MAX_BYTES = 16 * 1024;

/** The one answer for unknown, revoked, expired and malformed links alike. */
export const PROOF_NOT_AVAILABLE = 'This proof is not available';

const DECISIONS: Counter = { name: 'proof-decision', budget: PROOF_DECISION_BUDGET };

/**
 * Counts one answer against the visitor's budget (`rateKey`: client address and link, or the
 * user), before anything else is read: 429 with Retry-After once it is used.
 */
export async function countDecision(rateKey: string): Promise<Checked<null>> {
  const verdict = await consume(DECISIONS, rateKey);
  if (verdict.ok) return { ok: true, value: null };
  return { ok: false, response: problem(429, 'Too many requests; wait a moment and try again', {}, { 'retry-after': String(verdict.retryAfterSeconds) }) };
}

/** 200 with the decision; 404 when not available; 409 when already answered or expired. */
const DECIDE_FAILURES: FailureAnswers<DecideFailure> = {
  not_found: () => problem(404, PROOF_NOT_AVAILABLE),
  already_decided: () => problem(409, 'This proof has already been answered; ask the shop for a new one to change your answer'),
  expired: () => problem(409, 'This proof has expired; ask the shop for a new link'),
};

export function decisionAnswer(result: DecideResult): Response {
  return result.ok ? json({ decision: result.decision }) : failureAnswer(result, DECIDE_FAILURES);
}
