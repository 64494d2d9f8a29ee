import type { APIRoute } from 'astro';
import { boardNotFound, boardTarget, writeResponse } from '~/lib/boards/board-responses.server.ts';
import { listRevisions, saveRevision } from '~/lib/boards/boards.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json } from '~/lib/http/problem.ts';
import { boardSaveRevisionSchema } from '~/lib/schemas/board.ts';

export const prerender = false;

/** GET /api/boards/{id}/revisions: every revision, newest first, each with its design, reason and fingerprint. */
export const GET: APIRoute = async ({ locals, params }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const revisions = await listRevisions(user.shopId, id);
  return revisions ? json({ items: revisions }) : boardNotFound();
};

/**
 * POST /api/boards/{id}/revisions {version?, note?}: keeps the working copy as a revision (a
 * checkpoint a person chose). When the working copy already is a revision nothing new is made;
 * the answer is the board either way. A stale `version` is a 409.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const target = boardTarget(locals.user, params.id);
  if (!target.ok) return target.response;
  const { user, id } = target.value;
  const input = await readValidJson(request, 4096, boardSaveRevisionSchema);
  if (!input.ok) return input.response;
  return writeResponse(await saveRevision(user, id, input.value.version, input.value.note));
};
