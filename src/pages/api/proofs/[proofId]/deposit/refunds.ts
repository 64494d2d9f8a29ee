import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { refundDeposit, type RefundResult } from '~/lib/payments/deposits.server.ts';
import { refundInputSchema } from '~/lib/schemas/deposit.ts';

export const prerender = false;

const BODY_MAX_BYTES = 1024;

const STATUS: Record<Exclude<RefundResult, { ok: true }>['reason'], number> = {
  not_found: 404,
  no_deposit: 409,
  not_paid: 409,
  too_much: 400,
  off: 503,
  service: 502,
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
  if (result.ok) return json({ deposit: result.deposit }, 202);
  return problem(STATUS[result.reason], result.message, result.reason === 'too_much' ? { field: 'amountMinor' } : {});
};
