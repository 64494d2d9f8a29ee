import { decideProof, type ProofLocator } from '~/lib/proofs/proofs.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { PROOF_DECISION_BUDGET } from '~/lib/http/rate-budgets.ts';
import { consume, type Counter } from '~/lib/http/rate-limit.server.ts';
import { decisionSchema } from '~/lib/schemas/proof.ts';

/** Room for the longest comment in multi-byte characters, plus the other fields. */
const DECISION_BODY_MAX_BYTES = 16 * 1024;

/** The one answer for unknown, revoked, expired and malformed links alike. */
export const PROOF_NOT_AVAILABLE = 'This proof is not available';

const DECISIONS: Counter = { name: 'proof-decision', budget: PROOF_DECISION_BUDGET };

export function tooManyRequests(retryAfterSeconds: number): Response {
  return problem(429, 'Too many requests; wait a moment and try again', {}, { 'retry-after': String(retryAfterSeconds) });
}

/**
 * Records a client's answer to the proof `locator` finds: 200 with the decision, 400 naming the
 * field, 404 when not available, 409 when already answered or expired, 429 over budget.
 * `rateKey` identifies the visitor (client address or user id).
 */
export async function handleDecision(request: Request, locator: ProofLocator | null, rateKey: string, now: Date): Promise<Response> {
  const verdict = await consume(DECISIONS, rateKey);
  if (!verdict.ok) return tooManyRequests(verdict.retryAfterSeconds);
  if (!locator) return problem(404, PROOF_NOT_AVAILABLE);
  const parsed = await readValidJson(request, DECISION_BODY_MAX_BYTES, decisionSchema);
  if (!parsed.ok) return parsed.response;
  const result = await decideProof(locator, parsed.value, now);
  if (result.ok) return json({ decision: result.decision });
  switch (result.reason) {
    case 'not_found':
      return problem(404, PROOF_NOT_AVAILABLE);
    case 'already_decided':
      return problem(409, 'This proof has already been answered; ask the shop for a new one to change your answer');
    case 'expired':
      return problem(409, 'This proof has expired; ask the shop for a new link');
  }
}
