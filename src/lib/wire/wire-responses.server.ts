/** The Fret wire routes' one mapping from a query's outcome to an answer. */
import { json, problem } from '~/lib/http/problem.ts';
import type { WireResult } from './fret-wires.server.ts';

export const WIRE_BODY_MAX_BYTES = 4 * 1024;

export function wireNotFound(): Response {
  return problem(404, 'No such fret wire');
}

/** 200 (or `status`) with the wire; 404 for another shop's or a missing one; 409 naming `name` for a name the shop has. */
export function wireAnswer(result: WireResult, status = 200): Response {
  if (result.ok) return json(result.wire, status, status === 201 ? { location: `/api/fret-wire/${result.wire.id}` } : {});
  return result.reason === 'not_found'
    ? wireNotFound()
    : problem(409, 'name: the shop already has a fret wire of this name', { field: 'name', issues: [{ path: 'name', message: 'the shop already has a fret wire of this name' }] });
}
