/**
 * Serves the built app (dist/server/entry.mjs, the @astrojs/node standalone handler) behind a
 * plain node:http server that first puts the security headers on every response. The adapter
 * serves files from dist/client (/_astro/*, the favicon) before Astro's middleware runs, so
 * without this those responses would carry none of them. Headers the app sets itself win.
 * Environment: HOST (default 127.0.0.1) and PORT (default 4321), as for the adapter.
 */
import http from 'node:http';
import securityHeaders from '../src/lib/http/security-headers.json' with { type: 'json' };

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import('../dist/server/entry.mjs');

const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);

const server = http.createServer((req, res) => {
  for (const [name, value] of Object.entries(securityHeaders)) res.setHeader(name, value);
  handler(req, res);
});
server.listen(port, host, () => console.log(`kerfline: serving on http://${host}:${port}`));
