/**
 * Unexpected failures: logged once with a short random id, answered 500 in the problem shape
 * with the same id (`errorId`), so a user's report can be matched to the server's log line.
 */
import { randomBytes } from 'node:crypto';
import { isDbUnavailable } from '~/lib/db/db-errors.ts';
import { problem } from './problem.ts';

/** Logs `kerfline: error <id>: <what>: <error>` and answers 500 naming the id. */
export function serverError(what: string, error: unknown): Response {
  const errorId = randomBytes(6).toString('hex');
  const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
  console.error(`kerfline: error ${errorId}: ${what}: ${detail}`);
  return problem(500, `${what} failed on the server: try again. If it fails again, quote error id ${errorId}.`, { errorId });
}

/**
 * `answer()`, or the 500 with an error id when it throws. A database outage is passed on, so
 * middleware answers it with its 503.
 */
export async function answerOrServerError(what: string, answer: () => Promise<Response>): Promise<Response> {
  try {
    return await answer();
  } catch (error) {
    if (isDbUnavailable(error)) throw error;
    return serverError(what, error);
  }
}
