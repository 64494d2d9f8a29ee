/**
 * CSRF defence for every state-changing request, forms and JSON alike: the Origin header (or,
 * failing that, the Referer) must be the app's own origin, and nothing the browser marks as
 * coming from another site passes. Scripts calling the public API send `Origin: <APP_ORIGIN>`.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function refererOrigin(request: Request): string | null {
  const referer = request.headers.get('referer');
  if (!referer) return null;
  try {
    return new URL(referer).origin;
  } catch {
    return null;
  }
}

export function isSameOriginRequest(request: Request, allowedOrigins: readonly string[]): boolean {
  if (SAFE_METHODS.has(request.method)) return true;
  const fetchSite = request.headers.get('sec-fetch-site');
  if (fetchSite === 'cross-site' || fetchSite === 'same-site') return false;
  const origin = request.headers.get('origin') ?? refererOrigin(request);
  return origin !== null && allowedOrigins.includes(origin);
}
