/**
 * The one role guard: every API route and page calls it with the roles it allows (lists in
 * `CAN`, lib/auth/session-user.ts). It gives the user to continue with, or the answer to send.
 */
import { hasRole, type SessionUser } from '~/lib/auth/session-user.ts';
import type { Role } from '~/lib/schemas/account.ts';
import { problem, type Checked } from './problem.ts';

/** For API routes: 401 when signed out, 403 when the role is not allowed. */
export function requireRole(user: SessionUser | null, allowed: readonly Role[]): Checked<SessionUser> {
  if (!user) return { ok: false, response: problem(401, 'Sign in first') };
  if (!hasRole(user, allowed)) return { ok: false, response: problem(403, 'Your role cannot do this') };
  return { ok: true, value: user };
}

/** For pages: redirect to sign-in when signed out, a 403 page when the role is not allowed. */
export function requirePageRole(user: SessionUser | null, allowed: readonly Role[], url: URL): Checked<SessionUser> {
  if (!user) {
    const next = encodeURIComponent(url.pathname + url.search);
    return { ok: false, response: new Response(null, { status: 302, headers: { location: `/sign-in?next=${next}` } }) };
  }
  if (!hasRole(user, allowed)) {
    return { ok: false, response: new Response('Your role cannot open this page.', { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } }) };
  }
  return { ok: true, value: user };
}
