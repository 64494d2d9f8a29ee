import { defineConfig, passthroughImageService } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { bundleExportWorker } from './scripts/lib/export-worker-bundle.mjs';

/** PDF exports run in worker threads that load their own bundle (scripts/lib/export-worker-bundle.mjs). */
const exportWorker = {
  name: 'kerfline-export-worker',
  hooks: {
    'astro:build:done': () => bundleExportWorker(),
    'astro:server:setup': () => bundleExportWorker(),
  },
};

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind(), exportWorker],
  server: { host: '127.0.0.1', port: 4321 },
  // src/middleware.ts checks the Origin of every non-GET request (forms and JSON alike) against
  // APP_ORIGIN (src/lib/http/same-origin.ts). Astro's own check is off: behind an untrusted Host
  // header it compares against "http://localhost".
  security: { checkOrigin: false },
  devToolbar: { enabled: false },
  // The only image in the app is the SVG figure of docs/measuring.md: served as it is, no resizing.
  image: { service: passthroughImageService() },
  // Vite inlines small assets (some font subsets) as data: URLs, which font-src 'self' blocks;
  // emitting every asset as a file keeps the policy strict.
  vite: { build: { assetsInlineLimit: 0 } },
  // Astro hashes every script and style it emits into the page's CSP (a response header for
  // on-demand pages); only our own origin is allowed. Astro does not emit frame-ancestors, so
  // middleware merges it into that header (src/lib/http/security-headers.ts).
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
