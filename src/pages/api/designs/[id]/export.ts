import type { APIRoute } from 'astro';
import { shopName } from '~/lib/accounts/users.server.ts';
import { boardFile } from '~/lib/boards/board-file.ts';
import { requestedBoard, storedDesign } from '~/lib/boards/board-responses.server.ts';
import { designExportResponse } from '~/lib/export/design-export.server.ts';
import { attachmentHeader, exportFileName } from '~/lib/export/file-name.ts';
import { invalid } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';

export const prerender = false;

/**
 * GET /api/designs/{id}/export?format=pdf|dxf|svg|csv|json&revision=N&…options: a saved board as
 * a download, from its current revision unless `revision` names another. pdf (paper template),
 * dxf and svg (slot paths) and csv (fret table) take the export options (paper, slots, …);
 * json is the board file that Boards imports. Caps and the worker pool as for POST /api/export.
 */
export const GET: APIRoute = ({ locals, params, url, request }) => answerOrServerError('The export', async () => {
  const { revision, ...query } = Object.fromEntries(url.searchParams);
  const found = await requestedBoard(locals.user, params.id, revision);
  if (!found.ok) return found.response;
  const { user, board } = found.value;
  const options = validateExportOptions({ format: 'json', ...query });
  if (!options.ok) return invalid(options.issues);

  if (options.options.format === 'json') {
    return new Response(JSON.stringify(boardFile(board), null, 2), {
      headers: {
        'content-type': 'application/json; charset=utf-8',
        'content-disposition': attachmentHeader(exportFileName(board.name, { kind: 'board-file', revision: board.revision })),
        'cache-control': 'no-store',
      },
    });
  }
  return designExportResponse(storedDesign(board.design), options.options, { revision: board.revision, shopName: await shopName(user.shopId) }, request.signal);
});
