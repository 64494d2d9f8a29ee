import type { APIRoute } from 'astro';
import { boardTarget, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { restoreRevision } from '~/lib/db/designs.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, zodIssues } from '~/lib/http/problem.ts';
import { boardRestoreSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** POST /api/designs/{id}/restore {revision, version}: copies an old revision into a new one. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target;
  const body = await readJson(request, 4096);
  if (!body.ok) return body.response;
  const input = boardRestoreSchema.safeParse(body.value);
  if (!input.success) return invalid(zodIssues(input.error));
  return writeResponse(await restoreRevision(user, id, input.data.revision, input.data.version));
};
