/**
 * Calls an Astro API route module's handler directly with the context fields routes read
 * (locals.user, params, url, clientAddress). Middleware is not involved: the signed-in user is
 * given as it would have resolved it, and the same-origin check is middleware's (tested there).
 */
import type { APIContext, APIRoute } from 'astro';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import type { TestUser } from './sessions.ts';

export const TEST_ORIGIN = 'http://127.0.0.1:4321';

export interface RouteCall {
  method?: string;
  path: string;
  user?: TestUser | null;
  params?: Record<string, string>;
  /** JSON-encoded unless it is already a string. */
  body?: unknown;
  /** The visitor's address (rate limits count per address). */
  clientAddress?: string;
}

function sessionUser(user: TestUser): SessionUser {
  return { id: user.id, shopId: user.shopId, email: user.email, role: user.role, displayName: `Test ${user.role}`, preferredUnits: 'mm' };
}

export function callRoute(route: APIRoute | undefined, call: RouteCall): Promise<Response> {
  if (!route) throw new Error(`route module has no handler for ${call.method ?? 'GET'} ${call.path}`);
  const url = new URL(call.path, TEST_ORIGIN);
  const body = call.body === undefined ? null : typeof call.body === 'string' ? call.body : JSON.stringify(call.body);
  const headers = body === null ? {} : { 'content-type': 'application/json' };
  const request = new Request(url, { method: call.method ?? 'GET', headers, body });
  const context = {
    request,
    url,
    params: call.params ?? {},
    clientAddress: call.clientAddress ?? '192.0.2.1',
    locals: { user: call.user ? sessionUser(call.user) : null, sessionId: null },
  } as unknown as APIContext;
  return Promise.resolve(route(context));
}
