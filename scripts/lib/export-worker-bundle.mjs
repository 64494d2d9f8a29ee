/**
 * Bundles the export worker (src/lib/export/worker/export-worker.server.ts) into
 * dist/workers/export-worker.mjs with esbuild: Astro's build splits server code into chunks a
 * worker thread cannot name, so the worker gets an entry of its own. npm packages stay external
 * (node_modules at run time, as for the server); `~/*` resolves through tsconfig.json.
 * Run by astro.config.mjs (after `astro build`, and when `astro dev` starts), by vitest's global
 * setup, and by hand: `node scripts/lib/export-worker-bundle.mjs`.
 */
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const EXPORT_WORKER_ENTRY = 'src/lib/export/worker/export-worker.server.ts';
export const EXPORT_WORKER_BUNDLE = 'dist/workers/export-worker.mjs';

/** Writes the bundle under `root` (the project root). */
export async function bundleExportWorker(root = process.cwd()) {
  await build({
    entryPoints: [join(root, EXPORT_WORKER_ENTRY)],
    outfile: join(root, EXPORT_WORKER_BUNDLE),
    tsconfig: join(root, 'tsconfig.json'),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    logLevel: 'warning',
  });
}

if (process.argv[1] === fileURLToPath(import.meta.url)) await bundleExportWorker();
