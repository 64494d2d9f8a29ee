/**
 * Calls an Astro API route module's handler directly, with the request and the context fields the
 * Boards routes read (locals.user, params, url). Middleware is not involved: the signed-in user is
 * given as it would have resolved it.
 */
import type { APIContext, APIRoute } from 'astro';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import type { TestUser } from './sessions.ts';

export const TEST_ORIGIN = 'http://127.0.0.1:4321';

export interface RouteCall {
  method?: string;
  /** Path and query, e.g. '/api/designs?q=x'. */
  path: string;
  user: TestUser | SessionUser | null;
  params?: Record<string, string>;
  /** JSON-encoded unless it is already a string, FormData or bytes. */
  body?: unknown;
  headers?: Record<string, string>;
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
  let body: BodyInit | undefined;
  if (call.body instanceof FormData || typeof call.body === 'string' || call.body instanceof Uint8Array) {
    body = call.body as BodyInit;
  } else if (call.body !== undefined) {
    body = JSON.stringify(call.body);
    if (!headers.has('content-type')) headers.set('content-type', 'application/json');
  }
  const request = new Request(url, { method: call.method ?? 'GET', headers, body: body ?? null });
  const context = {
    request,
    url,
    params: call.params ?? {},
    locals: { user: call.user ? sessionUser(call.user) : null, sessionId: null },
  } as unknown as APIContext;
  return route(context);
}
