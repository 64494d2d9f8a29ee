/**
 * Entry of the export worker threads (piscina). Bundled on its own into
 * dist/workers/export-worker.mjs (scripts/lib/export-worker-bundle.mjs), because the app's
 * server code is split into chunks a worker cannot name.
 */
import { buildExportFile, type ExportJob } from './export-job.server';

export default function exportWorker(job: ExportJob) {
  return buildExportFile(job);
}
