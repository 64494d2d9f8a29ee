import type { APIRoute } from 'astro';
import { boardTarget, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { restoreRevision } from '~/lib/boards/boards.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';

import { boardRestoreSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/**
 * POST /api/boards/{id}/restore {revision, version, confirmApprovalChange?}: makes an old revision
 * the working copy again (no new revision: the working copy equals that one). Moving an approved
 * board off its approved layout is a 409 `approval_change` until confirmed.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const input = await readValidJson(request, 4096, boardRestoreSchema);
  if (!input.ok) return input.response;
  return writeResponse(await restoreRevision(user, id, input.value.revision, input.value.version, input.value.confirmApprovalChange));
};
