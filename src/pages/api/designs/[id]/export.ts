import type { APIRoute } from 'astro';
import { boardFile, fileStem } from '~/lib/boards/board-file.ts';
import { boardId, boardNotFound, requireBoardsUser } from '~/lib/boards/board-responses.server.ts';
import { getDesign } from '~/lib/db/designs.server.ts';
import { fretTableCsv } from '~/lib/export/csv.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';

export const prerender = false;

const FORMATS = {
  json: 'application/json; charset=utf-8',
  csv: 'text/csv; charset=utf-8',
} as const;
type Format = keyof typeof FORMATS;

/**
 * GET /api/designs/{id}/export?format=json|csv&revision=N: the board file (JSON, for import) or
 * its fret table (CSV), as a download. The current revision unless `revision` names another.
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const format = url.searchParams.get('format') ?? 'json';
  if (!Object.hasOwn(FORMATS, format)) {
    return problem(400, `format must be one of: ${Object.keys(FORMATS).join(', ')}`, { field: 'format' });
  }
  const revisionParam = url.searchParams.get('revision');
  const revision = revisionParam === null ? undefined : boardId(revisionParam);
  if (revision === null) return problem(400, 'revision must be a whole number from 1', { field: 'revision' });
  const board = await getDesign(guard.user.shopId, id, revision);
  if (!board) return boardNotFound();
  const body = format === 'csv' ? csvOf(board.design) : JSON.stringify(boardFile(board), null, 2);
  return new Response(body, {
    headers: {
      'content-type': FORMATS[format as Format],
      'content-disposition': `attachment; filename="${fileStem(board.name, board.revision)}.${format}"`,
      'cache-control': 'no-store',
    },
  });
};

/** Stored designs were validated when saved; validating again gives the typed, complete design. */
function csvOf(stored: unknown): string {
  const design = validateDesign(stored);
  if (!design.ok) throw new Error(`stored design no longer validates: ${design.issues[0]?.path}`);
  return fretTableCsv(computeLayout(design.design));
}
