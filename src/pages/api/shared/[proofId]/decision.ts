import type { APIRoute } from 'astro';
import { CAN, requireRole } from '~/lib/auth/index.server.ts';
import { handleDecision } from '~/lib/proof-api/decision-endpoint.server.ts';
import { recordIdSchema } from '~/lib/schemas/proof.ts';

export const prerender = false;

/** A signed-in client answers a proof sent to their own e-mail by their own shop. */
export const POST: APIRoute = ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.viewProofs);
  if (!guard.ok) return guard.response;
  const id = recordIdSchema.safeParse(params.proofId);
  const locator = id.success ? { proofId: id.data, shopId: guard.user.shopId, clientEmail: guard.user.email } : null;
  return handleDecision(request, locator, `user:${guard.user.id}`, new Date());
};
