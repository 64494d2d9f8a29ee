import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { refundDeposit, type RefundResult } from '~/lib/payments/deposits.server.ts';
import { refundInputSchema } from '~/lib/schemas/deposit.ts';

export const prerender = false;

const BODY_MAX_BYTES = 1024;

const ANSWERS: FailureAnswers<Exclude<RefundResult, { ok: true }>> = {
  not_found: (f) => problem(404, f.message),
  no_deposit: (f) => problem(409, f.message),
  not_paid: (f) => problem(409, f.message),
  too_much: (f) => problem(400, f.message, { field: 'amountMinor' }),
  off: (f) => problem(503, f.message),
  service: (f) => problem(502, f.message),
};

/**
 * POST /api/proofs/{proofId}/deposit/refunds {amountMinor?}: the owner refunds part or all of a
 * paid deposit through the payment service (without an amount: all that is left). 202: asked
 * for; it shows as refunded once the service's webhook confirms it.
 */
export const POST: APIRoute = async ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.refund);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.proofId);
  if (id === null) return problem(404, 'No such proof in your shop');
  const input = await readValidJson(request, BODY_MAX_BYTES, refundInputSchema);
  if (!input.ok) return input.response;
  const result = await refundDeposit(guard.value.shopId, id, guard.value.id, input.value, new Date());
  return result.ok ? json({ deposit: result.deposit }, 202) : failureAnswer(result, ANSWERS);
};
