import type { APIRoute } from 'astro';
import { boardId, boardNotFound, requireBoardsUser } from '~/lib/boards/board-responses.server.ts';
import { getDesign } from '~/lib/db/designs.server.ts';
import { boardThumbnailSvg } from '~/lib/export/board-thumbnail.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';

export const prerender = false;

/**
 * GET /api/designs/{id}/thumbnail.svg?revision=N: a small drawing of the board for the list.
 * A revision never changes, so a URL naming one may be cached by the browser.
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const revisionParam = url.searchParams.get('revision');
  const revision = revisionParam === null ? undefined : boardId(revisionParam);
  if (revision === null) return problem(400, 'revision must be a whole number from 1', { field: 'revision' });
  const board = await getDesign(guard.user.shopId, id, revision);
  if (!board) return boardNotFound();
  const design = validateDesign(board.design);
  if (!design.ok) throw new Error(`stored design no longer validates: ${design.issues[0]?.path}`);
  return new Response(boardThumbnailSvg(computeLayout(design.design)), {
    headers: {
      'content-type': 'image/svg+xml',
      'cache-control': revision === undefined ? 'private, no-cache' : 'private, max-age=86400',
    },
  });
};
