/**
 * Entry of the export worker threads (piscina). Bundled on its own into
 * dist/workers/export-worker.mjs (scripts/lib/export-worker-bundle.mjs), because the app's
 * server code is split into chunks a worker cannot name.
 */
import { parentPort } from 'node:worker_threads';
import { buildExportFile } from './export-job.server.ts';
import type { PooledJob } from './export-pool.server.ts';

export default function exportWorker({ id, job }: PooledJob) {
  // Tells the pool this job has left the queue (piscina itself does not say).
  parentPort?.postMessage({ exportStarted: id });
  return buildExportFile(job);
}
