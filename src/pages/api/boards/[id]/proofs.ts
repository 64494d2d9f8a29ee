import type { APIRoute } from 'astro';
import { CAN, hasRole } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { createProof, listDesignProofs } from '~/lib/proofs/proofs.server.ts';
import { inMinutes } from '~/lib/accounts/limits.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { limitMail } from '~/lib/mail/mail-budgets.server.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { createProofSchema } from '~/lib/schemas/proof.ts';
import { depositsOn, shopCurrency } from '~/lib/payments/deposits.server.ts';
import { db } from '~/lib/db/client.server.ts';
import type { DepositSettings } from '~/lib/schemas/deposit.ts';
import { PAYMENTS_OFF_MESSAGE } from '~/lib/payments/payment-service.server.ts';

export const prerender = false;

const BODY_MAX_BYTES = 16 * 1024;
const NO_BOARD = 'No such board in your shop';

/** The design's proofs with their state and answers, newest first. */
export const GET: APIRoute = async ({ params, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.id);
  const list = id !== null ? await listDesignProofs(guard.value.shopId, id, new Date()) : null;
  if (!list) return problem(404, NO_BOARD);
  const deposits: DepositSettings = {
    defaultCurrency: await shopCurrency(db(), guard.value.shopId),
    offMessage: depositsOn() ? null : PAYMENTS_OFF_MESSAGE,
    canRefund: hasRole(guard.value, CAN.refund),
  };
  return json({ proofs: list, deposits });
};

/**
 * Shares the design's current revision with a client: 201 with the link (shown only this once).
 * Each proof e-mails the client, so it counts against the sender's and the shop's mail budgets
 * (429 with Retry-After once they are used).
 */
export const POST: APIRoute = async ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.id);
  if (id === null) return problem(404, NO_BOARD);
  const parsed = await readValidJson(request, BODY_MAX_BYTES, createProofSchema);
  if (!parsed.ok) return parsed.response;
  if (parsed.value.deposit && !depositsOn()) return problem(503, PAYMENTS_OFF_MESSAGE, { field: 'deposit' });
  const now = new Date();
  const mail = await limitMail('proof', { userId: guard.value.id, shopId: guard.value.shopId }, now);
  if (!mail.ok) {
    return problem(429, `This shop has sent as many proofs as it may for now; try again ${inMinutes(mail.retryAfterSeconds)}`, {}, { 'retry-after': String(mail.retryAfterSeconds) });
  }
  const created = await createProof(guard.value, id, parsed.value, now);
  return created ? json(created, 201) : problem(404, NO_BOARD);
};
