/**
 * The export worker pool (dedicated small pools, the real bundled worker): a full queue is 503
 * with Retry-After, a closed request cancels its job and ends its thread, a job past its time
 * limit is 504, an unexpected failure is 500 with an error id the server logs. Ordering is
 * asserted through the pool's own counters, never through time.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { designExportResponse } from '~/lib/export/design-export.server.ts';
import { EXPORT_POOL } from '~/lib/export/export-limits.ts';
import { createExportPool, defaultPoolSettings, type ExportPool, type ExportPoolSettings } from '~/lib/export/worker/export-pool.server.ts';
import { runExport } from '~/lib/export/worker/run-export.server.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { designOf } from '../../support/design-builders.ts';

/** The heaviest paper template the caps allow: the largest design on 200 Letter pages. */
const HEAVIEST = { design: designOf({ strings: 16, frets: 36, scale: { treble: 5000, bass: 5000 }, stringSpacing: { nut: 500, bridge: 500 } }), query: { format: 'pdf', paper: 'letter', overlap: '99.9' } };

const pools: ExportPool[] = [];
function pool(settings: Partial<ExportPoolSettings>): ExportPool {
  const made = createExportPool({ ...defaultPoolSettings(), threads: 1, ...settings });
  pools.push(made);
  return made;
}
afterEach(async () => {
  await Promise.all(pools.splice(0).map((p) => p.close()));
});

/** The export POST /api/export answers for the heaviest design, run on `target`. */
function heavyExport(target: ExportPool, signal?: AbortSignal): Promise<Response> {
  const options = validateExportOptions(HEAVIEST.query);
  if (!options.ok) throw new Error('the heaviest export options do not validate');
  return designExportResponse(HEAVIEST.design, options.options, {}, signal, target);
}

/** Waits (yielding to the event loop) until `ready` holds; bounded by the test's own timeout. */
async function until(ready: () => boolean): Promise<void> {
  while (!ready()) await new Promise((resolve) => setImmediate(resolve));
}

describe('export worker pool', () => {
  it('answers 503 with Retry-After when every thread is busy and the queue is full, and runs nothing for it', async () => {
    const small = pool({ maxQueue: 1 });
    const stop = new AbortController();
    const running = heavyExport(small, stop.signal);
    await until(() => small.stats().running === 1);
    const queued = heavyExport(small, stop.signal);
    await until(() => small.stats().queued === 1);

    const refused = await heavyExport(small);
    expect(refused.status).toBe(503);
    expect(refused.headers.get('retry-after')).toBe(String(EXPORT_POOL.retryAfterSeconds));
    expect(await refused.json()).toEqual({
      error: `The export queue is full: try again in ${EXPORT_POOL.retryAfterSeconds} s.`,
      retryAfter: EXPORT_POOL.retryAfterSeconds,
    });
    expect(small.stats()).toMatchObject({ rejected: 1, running: 1, queued: 1, completed: 0 });

    stop.abort();
    expect((await running).status).toBe(503);
    expect((await queued).status).toBe(503);
    expect(small.stats()).toMatchObject({ inFlight: 0, cancelled: 2, completed: 0 });
  });

  it('cancels a running job when its request is aborted: the thread is ended and no file is finished', async () => {
    const single = pool({});
    let ended = 0;
    single.onWorkerEnded(() => ended++);
    const client = new AbortController();
    const answer = heavyExport(single, client.signal);
    await until(() => single.stats().running === 1);
    client.abort();
    const response = await answer;
    expect(response.status).toBe(503);
    expect((await response.json()).error).toMatch(/cancelled/);
    await until(() => ended === 1);
    expect(single.stats()).toMatchObject({ inFlight: 0, running: 0, queued: 0, cancelled: 1, completed: 0 });
  });

  it('stops a job past its time limit with 504 and a message saying so', async () => {
    const hasty = pool({ jobTimeoutMs: 1 });
    const response = await heavyExport(hasty);
    expect(response.status).toBe(504);
    expect((await response.json()).error).toMatch(/^The export was stopped after 0 s/);
    expect(hasty.stats()).toMatchObject({ timedOut: 1, completed: 0, inFlight: 0 });
  });

  it('answers an unexpected failure with 500 and an error id, and logs the same id', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kerfline-worker-'));
    const broken = join(dir, 'broken-worker.mjs');
    writeFileSync(broken, "export default function () { throw new Error('the worker broke'); }\n");
    const failing = pool({ workerFile: broken });
    const log = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      const run = await runExport({ kind: 'design', design: HEAVIEST.design, options: { format: 'csv' } as never, context: {} }, undefined, failing);
      expect(run.ok).toBe(false);
      if (run.ok) return;
      expect(run.response.status).toBe(500);
      const body = (await run.response.json()) as { error: string; errorId: string };
      expect(body.errorId).toMatch(/^[0-9a-f]{12}$/);
      expect(body.error).toBe(`The export failed on the server: try again. If it fails again, quote error id ${body.errorId}.`);
      expect(log).toHaveBeenCalledWith(expect.stringMatching(new RegExp(`^kerfline: error ${body.errorId}: The export: Error: the worker broke`)));
    } finally {
      log.mockRestore();
    }
  });

  it('sizes the pool from the cores: one left for the web server, at least one, at most four', () => {
    expect([1, 2, 3, 8, 64].map(EXPORT_POOL.threads)).toEqual([1, 1, 2, 4, 4]);
  });
});
