/**
 * Runs a save that must happen exactly once again when the database rolled it back: a Galera
 * certification conflict (another node committed a change to the same rows first, reported as
 * a deadlock) or a connection that failed at once (the pool then tries the next node). Bounded:
 * after the last try a conflict becomes DbBusyError and an outage stays itself, both answered 503
 * with Retry-After by middleware, never a 500.
 *
 * Every wrapped save checks its own precondition inside its transaction (the board's version,
 * the proof not yet decided, the link still usable), so a try that runs after one whose commit
 * did land but whose answer was lost refuses (409, 410) instead of writing twice.
 */
import { DbBusyError, isCertificationConflict, isQuickUnavailable } from './db-errors.ts';

export interface RetryOptions {
  /** Tries in all, the first included. */
  attempts?: number;
  /** Wait before the second try; doubles each time, with ±50 % jitter so two racers part. */
  firstDelayMs?: number;
  sleep?: (ms: number) => Promise<void>;
  random?: () => number;
}

export const SAVE_ATTEMPTS = 4;
const FIRST_DELAY_MS = 20;

const pause = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

export async function withRetry<T>(work: () => Promise<T>, options: RetryOptions = {}): Promise<T> {
  const attempts = options.attempts ?? SAVE_ATTEMPTS;
  const sleep = options.sleep ?? pause;
  const random = options.random ?? Math.random;
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      const conflict = isCertificationConflict(error);
      if (!conflict && !isQuickUnavailable(error)) throw error;
      if (attempt >= attempts) throw conflict ? new DbBusyError(error) : error;
      await sleep((options.firstDelayMs ?? FIRST_DELAY_MS) * 2 ** (attempt - 1) * (0.5 + random()));
    }
  }
}
