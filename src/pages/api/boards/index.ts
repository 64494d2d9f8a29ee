import type { APIRoute } from 'astro';
import { checkDesign } from '~/lib/boards/board-responses.server.ts';
import { CAN } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { createBoard, listBoards } from '~/lib/boards/boards.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { invalid, json, zodIssues } from '~/lib/http/problem.ts';
import { BOARD_FILE_MAX_BYTES, boardCreateSchema, boardListQuerySchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** GET /api/boards?q=&status=&instrument=&units=&sort=&dir=&page=&pageSize= : one page of boards. */
export const GET: APIRoute = async ({ locals, url }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const query = boardListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return invalid(zodIssues(query.error));
  return json(await listBoards(guard.value.shopId, query.data));
};

/** POST /api/boards {design, instrumentType?, clientName?, note?}: a new board at revision 1. */
export const POST: APIRoute = async ({ locals, request }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const input = await readValidJson(request, BOARD_FILE_MAX_BYTES, boardCreateSchema);
  if (!input.ok) return input.response;
  const design = checkDesign(input.value.design, 'design');
  if (!design.ok) return invalid(design.issues);
  const created = await createBoard(guard.value, { ...input.value, design: design.design });
  return json(created, 201, { location: `/api/boards/${created.id}` });
};
