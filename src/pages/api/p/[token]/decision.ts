import type { APIRoute } from 'astro';
import { isWellFormedToken } from '~/lib/auth/index.server.ts';
import { handleDecision } from '~/lib/proof-api/decision-endpoint.server.ts';

export const prerender = false;

/** Public: the link itself is the permission. */
export const POST: APIRoute = ({ params, request, clientAddress }) => {
  const token = params.token ?? '';
  return handleDecision(request, isWellFormedToken(token) ? { token } : null, clientAddress, new Date());
};
