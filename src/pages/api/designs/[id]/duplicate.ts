import type { APIRoute } from 'astro';
import { boardId, boardNotFound, requireBoardsUser } from '~/lib/boards/board-responses.server.ts';
import { duplicateDesign } from '~/lib/db/designs.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** POST /api/designs/{id}/duplicate: a new board ("Copy of …") from the current revision. */
export const POST: APIRoute = async ({ locals, params }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const copy = await duplicateDesign(guard.user, id);
  return copy ? json(copy, 201, { location: `/api/designs/${copy.id}` }) : boardNotFound();
};
