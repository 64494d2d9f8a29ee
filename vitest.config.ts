import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const alias = { '~': fileURLToPath(new URL('./src', import.meta.url)) };
/** Exports of PDFs run in worker threads that load dist/workers/export-worker.mjs. */
const EXPORT_WORKER_SETUP = './tests/support/export-worker-setup.mjs';

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      { resolve: { alias }, test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}'],
          globalSetup: [EXPORT_WORKER_SETUP],
          environment: 'node',
          // Property tests run hundreds of cases; a busy 2-core machine needs headroom (not a speed goal).
          testTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: [EXPORT_WORKER_SETUP],
          // One real MariaDB; some tests stop and restart it, so files run one at a time.
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 60_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          // scripts/test-cluster.sh: a throwaway Galera cluster; the tests start app processes and HAProxy.
          name: 'cluster',
          include: ['tests/cluster/**/*.test.ts'],
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 240_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
