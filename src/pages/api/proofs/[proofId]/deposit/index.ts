import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { depositsOn, setProofDeposit, type SetDepositResult } from '~/lib/payments/deposits.server.ts';
import { PAYMENTS_OFF_MESSAGE } from '~/lib/payments/payment-service.server.ts';
import { depositInputSchema } from '~/lib/schemas/deposit.ts';

export const prerender = false;

const BODY_MAX_BYTES = 4 * 1024;
const NO_PROOF = 'No such proof in your shop';

const ANSWERS: FailureAnswers<Exclude<SetDepositResult, { ok: true }>> = {
  not_found: () => problem(404, NO_PROOF),
  closed: () => problem(409, 'The client has answered this proof (or it was revoked); its deposit can no longer change'),
};

/**
 * PUT /api/proofs/{proofId}/deposit {amountMinor, currency?, description?}: attaches or changes
 * the deposit of a proof the client has not answered yet (owner or builder). 409 once answered
 * or revoked; 503 while deposits are off.
 */
export const PUT: APIRoute = async ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.proofId);
  if (id === null) return problem(404, NO_PROOF);
  const input = await readValidJson(request, BODY_MAX_BYTES, depositInputSchema);
  if (!input.ok) return input.response;
  if (!depositsOn()) return problem(503, PAYMENTS_OFF_MESSAGE, { field: 'deposit' });
  const result = await setProofDeposit(guard.value.shopId, id, guard.value.id, input.value);
  return result.ok ? json({ deposit: result.deposit }) : failureAnswer(result, ANSWERS);
};
