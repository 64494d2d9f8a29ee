/**
 * Every request passes here: security headers and `Cache-Control: no-store`, the same-origin (CSRF) check, the signed-in user,
 * and a 503 instead of a 500 when the database is down. Roles are checked again in each route.
 */
import { defineMiddleware, sequence } from 'astro:middleware';
import { resolveSession } from '~/lib/auth/index.server.ts';
import { config } from '~/lib/config/env.server.ts';
import { isDbUnavailable } from '~/lib/db/db-errors.ts';
import { problem } from '~/lib/http/problem.ts';
import { isSameOriginRequest } from '~/lib/http/same-origin.ts';
import { DYNAMIC_RESPONSE_HEADERS, withSecurityHeaders } from '~/lib/http/security-headers.ts';

const DB_DOWN_MESSAGE = 'The database is not answering right now; nothing was changed. Try again in a moment.';

const headers = defineMiddleware(async (_context, next) => withSecurityHeaders(await next(), DYNAMIC_RESPONSE_HEADERS));

const sameOrigin = defineMiddleware((context, next) => {
  // Only APP_ORIGIN: the request URL's own origin is built from an untrusted Host header.
  if (!isSameOriginRequest(context.request, [config().appOrigin])) {
    return problem(403, 'Cross-site request refused: the Origin header must be this site');
  }
  return next();
});

const session = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.sessionId = null;
  if (context.url.pathname === '/api/health' || context.url.pathname.startsWith('/_astro/')) return next();
  const resolved = await resolveSession(context.cookies);
  if (resolved) {
    context.locals.user = resolved.user;
    context.locals.sessionId = resolved.sessionId;
  }
  return next();
});

const databaseDown = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
    if (!isDbUnavailable(error)) throw error;
    if (context.url.pathname.startsWith('/api/')) return problem(503, DB_DOWN_MESSAGE, {}, { 'retry-after': '5' });
    return new Response(DB_DOWN_MESSAGE, { status: 503, headers: { 'content-type': 'text/plain; charset=utf-8', 'retry-after': '5' } });
  }
});

export const onRequest = sequence(headers, sameOrigin, databaseDown, session);
