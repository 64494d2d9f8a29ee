import type { APIRoute } from 'astro';
import { boardTarget, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { setArchived } from '~/lib/boards/boards.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';

import { boardArchiveSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** POST /api/boards/{id}/archive {archived: true|false, version?}: archives or unarchives a board. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const input = await readValidJson(request, 4096, boardArchiveSchema);
  if (!input.ok) return input.response;
  return writeResponse(await setArchived(user, id, input.value.archived, input.value.version));
};
