/**
 * The client's address for rate limits and logs; "unknown" when the adapter cannot tell. It is
 * honest: scripts/serve-built-app.mjs replaced X-Forwarded-For with the socket's peer, or with
 * the right-most untrusted entry when the peer is a proxy listed in TRUSTED_PROXIES.
 */
export function clientIp(context: { clientAddress: string }): string {
  try {
    return context.clientAddress || 'unknown';
  } catch {
    return 'unknown';
  }
}
