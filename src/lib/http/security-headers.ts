/**
 * Headers every response carries. Pages also get Astro's hashed CSP (astro.config.mjs); its
 * directives are kept and ours (frame-ancestors, which Astro does not emit) are added to it, so a
 * page has one policy with both. The values live in JSON so scripts/serve-built-app.mjs can put
 * them on the static files the adapter serves before this middleware runs.
 */
import headers from './security-headers.json';

export const SECURITY_HEADERS: Readonly<Record<string, string>> = headers;

const CSP = 'content-security-policy';

function directiveName(directive: string): string {
  return directive.trim().split(/\s+/)[0]!.toLowerCase();
}

/** `policy` with every directive of `base` that it does not set itself appended. */
export function mergeCsp(policy: string, base: string): string {
  const present = new Set(policy.split(';').filter((d) => d.trim()).map(directiveName));
  const missing = base.split(';').filter((d) => d.trim() && !present.has(directiveName(d)));
  if (missing.length === 0) return policy;
  const kept = policy.trim().replace(/;$/, '');
  return [kept, ...missing.map((d) => d.trim())].join('; ');
}

/**
 * What every answer the app itself builds (pages and API, not the static files) carries: nothing
 * it sends may be kept by a browser or a shared cache, since pages and answers show shop data,
 * proofs and one-time links. This replaces any weaker policy a route set; one that already says
 * no-store is kept.
 */
export const DYNAMIC_RESPONSE_HEADERS: Readonly<Record<string, string>> = { 'cache-control': 'no-store' };

/** The headers a response should carry: its own, every missing security header, then `forced`. */
export function securedHeaders(existing: Headers, forced: Readonly<Record<string, string>> = {}): Headers {
  const result = new Headers(existing);
  for (const [name, value] of Object.entries(forced)) {
    // A route that already forbids storing (e.g. "private, no-store" on proofs) keeps its own.
    if (name === 'cache-control' && /\bno-store\b/.test(result.get(name) ?? '')) continue;
    result.set(name, value);
  }
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) {
    const current = result.get(name);
    if (current === null) result.set(name, value);
    else if (name === CSP) result.set(name, mergeCsp(current, value));
  }
  return result;
}

export function withSecurityHeaders(response: Response, forced: Readonly<Record<string, string>> = {}): Response {
  const wanted = securedHeaders(response.headers, forced);
  try {
    for (const [name, value] of wanted) response.headers.set(name, value);
    return response;
  } catch {
    // Some responses (e.g. redirects built by Response.redirect) have immutable headers.
    return new Response(response.body, { status: response.status, statusText: response.statusText, headers: wanted });
  }
}
