import type { APIRoute } from 'astro';
import { boardNotFound, boardTarget } from '~/lib/boards/board-responses.server.ts';
import { duplicateDesign } from '~/lib/db/designs.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** POST /api/designs/{id}/duplicate: a new board ("Copy of …") from the current revision. */
export const POST: APIRoute = async ({ locals, params }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const copy = await duplicateDesign(user, id);
  return copy ? json(copy, 201, { location: `/api/designs/${copy.id}` }) : boardNotFound();
};
