/** The Fret wire routes' one mapping from a query's outcome to an answer. */
import { json, problem } from '~/lib/http/problem.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import type { WireFailure, WireResult } from './fret-wires.server.ts';

export const WIRE_BODY_MAX_BYTES = 4 * 1024;

export function wireNotFound(): Response {
  return problem(404, 'No such fret wire');
}

const DUPLICATE_NAME = 'the shop already has a fret wire of this name';

const WIRE_FAILURES: FailureAnswers<WireFailure> = {
  not_found: () => wireNotFound(),
  duplicate_name: () => problem(409, `name: ${DUPLICATE_NAME}`, { field: 'name', issues: [{ path: 'name', message: DUPLICATE_NAME }] }),
};

/** 200 (or `status`) with the wire; 404 for another shop's or a missing one; 409 naming `name` for a name the shop has. */
export function wireAnswer(result: WireResult, status = 200): Response {
  if (result.ok) return json(result.wire, status, status === 201 ? { location: `/api/fret-wire/${result.wire.id}` } : {});
  return failureAnswer(result, WIRE_FAILURES);
}
