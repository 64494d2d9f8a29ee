import type { APIRoute } from 'astro';
import { shopName } from '~/lib/accounts/users.server.ts';
import { boardFile, fileStem } from '~/lib/boards/board-file.ts';
import { boardId, boardNotFound, requireBoardsUser } from '~/lib/boards/board-responses.server.ts';
import { getDesign } from '~/lib/db/designs.server.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { attachmentHeader } from '~/lib/export/file-name.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';

export const prerender = false;

/**
 * GET /api/designs/{id}/export?format=pdf|dxf|svg|csv|json&revision=N&…options: a saved board as
 * a download, from its current revision unless `revision` names another. pdf (paper template),
 * dxf and svg (slot paths) and csv (fret table) take the export options (paper, slots, …);
 * json is the board file that Boards imports.
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const guard = requireBoardsUser(locals.user);
  if (!guard.ok) return guard.response;
  const id = boardId(params.id);
  if (id === null) return boardNotFound();
  const { revision: revisionParam, ...query } = Object.fromEntries(url.searchParams);
  const revision = revisionParam === undefined ? undefined : boardId(revisionParam);
  if (revision === null) return problem(400, 'revision must be a whole number from 1', { field: 'revision' });
  const options = validateExportOptions({ format: 'json', ...query });
  if (!options.ok) return invalid(options.issues);
  const board = await getDesign(guard.user.shopId, id, revision);
  if (!board) return boardNotFound();

  if (options.options.format === 'json') {
    return new Response(JSON.stringify(boardFile(board), null, 2), {
      headers: {
        'content-type': 'application/json; charset=utf-8',
        'content-disposition': attachmentHeader(`${fileStem(board.name, board.revision)}.json`),
        'cache-control': 'no-store',
      },
    });
  }
  // Stored designs were validated when saved; validating again gives the typed, complete design.
  const design = validateDesign(board.design);
  if (!design.ok) throw new Error(`stored design no longer validates: ${design.issues[0]?.path}`);
  const file = await exportDesign(design.design, options.options, { revision: board.revision, shopName: await shopName(guard.user.shopId) });
  return new Response(new Uint8Array(file.bytes), {
    headers: {
      'content-type': file.contentType,
      'content-disposition': attachmentHeader(file.filename),
      'cache-control': 'no-store',
    },
  });
};
