import type { APIRoute } from 'astro';
import { CAN, requireRole } from '~/lib/auth/index.server.ts';
import { createProof, listDesignProofs } from '~/lib/db/proofs.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { createProofSchema, recordIdSchema } from '~/lib/schemas/proof.ts';

export const prerender = false;

const BODY_MAX_BYTES = 16 * 1024;
const NO_DESIGN = 'No such design in your shop';

/** The design's proofs with their state and answers, newest first. */
export const GET: APIRoute = async ({ params, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = recordIdSchema.safeParse(params.id);
  const list = id.success ? await listDesignProofs(guard.user.shopId, id.data, new Date()) : null;
  return list ? json({ proofs: list }) : problem(404, NO_DESIGN);
};

/** Shares the design's current revision with a client: 201 with the link (shown only this once). */
export const POST: APIRoute = async ({ params, request, locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = recordIdSchema.safeParse(params.id);
  if (!id.success) return problem(404, NO_DESIGN);
  const parsed = await readValidJson(request, BODY_MAX_BYTES, createProofSchema);
  if (!parsed.ok) return parsed.response;
  const created = await createProof(guard.user, id.data, parsed.value, new Date());
  return created ? json(created, 201) : problem(404, NO_DESIGN);
};
