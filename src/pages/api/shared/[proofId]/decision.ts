import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { handleDecision } from '~/lib/proofs/decision-endpoint.server.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';

export const prerender = false;

/** A signed-in client answers a proof sent to their own e-mail by their own shop. */
export const POST: APIRoute = ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.viewProofs);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.proofId);
  const locator = id !== null ? { proofId: id, shopId: guard.value.shopId, clientEmail: guard.value.email } : null;
  return handleDecision(request, locator, `user:${guard.value.id}`, new Date());
};
