import type { APIRoute } from 'astro';
import { CAN, requireRole } from '~/lib/auth/index.server.ts';
import { revokeProof } from '~/lib/db/proofs.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { recordIdSchema } from '~/lib/schemas/proof.ts';

export const prerender = false;

/** Revokes a proof of the shop: its link then answers like an unknown one. */
export const POST: APIRoute = async ({ params, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = recordIdSchema.safeParse(params.proofId);
  const proof = id.success ? await revokeProof(guard.user.shopId, id.data, new Date()) : null;
  return proof ? json({ proof }) : problem(404, 'No such proof in your shop');
};
