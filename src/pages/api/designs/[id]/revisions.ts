import type { APIRoute } from 'astro';
import { boardId, boardNotFound, requireBoardsUser } from '~/lib/boards/board-responses.server.ts';
import { listRevisions } from '~/lib/db/designs.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** GET /api/designs/{id}/revisions: every revision, newest first, each with its design. */
export const GET: APIRoute = async ({ locals, params }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const revisions = await listRevisions(guard.user.shopId, id);
  return revisions ? json({ items: revisions }) : boardNotFound();
};
