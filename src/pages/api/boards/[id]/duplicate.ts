import type { APIRoute } from 'astro';
import { boardNotFound, boardTarget } from '~/lib/boards/board-responses.server.ts';
import { duplicateBoard } from '~/lib/boards/boards.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** POST /api/boards/{id}/duplicate: a new board ("Copy of …") from the current revision. */
export const POST: APIRoute = async ({ locals, params }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const copy = await duplicateBoard(user, id);
  return copy ? json(copy, 201, { location: `/api/boards/${copy.id}` }) : boardNotFound();
};
