import type { APIRoute } from 'astro';
import { boardNotFound, boardTarget } from '~/lib/boards/board-responses.server.ts';
import { listRevisions } from '~/lib/db/designs.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** GET /api/designs/{id}/revisions: every revision, newest first, each with its design. */
export const GET: APIRoute = async ({ locals, params }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const revisions = await listRevisions(user.shopId, id);
  return revisions ? json({ items: revisions }) : boardNotFound();
};
