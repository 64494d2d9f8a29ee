/** vitest global setup: a fresh export worker bundle, so tests that export PDFs run today's code. */
import { bundleExportWorker } from '../../scripts/lib/export-worker-bundle.mjs';

export default async function setup() {
  await bundleExportWorker();
}
