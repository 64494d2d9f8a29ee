/**
 * Every request passes here: security headers and `Cache-Control: no-store`, a 308 for renamed API paths, the same-origin
 * (CSRF) check, the size of form posts to Astro Actions, the signed-in user, the route budgets of CPU-heavy public routes, and a 503
 * instead of a 500 when the database is down (rate limit counters live there too). Roles are
 * checked again in each route.
 */
import { defineMiddleware, sequence } from 'astro:middleware';
import { resolveSession } from '~/lib/auth/index.server.ts';
import { config } from '~/lib/config/env.server.ts';
import { isDbUnavailable } from '~/lib/db/db-errors.ts';
import { clientIp } from '~/lib/http/client-ip.ts';
import { actionBodyRefusal } from '~/lib/http/action-body.ts';
import { problem } from '~/lib/http/problem.ts';
import { renamedPath } from '~/lib/http/renamed-routes.ts';
import { ROUTE_BUDGETS, reserveFor, type Budget } from '~/lib/http/rate-budgets.ts';
import { consumeEach, type Counter } from '~/lib/http/rate-limit.server.ts';
import { limitedRouteFor } from '~/lib/http/route-budgets.ts';
import { isSameOriginRequest } from '~/lib/http/same-origin.ts';
import { PAYMENT_WEBHOOK_PATH } from '~/lib/payments/webhook-path.ts';
import { DYNAMIC_RESPONSE_HEADERS, withSecurityHeaders } from '~/lib/http/security-headers.ts';

const DB_DOWN_MESSAGE = 'The database is not answering right now; nothing was changed. Try again in a moment.';

const headers = defineMiddleware(async (_context, next) => withSecurityHeaders(await next(), DYNAMIC_RESPONSE_HEADERS));

/** Old API paths answer 308 to their new name (lib/http/renamed-routes.ts); nothing runs for them. */
const renamedRoutes = defineMiddleware((context, next) => {
  const to = renamedPath(context.url);
  return to === null ? next() : new Response(null, { status: 308, headers: { location: to } });
});

const sameOrigin = defineMiddleware((context, next) => {
  // The payment service's webhooks come from its servers, not a browser: the route checks their signature.
  if (context.request.method === 'POST' && context.url.pathname === PAYMENT_WEBHOOK_PATH) return next();
  // Only APP_ORIGIN: the request URL's own origin is built from an untrusted Host header.
  if (!isSameOriginRequest(context.request, [config().appOrigin])) {
    return problem(403, 'Cross-site request refused: the Origin header must be this site');
  }
  return next();
});

/**
 * Astro Actions read their whole form body themselves, with no limit: a form post to an action
 * must declare its length, at most the forms' limit, before it is read.
 */
const actionBodies = defineMiddleware((context, next) => actionBodyRefusal(context.request, context.url) ?? next());

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

const TOO_MANY_MESSAGE = 'Too many requests; wait a moment and try again.';

/** Counts the request against its route budget per client address and per signed-in user. */
const routeBudgets = defineMiddleware(async (context, next) => {
  const route = limitedRouteFor(context.request.method, context.url.pathname);
  if (!route) return next();
  const budgets = ROUTE_BUDGETS[route.budget];
  const whenDatabaseDown = route.needsDatabase ? 'refuse' : 'per-process';
  const counter = (who: 'address' | 'user', budget: Budget): Counter => ({
    name: `route-${route.budget}-${who}`,
    budget,
    whenDatabaseDown,
    reserve: reserveFor(budget, config().rateLimitScale),
  });
  const checks: [Counter, string][] = [[counter('address', budgets.perAddress), clientIp(context)]];
  const user = context.locals.user;
  if (user) checks.push([counter('user', budgets.perUser), user.id]);
  const verdict = await consumeEach(checks);
  if (verdict.ok) return next();
  const headers = { ...route.headers, 'retry-after': String(verdict.retryAfterSeconds) };
  if (context.url.pathname.startsWith('/api/')) return problem(429, TOO_MANY_MESSAGE, {}, headers);
  return new Response(TOO_MANY_MESSAGE, { status: 429, headers: { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store', ...headers } });
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

export const onRequest = sequence(headers, renamedRoutes, sameOrigin, actionBodies, databaseDown, session, routeBudgets);
