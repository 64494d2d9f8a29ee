import type { APIRoute } from 'astro';
import { boardTarget, checkDesign, requestedBoard, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { updateBoard } from '~/lib/boards/boards.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { invalid, json } from '~/lib/http/problem.ts';
import { BOARD_FILE_MAX_BYTES, boardUpdateSchema } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';

export const prerender = false;

/** GET /api/boards/{id}[?revision=N]: the board with its current (or the named) revision's design. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const found = await requestedBoard(locals.user, params.id, url.searchParams.get('revision'));
  return found.ok ? json(found.value.board) : found.response;
};

/**
 * PATCH /api/boards/{id} {version, design?, instrumentType?, clientName?, note?}: saves over the
 * version the client last saw. A changed design becomes a new revision; a stale version is a 409.
 */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const input = await readValidJson(request, BOARD_FILE_MAX_BYTES, boardUpdateSchema);
  if (!input.ok) return input.response;
  let design: Design | undefined;
  if (input.value.design !== undefined) {
    const checked = checkDesign(input.value.design, 'design');
    if (!checked.ok) return invalid(checked.issues);
    design = checked.design;
  }
  return writeResponse(await updateBoard(user, id, { ...input.value, design }));
};
