/**
 * CSRF defence for every state-changing request, JSON included: the browser's Origin header
 * (or, failing that, Referer) must be the app's own origin.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function isSameOriginRequest(request: Request, allowedOrigins: readonly string[]): boolean {
  if (SAFE_METHODS.has(request.method)) return true;
  const origin = request.headers.get('origin');
  if (origin) return allowedOrigins.includes(origin);
  const referer = request.headers.get('referer');
  if (!referer) return false;
  try {
    return allowedOrigins.includes(new URL(referer).origin);
  } catch {
    return false;
  }
}
