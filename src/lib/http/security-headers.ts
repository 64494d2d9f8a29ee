/**
 * Headers every response carries (the page CSP itself comes from Astro's hashed <meta>). The
 * values live in JSON so scripts/serve-built-app.mjs can put them on the static files the
 * adapter serves before this middleware runs.
 */
import headers from './security-headers.json';

export const SECURITY_HEADERS: Readonly<Record<string, string>> = headers;

export function withSecurityHeaders(response: Response): Response {
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) {
    if (!response.headers.has(name)) {
      try {
        response.headers.set(name, value);
      } catch {
        // Some responses (e.g. redirects built by Response.redirect) have immutable headers.
        return new Response(response.body, { status: response.status, headers: mergedHeaders(response) });
      }
    }
  }
  return response;
}

function mergedHeaders(response: Response): Headers {
  const headers = new Headers(response.headers);
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) if (!headers.has(name)) headers.set(name, value);
  return headers;
}
