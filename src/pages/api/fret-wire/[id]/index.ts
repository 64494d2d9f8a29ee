import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { fretWireInputSchema } from '~/lib/schemas/fret-wire.ts';
import { deleteWire, getWire, updateWire } from '~/lib/wire/fret-wires.server.ts';
import { WIRE_BODY_MAX_BYTES, wireAnswer, wireNotFound } from '~/lib/wire/wire-responses.server.ts';

export const prerender = false;

/** GET /api/fret-wire/{id}: one wire of the shop; another shop's (or a malformed id) is a 404. */
export const GET: APIRoute = async ({ locals, params }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.id);
  const wire = id === null ? null : await getWire(db(), guard.value.shopId, id);
  return wire ? json(wire) : wireNotFound();
};

/** PUT /api/fret-wire/{id}: replaces the wire's sizes; 400 naming the field, 409 naming `name`. */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.id);
  if (id === null) return wireNotFound();
  const input = await readValidJson(request, WIRE_BODY_MAX_BYTES, fretWireInputSchema);
  if (!input.ok) return input.response;
  return wireAnswer(await updateWire(db(), guard.value.shopId, id, input.value));
};

/** DELETE /api/fret-wire/{id}: 204, or 404 for a wire the shop does not have. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(params.id);
  const deleted = id !== null && (await deleteWire(db(), guard.value.shopId, id));
  return deleted ? new Response(null, { status: 204 }) : wireNotFound();
};
