import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind()],
  server: { host: '127.0.0.1', port: 4321 },
  // src/middleware.ts checks the Origin of every non-GET request (forms and JSON alike) against
  // APP_ORIGIN (src/lib/http/same-origin.ts). Astro's own check is off: behind an untrusted Host
  // header it compares against "http://localhost", and it would refuse cookie-less scripts too.
  security: { checkOrigin: false },
  devToolbar: { enabled: false },
  // Astro hashes every script and style it emits into a CSP <meta>; only our own origin is
  // allowed. frame-ancestors cannot live in a <meta>, so middleware sends it as a header too.
  experimental: {
    csp: {
      directives: [
        "default-src 'self'",
        "img-src 'self' data: blob:",
        "font-src 'self'",
        "connect-src 'self'",
        "object-src 'none'",
        "base-uri 'self'",
        "form-action 'self'",
      ],
    },
  },
  telemetry: false,
});
