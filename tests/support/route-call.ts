/**
 * Calls an Astro API route module's handler directly, with the request and the context fields
 * routes read (locals.user, params, url, clientAddress). Middleware is not involved: the
 * signed-in user is given as it would have resolved it, and the same-origin check is
 * middleware's (tested there).
 */
import type { APIContext, APIRoute } from 'astro';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import type { TestUser } from './sessions.ts';

export const TEST_ORIGIN = 'http://127.0.0.1:4321';

export interface RouteCall {
  method?: string;
  /** Path and query, e.g. '/api/boards?q=x'. */
  path: string;
  /** The signed-in user; null or left out for a visitor. */
  user?: TestUser | SessionUser | null;
  params?: Record<string, string>;
  /** JSON-encoded (with a JSON Content-Type) unless it is already a string, FormData or bytes. */
  body?: unknown;
  headers?: Record<string, string>;
  /** The visitor's address (rate limits count per address). */
  clientAddress?: string;
}

export function sessionUser(user: TestUser | SessionUser): SessionUser {
  return {
    id: user.id,
    shopId: user.shopId,
    email: user.email,
    role: user.role,
    displayName: 'displayName' in user ? user.displayName : `Test ${user.role}`,
    preferredUnits: 'preferredUnits' in user ? user.preferredUnits : 'mm',
  };
}

export async function callRoute(route: APIRoute | undefined, call: RouteCall): Promise<Response> {
  if (!route) throw new Error(`route module has no handler for ${call.method ?? 'GET'} ${call.path}`);
  const url = new URL(call.path, TEST_ORIGIN);
  const headers = new Headers(call.headers);
  let body: BodyInit | null = null;
  if (call.body instanceof FormData || typeof call.body === 'string' || call.body instanceof Uint8Array) {
    body = call.body as BodyInit;
    if (typeof call.body === 'string' && !headers.has('content-type')) headers.set('content-type', 'application/json');
  } else if (call.body !== undefined) {
    body = JSON.stringify(call.body);
    if (!headers.has('content-type')) headers.set('content-type', 'application/json');
  }
  const request = new Request(url, { method: call.method ?? 'GET', headers, body });
  const context = {
    request,
    url,
    params: call.params ?? {},
    clientAddress: call.clientAddress ?? '192.0.2.1',
    locals: { user: call.user ? sessionUser(call.user) : null, sessionId: null },
  } as unknown as APIContext;
  return route(context);
}
