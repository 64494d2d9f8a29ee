/** The sign-in module's public face: import from here, never from the session library. */
export { startSession, rotateSession, resolveSession, endSession, endOtherSessions, endAllSessions, SESSION_COOKIE } from './sessions.server.ts';
export { hashPassword, verifyPassword, MIN_PASSWORD_LENGTH } from './passwords.server.ts';
export { CAN, hasRole, type SessionUser } from './session-user.ts';
export { newToken, sha256Hex, isWellFormedToken } from './tokens.server.ts';
