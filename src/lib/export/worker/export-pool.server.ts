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
import type { ExportFile } from '../export-design.server';
import { EXPORT_POOL } from '../export-limits';
import type { ExportJob } from './export-job.server';

/** The bundled worker, from the project root (the server runs there: npm start, npm test). */
export const EXPORT_WORKER_FILE = 'dist/workers/export-worker.mjs';

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
    threads: EXPORT_POOL.threads(availableParallelism()),
    maxQueue: EXPORT_POOL.maxQueue,
    jobTimeoutMs: EXPORT_POOL.jobTimeoutMs,
    workerFile: join(process.cwd(), EXPORT_WORKER_FILE),
    workerHeapMb: EXPORT_POOL.workerHeapMb,
  };
}

const QUEUE_FULL = new Set(['Task queue is at limit', 'No task queue available and all Workers are busy']);

export function createExportPool(settings: ExportPoolSettings = defaultPoolSettings()): ExportPool {
  if (!existsSync(settings.workerFile)) {
    throw new Error(`the export worker ${settings.workerFile} is missing: run \`npm run build\` (it bundles the worker)`);
  }
  const pool = new Piscina({
    filename: settings.workerFile,
    minThreads: 0,
    maxThreads: settings.threads,
    maxQueue: settings.maxQueue,
    // Threads stay a while for the next job, then go: an idle server holds no PDF heap.
    idleTimeout: 30_000,
    resourceLimits: { maxOldGenerationSizeMb: settings.workerHeapMb },
  });
  const counts = { inFlight: 0, completed: 0, failed: 0, cancelled: 0, timedOut: 0, rejected: 0 };

  async function run(job: ExportJob, signal?: AbortSignal): Promise<PoolOutcome> {
    const timeout = AbortSignal.timeout(settings.jobTimeoutMs);
    const combined = signal ? AbortSignal.any([signal, timeout]) : timeout;
    counts.inFlight++;
    try {
      const file = (await pool.run(job, { signal: combined })) as ExportFile;
      counts.completed++;
      return { ok: true, file };
    } catch (error) {
      if (error instanceof Error && QUEUE_FULL.has(error.message)) {
        counts.rejected++;
        return { ok: false, reason: 'busy' };
      }
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
      counts.inFlight--;
    }
  }

  return {
    settings,
    run,
    stats: () => ({
      threads: pool.threads.length,
      inFlight: counts.inFlight,
      queued: pool.queueSize,
      running: Math.max(0, counts.inFlight - pool.queueSize),
      completed: counts.completed,
      failed: counts.failed,
      cancelled: counts.cancelled,
      timedOut: counts.timedOut,
      rejected: counts.rejected,
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
