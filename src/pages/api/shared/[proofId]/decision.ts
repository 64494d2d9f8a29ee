import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { countDecision, decisionAnswer, DECISION_BODY_MAX_BYTES, PROOF_NOT_AVAILABLE } from '~/lib/proofs/proof-answers.server.ts';
import { decideProof } from '~/lib/proofs/proofs.server.ts';
import { decisionSchema } from '~/lib/schemas/proof.ts';

export const prerender = false;

/** POST /api/shared/{proofId}/decision: a signed-in client answers a proof sent to their own e-mail by their own shop. */
export const POST: APIRoute = async ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.viewProofs);
  if (!guard.ok) return guard.response;
  const user = guard.value;
  const counted = await countDecision(`user:${user.id}`);
  if (!counted.ok) return counted.response;
  const id = parseRecordId(params.proofId);
  if (id === null) return problem(404, PROOF_NOT_AVAILABLE);
  const input = await readValidJson(request, DECISION_BODY_MAX_BYTES, decisionSchema);
  if (!input.ok) return input.response;
  return decisionAnswer(await decideProof({ proofId: id, shopId: user.shopId, clientEmail: user.email }, input.value, new Date()));
};
