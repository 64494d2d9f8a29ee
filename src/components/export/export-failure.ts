/**
 * What the Export panel says when an export is refused or fails, from the answer's status, its
 * problem body ({ error, field, errorId }) and its Retry-After header.
 */
import { TOO_LARGE_STATUS } from '~/lib/export/export-limits.ts';

export interface ExportProblem {
  error?: string;
  field?: string;
  errorId?: string;
}

/** One sentence for the status line next to the download buttons. */
export function exportFailureMessage(status: number, problem: ExportProblem, retryAfter: string | null): string {
  if (status === TOO_LARGE_STATUS && problem.error) return `Too large: ${problem.error}`;
  if (status === 503 && retryAfter !== null && /^\d+$/.test(retryAfter.trim())) {
    return `The server is busy: try again in ${Number(retryAfter)} s.`;
  }
  if (status >= 500) {
    const id = problem.errorId ? ` (error id ${problem.errorId})` : '';
    return status === 504 && problem.error ? problem.error : `The export failed on the server: try again${id}.`;
  }
  return problem.error ?? `The export failed (${status}).`;
}
