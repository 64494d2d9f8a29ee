import type { APIRoute } from 'astro';
import { requestedBoard, storedDesign } from '~/lib/boards/board-responses.server.ts';
import { boardThumbnailSvg } from '~/lib/export/board-thumbnail.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';

export const prerender = false;

/**
 * GET /api/boards/{id}/thumbnail.svg?revision=N: a small drawing of the board for the list.
 * Like every answer with shop data it is not cached (the middleware sends no-store).
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const found = await requestedBoard(locals.user, params.id, url.searchParams.get('revision'));
  if (!found.ok) return found.response;
  return new Response(boardThumbnailSvg(computeLayout(storedDesign(found.value.board.design))), {
    headers: { 'content-type': 'image/svg+xml' },
  });
};
