import type { APIRoute } from 'astro';
import { boardId, boardNotFound, requireBoardsUser, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { restoreRevision } from '~/lib/db/designs.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, zodIssues } from '~/lib/http/problem.ts';
import { boardRestoreSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** POST /api/designs/{id}/restore {revision, version}: copies an old revision into a new one. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const body = await readJson(request, 4096);
  if (!body.ok) return body.response;
  const input = boardRestoreSchema.safeParse(body.value);
  if (!input.success) return invalid(zodIssues(input.error));
  return writeResponse(await restoreRevision(guard.user, id, input.data.revision, input.data.version));
};
