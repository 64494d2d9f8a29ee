import type { APIRoute } from 'astro';
import { isWellFormedToken } from '~/lib/auth/index.server.ts';
import { problem } from '~/lib/http/problem.ts';
import { checkoutAnswer } from '~/lib/payments/checkout-answer.ts';
import { startDepositCheckout } from '~/lib/payments/deposits.server.ts';
import { PROOF_NOT_AVAILABLE } from '~/lib/proofs/proof-answers.server.ts';
import { proofWhere } from '~/lib/proofs/proofs.server.ts';

export const prerender = false;

/**
 * POST /api/p/{token}/deposit-checkout: a pay page for the approved proof's deposit, `{ url }`.
 * Public: the link is the permission (budget in route-budgets.ts). The body is never read: the
 * amount and currency are the deposit's own, whatever the browser sends.
 */
export const POST: APIRoute = async ({ params }) => {
  const token = params.token ?? '';
  if (!isWellFormedToken(token)) return problem(404, PROOF_NOT_AVAILABLE);
  return checkoutAnswer(await startDepositCheckout(proofWhere({ token }), { proofPath: `/p/${token}` }, new Date()));
};
