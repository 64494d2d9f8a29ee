import type { APIRoute } from 'astro';
import { boardId, boardNotFound, checkDesign, requireBoardsUser, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { getDesign, updateDesign } from '~/lib/db/designs.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, json, problem, zodIssues } from '~/lib/http/problem.ts';
import { BOARD_FILE_MAX_BYTES, boardUpdateSchema } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';

export const prerender = false;

/** GET /api/designs/{id}[?revision=N]: the board with its current (or the named) revision's design. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const revisionParam = url.searchParams.get('revision');
  const revision = revisionParam === null ? undefined : boardId(revisionParam);
  if (revision === null) return problem(400, 'revision must be a whole number from 1', { field: 'revision' });
  const board = await getDesign(guard.user.shopId, id, revision);
  return board ? json(board) : boardNotFound();
};

/**
 * PATCH /api/designs/{id} {version, design?, instrumentType?, clientName?, note?}: saves over the
 * version the client last saw. A changed design becomes a new revision; a stale version is a 409.
 */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const body = await readJson(request, BOARD_FILE_MAX_BYTES);
  if (!body.ok) return body.response;
  const input = boardUpdateSchema.safeParse(body.value);
  if (!input.success) return invalid(zodIssues(input.error));
  let design: Design | undefined;
  if (input.data.design !== undefined) {
    const checked = checkDesign(input.data.design, 'design');
    if (!checked.ok) return invalid(checked.issues);
    design = checked.design;
  }
  return writeResponse(await updateDesign(guard.user, id, { ...input.data, design }));
};
