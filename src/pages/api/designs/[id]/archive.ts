import type { APIRoute } from 'astro';
import { boardTarget, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { setArchived } from '~/lib/db/designs.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, zodIssues } from '~/lib/http/problem.ts';
import { boardArchiveSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** POST /api/designs/{id}/archive {archived: true|false, version?}: archives or unarchives a board. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target;
  const body = await readJson(request, 4096);
  if (!body.ok) return body.response;
  const input = boardArchiveSchema.safeParse(body.value);
  if (!input.success) return invalid(zodIssues(input.error));
  return writeResponse(await setArchived(user, id, input.data.archived, input.data.version));
};
