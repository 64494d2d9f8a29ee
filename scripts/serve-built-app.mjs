/**
 * Serves the built app (dist/server/entry.mjs, the @astrojs/node standalone handler) behind a
 * plain node:http server that first puts the security headers on every response. The adapter
 * serves files from dist/client (/_astro/*, the favicon) before Astro's middleware runs, so
 * without this those responses would carry none of them. Headers the app sets itself win.
 * It also makes the client address honest before the adapter reads it (scripts/lib/client-address.mjs):
 * X-Forwarded-For counts only when a proxy listed in TRUSTED_PROXIES sent it. Small JSON bodies are
 * read here and handed to the adapter whole (scripts/lib/small-json-body.mjs), which is cheaper
 * than the adapter's stream for a body of a few KiB.
 * Environment: HOST (default 127.0.0.1) and PORT (default 4321), as for the adapter; TRUSTED_PROXIES;
 * APP_PROCESS_CORES, whose node flags the launcher passes (scripts/lib/process-cores.mjs).
 */
import http from 'node:http';
import securityHeaders from '../src/lib/http/security-headers.json' with { type: 'json' };
import { compileTrustedProxies, makeForwardingHonest } from './lib/client-address.mjs';
import { isSmallJsonBody, readSmallJsonBody } from './lib/small-json-body.mjs';
import { missingNodeFlags } from './lib/process-cores.mjs';

let trust;
try {
  trust = compileTrustedProxies(process.env.TRUSTED_PROXIES);
  // Node's flags cannot be set from inside: a launcher that left them out is said, not hidden.
  const missing = missingNodeFlags(process.env.APP_PROCESS_CORES);
  if (missing.length > 0) {
    console.error(`kerfline: APP_PROCESS_CORES=${process.env.APP_PROCESS_CORES} wants node started with ${missing.join(' ')} (scripts/lib/process-cores.mjs); without, its background threads may use more than that share`);
  }
} catch (error) {
  console.error(`kerfline: ${error.message}`);
  process.exit(1);
}

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import('../dist/server/entry.mjs');

const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);

const server = http.createServer((req, res) => {
  for (const [name, value] of Object.entries(securityHeaders)) res.setHeader(name, value);
  makeForwardingHonest(req, trust);
  if (isSmallJsonBody(req)) readSmallJsonBody(req, () => handler(req, res));
  else handler(req, res);
});
server.listen(port, host, () => {
  console.log(`kerfline: serving on http://${host}:${port}`);
  // A loosened limit is never silent: RATE_LIMIT_SCALE is for load tests only (docs/operations.md).
  const scale = process.env.RATE_LIMIT_SCALE;
  if (scale !== undefined && scale.trim() !== '' && Number(scale) !== 1) {
    console.error(`kerfline: RATE_LIMIT_SCALE=${scale}: every rate limit budget is multiplied by ${scale}. For load testing only, never for a server people use.`);
  }
});
