import type { APIRoute } from 'astro';
import { isWellFormedToken, sha256Hex } from '~/lib/auth/index.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { clientIp } from '~/lib/http/client-ip.ts';
import { problem } from '~/lib/http/problem.ts';
import { countDecision, decisionAnswer, DECISION_BODY_MAX_BYTES, PROOF_NOT_AVAILABLE } from '~/lib/proofs/proof-answers.server.ts';
import { decideProof } from '~/lib/proofs/proofs.server.ts';
import { decisionSchema } from '~/lib/schemas/proof.ts';

export const prerender = false;

/**
 * POST /api/p/{token}/decision {decision, name, confirmed, comment?}: a client's answer through
 * the proof link. Public: the link itself is the permission. Answers are limited per visitor and
 * per link, so one visitor hammering one proof is stopped without locking out every other proof
 * from the same address (a shop's clients may share one office connection).
 */
export const POST: APIRoute = async (context) => {
  const { params, request } = context;
  const token = params.token ?? '';
  const counted = await countDecision(`${clientIp(context)}:${sha256Hex(token).slice(0, 16)}`);
  if (!counted.ok) return counted.response;
  if (!isWellFormedToken(token)) return problem(404, PROOF_NOT_AVAILABLE);
  const input = await readValidJson(request, DECISION_BODY_MAX_BYTES, decisionSchema);
  if (!input.ok) return input.response;
  return decisionAnswer(await decideProof({ token }, input.value, new Date()));
};
