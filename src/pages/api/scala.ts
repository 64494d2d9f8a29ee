import type { APIRoute } from 'astro';
import { parseScl } from '~/lib/geometry/scala.ts';
import { readText } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';

export const prerender = false;

/** Largest .scl body accepted. */
const SCALA_BODY_MAX_BYTES = 64 * 1024;
const SCALA_BODY_TYPES = ['text/plain', 'application/octet-stream'] as const;

/**
 * POST /api/scala: the text of a .scl file in, the parsed scale out
 * (`{ description, pitches: [{ text, cents, ratio, line }], period }`), or 400 with the line.
 */
export const POST: APIRoute = async ({ request }) => {
  const body = await readText(request, { maxBytes: SCALA_BODY_MAX_BYTES, types: SCALA_BODY_TYPES });
  if (!body.ok) return body.response;
  const parsed = parseScl(body.value);
  if (!parsed.ok) {
    const { line, message } = parsed.error;
    return problem(400, `line ${line}: ${message}`, { field: 'scl', line });
  }
  return json(parsed.scale);
};

