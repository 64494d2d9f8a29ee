/**
 * The pool of worker threads that builds PDF exports off the request thread (piscina), so one
 * large export cannot stall every other request. Bounded: EXPORT_POOL's threads, a queue of
 * `maxQueue` waiting jobs (one more is refused as busy), a time limit per job counted from the
 * request, and cancellation when the client hangs up (piscina ends a running job's thread).
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { Piscina } from 'piscina';
import { config } from '~/lib/config/env.server.ts';
import type { ExportFile } from '../export-design.server.ts';
import { EXPORT_POOL } from '../export-limits.ts';
import type { ExportJob } from './export-job.server.ts';

/** The bundled worker, from the project root (the server runs there: npm start, npm test). */
export const EXPORT_WORKER_FILE = 'dist/workers/export-worker.mjs';

/** What a worker receives: the job and an id it reports back when it starts. */
export interface PooledJob {
  id: number;
  job: ExportJob;
}

export interface ExportPoolSettings {
  threads: number;
  maxQueue: number;
  jobTimeoutMs: number;
  /** Absolute path of the bundled worker. */
  workerFile: string;
  workerHeapMb: number;
}

export type PoolOutcome =
  | { ok: true; file: ExportFile }
  | { ok: false; reason: 'busy' | 'timeout' | 'cancelled' }
  | { ok: false; reason: 'failed'; error: unknown };

export interface PoolStats {
  threads: number;
  /** Jobs asked for and not yet settled (running and queued). */
  inFlight: number;
  queued: number;
  running: number;
  /** Jobs that built their file. */
  completed: number;
  failed: number;
  cancelled: number;
  timedOut: number;
  /** Jobs refused because the queue was full. */
  rejected: number;
}

export interface ExportPool {
  readonly settings: ExportPoolSettings;
  /** Runs `job`; `signal` (the request's) cancels it when the client goes away. */
  run(job: ExportJob, signal?: AbortSignal): Promise<PoolOutcome>;
  stats(): PoolStats;
  /** Called whenever a worker thread ends: its job was cancelled or timed out, or it sat idle. */
  onWorkerEnded(listener: () => void): void;
  close(): Promise<void>;
}

export function defaultPoolSettings(): ExportPoolSettings {
  return {
    threads: config().exportThreads ?? EXPORT_POOL.threads(config().processCores ?? availableParallelism()),
    maxQueue: EXPORT_POOL.maxQueue,
    jobTimeoutMs: EXPORT_POOL.jobTimeoutMs,
    workerFile: join(process.cwd(), EXPORT_WORKER_FILE),
    workerHeapMb: EXPORT_POOL.workerHeapMb,
  };
}

export function createExportPool(settings: ExportPoolSettings = defaultPoolSettings()): ExportPool {
  if (!existsSync(settings.workerFile)) {
    throw new Error(`the export worker ${settings.workerFile} is missing: run \`npm run build\` (it bundles the worker)`);
  }
  const pool = new Piscina({
    filename: settings.workerFile,
    minThreads: 0,
    maxThreads: settings.threads,
    // Threads stay a while for the next job, then go: an idle server holds no PDF heap.
    idleTimeout: 30_000,
    resourceLimits: { maxOldGenerationSizeMb: settings.workerHeapMb },
  });
  const counts = { completed: 0, failed: 0, cancelled: 0, timedOut: 0, rejected: 0 };
  /** Jobs asked for and not settled, and those a worker has started. */
  const inFlight = new Set<number>();
  const started = new Set<number>();
  let nextId = 1;
  pool.on('message', (message: { exportStarted?: number }) => {
    if (message.exportStarted !== undefined && inFlight.has(message.exportStarted)) started.add(message.exportStarted);
  });

  async function run(job: ExportJob, signal?: AbortSignal): Promise<PoolOutcome> {
    // The queue bound is kept here: piscina does not count jobs that carry an abort signal.
    if (inFlight.size >= settings.threads + settings.maxQueue) {
      counts.rejected++;
      return { ok: false, reason: 'busy' };
    }
    const timeout = AbortSignal.timeout(settings.jobTimeoutMs);
    const combined = signal ? AbortSignal.any([signal, timeout]) : timeout;
    const id = nextId++;
    inFlight.add(id);
    try {
      const task: PooledJob = { id, job };
      const file = (await pool.run(task, { signal: combined })) as ExportFile;
      counts.completed++;
      return { ok: true, file };
    } catch (error) {
      if (error instanceof Error && error.name === 'AbortError') {
        if (timeout.aborted) {
          counts.timedOut++;
          return { ok: false, reason: 'timeout' };
        }
        counts.cancelled++;
        return { ok: false, reason: 'cancelled' };
      }
      counts.failed++;
      return { ok: false, reason: 'failed', error };
    } finally {
      inFlight.delete(id);
      started.delete(id);
    }
  }

  return {
    settings,
    run,
    stats: () => ({
      threads: pool.threads.length,
      inFlight: inFlight.size,
      queued: inFlight.size - started.size,
      running: started.size,
      ...counts,
    }),
    onWorkerEnded: (listener) => {
      pool.on('workerDestroy', listener);
    },
    close: () => pool.destroy(),
  };
}

let shared: ExportPool | undefined;

/** The server's one pool, made on first use. */
export function exportPool(): ExportPool {
  shared ??= createExportPool();
  return shared;
}
