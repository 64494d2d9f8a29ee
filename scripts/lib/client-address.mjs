// @ts-check
/**
 * The honest client address of a request, for rate limits and logs: the socket's peer, unless
 * that peer is a trusted proxy (TRUSTED_PROXIES), in which case the right-most X-Forwarded-For
 * entry that is not itself trusted (proxy-addr walks the chain from the socket outward). Plain
 * JavaScript because scripts/serve-built-app.mjs runs it in front of the built app without a
 * compile step.
 */
import proxyAddr from 'proxy-addr';

/** Headers the adapter reads that only a trusted proxy may set. */
const PROXY_HEADERS = ['x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port'];

/**
 * Compiles TRUSTED_PROXIES: a comma list of IP addresses, CIDR ranges or proxy-addr's names
 * (`loopback`, `linklocal`, `uniquelocal`); empty or unset trusts no proxy. Throws a readable
 * Error on a bad entry.
 * @param {string | undefined} setting
 * @returns {(address: string, hop: number) => boolean}
 */
export function compileTrustedProxies(setting) {
  const entries = (setting ?? '').split(',').map((entry) => entry.trim()).filter(Boolean);
  try {
    return proxyAddr.compile(entries);
  } catch (error) {
    throw new Error(`TRUSTED_PROXIES: ${error instanceof Error ? error.message : String(error)} (use IP addresses, CIDR ranges or loopback, linklocal, uniquelocal, separated by commas)`);
  }
}

/**
 * @param {import('node:http').IncomingMessage} req
 * @param {(address: string, hop: number) => boolean} trust from compileTrustedProxies
 * @returns {string} the address, or "unknown" when the socket is already gone
 */
export function clientAddressOf(req, trust) {
  if (!req.socket?.remoteAddress) return 'unknown';
  return proxyAddr(req, trust);
}

/**
 * Rewrites the request's forwarding headers so that the adapter (which takes the first
 * X-Forwarded-For entry as Astro's clientAddress) sees only the honest address; the forwarded
 * host, protocol and port are kept only when a trusted proxy sent them.
 * @param {import('node:http').IncomingMessage} req
 * @param {(address: string, hop: number) => boolean} trust
 */
export function makeForwardingHonest(req, trust) {
  const peer = req.socket?.remoteAddress;
  const fromTrustedProxy = peer !== undefined && trust(peer, 0);
  req.headers['x-forwarded-for'] = clientAddressOf(req, trust);
  if (!fromTrustedProxy) for (const name of PROXY_HEADERS) delete req.headers[name];
}
