/**
 * Route guards: every API route and page calls one of these with the roles it allows. They return
 * a Response to send back (401/403) or the user to continue with.
 */
import type { Role } from '~/lib/db/schema.ts';
import { problem } from '~/lib/http/problem.ts';
import { hasRole, type SessionUser } from './session-user.ts';

export type Guarded = { ok: true; user: SessionUser } | { ok: false; response: Response };

/** For API routes: 401 when signed out, 403 when the role is not allowed. */
export function requireRole(user: SessionUser | null, allowed: readonly Role[]): Guarded {
  if (!user) return { ok: false, response: problem(401, 'Sign in first') };
  if (!hasRole(user, allowed)) return { ok: false, response: problem(403, 'Your role cannot do this') };
  return { ok: true, user };
}

/** For pages: redirect to sign-in when signed out, 403 page when the role is not allowed. */
export function requirePageRole(user: SessionUser | null, allowed: readonly Role[], url: URL): Guarded {
  if (!user) {
    const next = encodeURIComponent(url.pathname + url.search);
    return { ok: false, response: new Response(null, { status: 302, headers: { location: `/sign-in?next=${next}` } }) };
  }
  if (!hasRole(user, allowed)) {
    return { ok: false, response: new Response('Your role cannot open this page.', { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } }) };
  }
  return { ok: true, user };
}
