/**
 * GET/POST /api/fret-wire and GET/PUT/DELETE /api/fret-wire/{id}: the shop's Fret wire list.
 * Owners and builders only (clients 403, visitors 401); another shop's wire is a 404; bad input a
 * 400 naming the field; a name the shop already has a 409 naming `name`.
 */
import { CAN, requireRole, type SessionUser } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { parseRecordId } from '~/lib/http/record-id.ts';
import { fretWireInputSchema } from '~/lib/schemas/fret-wire.ts';
import { createWire, deleteWire, getWire, listWires, updateWire, type WireResult } from './fret-wires.server.ts';

const BODY_MAX_BYTES = 4 * 1024;
const NOT_FOUND = 'No such fret wire';

function answer(result: WireResult, status = 200): Response {
  if (result.ok) return json(result.wire, status, status === 201 ? { location: `/api/fret-wire/${result.wire.id}` } : {});
  return result.reason === 'not_found'
    ? problem(404, NOT_FOUND)
    : problem(409, 'name: the shop already has a fret wire of this name', { field: 'name', issues: [{ path: 'name', message: 'the shop already has a fret wire of this name' }] });
}

export async function listRoute(user: SessionUser | null): Promise<Response> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard.response;
  return json(await listWires(db(), guard.user.shopId));
}

export async function createRoute(user: SessionUser | null, request: Request): Promise<Response> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard.response;
  const input = await readValidJson(request, BODY_MAX_BYTES, fretWireInputSchema);
  if (!input.ok) return input.response;
  return answer(await createWire(db(), guard.user.shopId, input.value), 201);
}

export async function readRoute(user: SessionUser | null, rawId: string | undefined): Promise<Response> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(rawId);
  const wire = id === null ? null : await getWire(db(), guard.user.shopId, id);
  return wire ? json(wire) : problem(404, NOT_FOUND);
}

export async function updateRoute(user: SessionUser | null, rawId: string | undefined, request: Request): Promise<Response> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(rawId);
  if (id === null) return problem(404, NOT_FOUND);
  const input = await readValidJson(request, BODY_MAX_BYTES, fretWireInputSchema);
  if (!input.ok) return input.response;
  return answer(await updateWire(db(), guard.user.shopId, id, input.value));
}

export async function deleteRoute(user: SessionUser | null, rawId: string | undefined): Promise<Response> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard.response;
  const id = parseRecordId(rawId);
  const deleted = id !== null && (await deleteWire(db(), guard.user.shopId, id));
  return deleted ? new Response(null, { status: 204 }) : problem(404, NOT_FOUND);
}
