import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { revokeProof, type RevokeFailure } from '~/lib/proofs/proofs.server.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';

export const prerender = false;

const NO_SUCH_PROOF = 'No such proof in your shop';

const REVOKE_FAILURES: FailureAnswers<RevokeFailure> = {
  answered: () => problem(409, 'The client has already answered this proof; an answer is kept, not revoked'),
  not_found: () => problem(404, NO_SUCH_PROOF),
};

/** Revokes an unanswered proof of the shop: its link then answers like an unknown one. 409 once answered. */
export const POST: APIRoute = async ({ params, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.proofId);
  if (id === null) return problem(404, NO_SUCH_PROOF);
  const result = await revokeProof(guard.value.shopId, id, new Date());
  if (result.ok) return json({ proof: result.proof });
  return failureAnswer(result, REVOKE_FAILURES);
};
