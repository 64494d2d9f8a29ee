/**
 * A heavy export run in the worker pool, its outcome as the file or the answer to give:
 * 503 with Retry-After when the queue is full, 504 when the job ran out of time, 500 with an
 * error id for anything unexpected (the server logs the same id).
 */
import type { ExportFile } from '../export-design.server.ts';
import { EXPORT_POOL } from '../export-limits.ts';
import { problem, type Checked } from '~/lib/http/problem.ts';
import { serverError } from '~/lib/http/server-error.server.ts';
import type { ExportJob } from './export-job.server.ts';
import { exportPool, type ExportPool, type PoolOutcome } from './export-pool.server.ts';

export type ExportRun = Checked<ExportFile>;

/** Runs `job` in `pool` (the server's own by default); `signal` is the request's. */
export async function runExport(job: ExportJob, signal: AbortSignal | undefined, pool?: ExportPool): Promise<ExportRun> {
  let target: ExportPool;
  let outcome: PoolOutcome;
  try {
    target = pool ?? exportPool();
    outcome = await target.run(job, signal);
  } catch (error) {
    return { ok: false, response: serverError('The export', error) };
  }
  if (outcome.ok) return { ok: true, value: outcome.file };
  const seconds = EXPORT_POOL.retryAfterSeconds;
  const limitSeconds = Math.round(target.settings.jobTimeoutMs / 1000);
  switch (outcome.reason) {
    case 'busy':
      return {
        ok: false,
        response: problem(503, `The export queue is full: try again in ${seconds} s.`, { retryAfter: seconds }, { 'retry-after': String(seconds) }),
      };
    case 'timeout':
      return {
        ok: false,
        response: problem(504, `The export was stopped after ${limitSeconds} s: the server is busy or the file is very large. Try again, or use fewer pages (a larger paper or less overlap).`),
      };
    case 'cancelled':
      // The client has gone; nobody reads this answer.
      return { ok: false, response: problem(503, 'The export was cancelled: the request was closed before the file was ready.') };
    case 'failed':
      return { ok: false, response: serverError('The export', outcome.error) };
  }
}
