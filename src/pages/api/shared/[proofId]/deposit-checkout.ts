import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { checkoutAnswer } from '~/lib/payments/checkout-answer.ts';
import { startDepositCheckout } from '~/lib/payments/deposits.server.ts';
import { PROOF_NOT_AVAILABLE } from '~/lib/proofs/proof-answers.server.ts';
import { proofWhere } from '~/lib/proofs/proofs.server.ts';

export const prerender = false;

/** POST /api/shared/{proofId}/deposit-checkout: the signed-in client's pay page for a proof sent to their own e-mail. */
export const POST: APIRoute = async ({ params, locals }) => {
  const guard = requireRole(locals.user, CAN.viewProofs);
  if (!guard.ok) return guard.response;
  const user = guard.value;
  const id = parseRecordId(params.proofId);
  if (id === null) return problem(404, PROOF_NOT_AVAILABLE);
  const where = proofWhere({ proofId: id, shopId: user.shopId, clientEmail: user.email });
  return checkoutAnswer(await startDepositCheckout(where, { proofPath: `/shared/${id}` }, new Date()));
};
