import type { APIRoute } from 'astro';
import { isWellFormedToken, sha256Hex } from '~/lib/auth/index.server.ts';
import { clientIp } from '~/lib/http/client-ip.ts';
import { handleDecision } from '~/lib/proofs/decision-endpoint.server.ts';

export const prerender = false;

/**
 * Public: the link itself is the permission. Answers are limited per visitor and per link, so
 * one visitor hammering one proof is stopped without locking out every other proof from the same
 * address (a shop's clients may share one office connection).
 */
export const POST: APIRoute = (context) => {
  const { params, request } = context;
  const token = params.token ?? '';
  const rateKey = `${clientIp(context)}:${sha256Hex(token).slice(0, 16)}`;
  return handleDecision(request, isWellFormedToken(token) ? { token } : null, rateKey, new Date());
};
