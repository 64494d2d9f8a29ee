/**
 * CSRF defence for every state-changing request, JSON included. A browser always says where a
 * request comes from (Origin, or Sec-Fetch-Site); a cross-site one is refused. A request that
 * carries the session cookie must prove it is same-origin. Scripts and the command line, which
 * send no Origin and no cookie, can still call the public endpoints.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export interface OriginCheckInput {
  request: Request;
  allowedOrigins: readonly string[];
  hasSessionCookie: boolean;
}

function refererOrigin(request: Request): string | null {
  const referer = request.headers.get('referer');
  if (!referer) return null;
  try {
    return new URL(referer).origin;
  } catch {
    return 'invalid';
  }
}

export function isSameOriginRequest({ request, allowedOrigins, hasSessionCookie }: OriginCheckInput): boolean {
  if (SAFE_METHODS.has(request.method)) return true;
  const fetchSite = request.headers.get('sec-fetch-site');
  if (fetchSite === 'cross-site' || fetchSite === 'same-site') return false;
  const origin = request.headers.get('origin') ?? refererOrigin(request);
  if (origin) return allowedOrigins.includes(origin);
  return !hasSessionCookie;
}
