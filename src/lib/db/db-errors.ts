/** Recognises errors that mean "the database is not reachable" (as opposed to a bug or bad data). */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CON_COUNT_ERROR',
  // 1047 "WSREP has not yet prepared node for application use": a Galera node outside the
  // cluster's primary component (it lost its quorum, or is still joining) refuses queries.
  'ER_UNKNOWN_COM_ERROR',
  'DB_TIMEOUT',
  'DB_BUSY',
]);

/** Codes of unreachable servers that only come after waiting: not worth a retry on the spot. */
const SLOW_CODES = new Set(['ETIMEDOUT', 'PROTOCOL_SEQUENCE_TIMEOUT', 'DB_TIMEOUT', 'DB_BUSY']);

/**
 * 1213 ER_LOCK_DEADLOCK: a deadlock on one server, and how Galera reports a certification
 * conflict (another node committed a change to the same rows first). The transaction was rolled
 * back; running it again is safe.
 */
const CONFLICT_CODES = new Set(['ER_LOCK_DEADLOCK']);

/** The codes along an error's cause chain (drizzle wraps the driver's error). */
function codesOf(error: unknown): string[] {
  const codes: string[] = [];
  for (let e: unknown = error, depth = 0; e && depth < 5; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string') codes.push(code);
    e = (e as { cause?: unknown }).cause;
  }
  return codes;
}

/** A deadlock or Galera certification conflict: the transaction was rolled back and may run again. */
export function isCertificationConflict(error: unknown): boolean {
  return codesOf(error).some((c) => CONFLICT_CODES.has(c));
}

/** An unreachable or not-ready server that answered at once, so another try (maybe on another node) is cheap. */
export function isQuickUnavailable(error: unknown): boolean {
  return isDbUnavailable(error) && !codesOf(error).some((c) => SLOW_CODES.has(c));
}

/** Conflicts went on past the retries: the work is not done, and answered like an outage (503). */
export class DbBusyError extends Error {
  readonly code = 'DB_BUSY';
  constructor(cause: unknown) {
    super('The database kept reporting conflicting writes; nothing was changed', { cause });
  }
}

export class DbTimeoutError extends Error {
  readonly code = 'DB_TIMEOUT';
  constructor() {
    super('The database did not answer in time');
  }
}

export function isDbUnavailable(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && depth < 5; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && UNAVAILABLE_CODES.has(code)) return true;
    if ((e as { fatal?: unknown }).fatal === true) return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

/** Rejects with DbTimeoutError after `ms` so no request waits on a dead server. */
export function withDbTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new DbTimeoutError()), ms);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}
