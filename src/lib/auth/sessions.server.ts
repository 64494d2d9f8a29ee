/**
 * Sign-in sessions. The cookie carries a random token; the database keeps only its SHA-256 as
 * the session id, so a leaked database cannot be replayed as cookies.
 */
import type { AstroCookies } from 'astro';
import { lucia } from './lucia.server.ts';
import { newToken, sha256Hex } from './tokens.server.ts';
import type { SessionUser } from './session-user.ts';

export const SESSION_COOKIE = 'kerfline_session';

export interface ResolvedSession {
  sessionId: string;
  user: SessionUser;
}

function setCookie(cookies: AstroCookies, value: string, expire: boolean): void {
  const cookie = expire ? lucia().createBlankSessionCookie() : lucia().createSessionCookie(value);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

/** Starts a new session for `userId` and sets the cookie (a new token every sign-in). */
export async function startSession(cookies: AstroCookies, userId: string): Promise<void> {
  const token = newToken();
  await lucia().createSession(userId, {}, { sessionId: sha256Hex(token) });
  setCookie(cookies, token, false);
}

/**
 * Signs a user in on this browser: the session the browser had before (if any) ends and a new
 * one starts, so a session id planted before sign-in is worthless afterwards.
 */
export async function rotateSession(cookies: AstroCookies, previousSessionId: string | null, userId: string): Promise<void> {
  if (previousSessionId) await lucia().invalidateSession(previousSessionId);
  await startSession(cookies, userId);
}

/** Reads the cookie and returns the signed-in user, refreshing or clearing the cookie as needed. */
export async function resolveSession(cookies: AstroCookies): Promise<ResolvedSession | null> {
  const token = cookies.get(SESSION_COOKIE)?.value;
  if (!token) return null;
  const { session, user } = await lucia().validateSession(sha256Hex(token));
  if (!session || !user) {
    setCookie(cookies, '', true);
    return null;
  }
  if (session.fresh) setCookie(cookies, token, false);
  return {
    sessionId: session.id,
    user: {
      id: user.id,
      shopId: user.shopId,
      email: user.email,
      displayName: user.displayName,
      role: user.role,
      preferredUnits: user.preferredUnits,
    },
  };
}

export async function endSession(cookies: AstroCookies, sessionId: string): Promise<void> {
  await lucia().invalidateSession(sessionId);
  setCookie(cookies, '', true);
}

/** Ends every session of a user except `keepSessionId` (password change, sign-out elsewhere). */
export async function endOtherSessions(userId: string, keepSessionId?: string): Promise<void> {
  const all = await lucia().getUserSessions(userId);
  await Promise.all(all.filter((s) => s.id !== keepSessionId).map((s) => lucia().invalidateSession(s.id)));
}

/** Signs the user out everywhere: every session ends and this browser's cookie is cleared. */
export async function endAllSessions(cookies: AstroCookies, userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
  setCookie(cookies, '', true);
}
