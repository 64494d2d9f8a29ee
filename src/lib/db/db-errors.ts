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
  'DB_TIMEOUT',
]);

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
