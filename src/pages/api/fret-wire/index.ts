import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json } from '~/lib/http/problem.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { fretWireInputSchema } from '~/lib/schemas/fret-wire.ts';
import { createWire, listWires } from '~/lib/wire/fret-wires.server.ts';
import { WIRE_BODY_MAX_BYTES, wireAnswer } from '~/lib/wire/wire-responses.server.ts';

export const prerender = false;

/** GET /api/fret-wire: the shop's Fret wire list (owners and builders; clients 403, visitors 401). */
export const GET: APIRoute = async ({ locals }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  return json(await listWires(db(), guard.value.shopId));
};

/** POST /api/fret-wire: adds a wire; 400 naming the field, 409 naming `name` for a name the shop has. */
export const POST: APIRoute = async ({ locals, request }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const input = await readValidJson(request, WIRE_BODY_MAX_BYTES, fretWireInputSchema);
  if (!input.ok) return input.response;
  return wireAnswer(await createWire(db(), guard.value.shopId, input.value), 201);
};
