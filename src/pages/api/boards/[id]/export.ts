import type { APIRoute } from 'astro';
import { shopName } from '~/lib/accounts/users.server.ts';
import { boardFile } from '~/lib/boards/board-file.ts';
import { boardNotFound, requestedBoard, storedDesign } from '~/lib/boards/board-responses.server.ts';
import { exportRevision } from '~/lib/boards/boards.server.ts';
import { designExportResponse } from '~/lib/export/design-export.server.ts';
import { attachmentHeader, exportFileName } from '~/lib/export/file-name.ts';
import { invalid } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { approvalWarning } from '~/lib/proofs/board-approval.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { boardWire } from '~/lib/wire/board-wire.server.ts';

export const prerender = false;

/**
 * GET /api/boards/{id}/export?format=pdf|dxf|svg|csv|json|gcode|cutlist|cutsheet&revision=N&…options: a saved board as
 * a download, from the named revision, or else from its working copy, which is kept as a revision
 * first when it has changes not yet in one (so every print names a revision: the file name, the
 * title block or header comment carry its number and fingerprint). pdf (paper template), dxf and
 * svg (slot paths) and csv (fret table) take the export options (paper, slots, …); json is the
 * board file that Boards imports; gcode, cutlist and cutsheet are the machine files (docs/exports.md). Caps and the worker pool as for POST /api/export.
 */
export const GET: APIRoute = ({ locals, params, url, request }) => answerOrServerError('The export', async () => {
  const { revision: revisionParam, ...query } = Object.fromEntries(url.searchParams);
  const found = await requestedBoard(locals.user, params.id, revisionParam);
  if (!found.ok) return found.response;
  const { user, revision: asked } = found.value;
  const options = validateExportOptions({ format: 'json', ...query });
  if (!options.ok) return invalid(options.issues);
  const board = asked === undefined ? await exportRevision(user, found.value.board.id) : found.value.board;
  if (!board || board.revision === null) return boardNotFound();
  const revision = board.revision;

  if (options.options.format === 'json') {
    return new Response(JSON.stringify(boardFile({ ...board, revision }), null, 2), {
      headers: {
        'content-type': 'application/json; charset=utf-8',
        'content-disposition': attachmentHeader(exportFileName(board.name, { kind: 'board-file', revision })),
        'cache-control': 'no-store',
      },
    });
  }
  const design = storedDesign(board.design);
  return designExportResponse(design, options.options, {
    revision,
    fingerprint: board.fingerprint,
    approvalWarning: approvalWarning(board.approval, board.fingerprint),
    shopName: await shopName(user.shopId),
    wire: await boardWire(user, design),
  }, request.signal);
});
