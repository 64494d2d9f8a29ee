/**
 * A read that fails because its pooled connection was lost (the node went away, or is not ready)
 * runs again on a fresh connection, which the failover socket sends to another node. Only reads
 * outside transactions: a write whose connection was lost may have been committed, so it is the
 * caller's to retry (with-retry.server.ts, for saves that check their own precondition).
 */
import type { Pool } from 'mysql2/promise';
import { isQuickUnavailable } from './db-errors.ts';

/** Tries for one read in all: enough to skip a dead node's stale connection and one more. */
const READ_ATTEMPTS = 3;

/** SELECT and SHOW statements, as text or as mysql2's `{ sql }` options object. */
export function isReadStatement(statement: unknown): boolean {
  const sql = typeof statement === 'string' ? statement : (statement as { sql?: unknown } | null)?.sql;
  return typeof sql === 'string' && /^\s*(\(\s*)*(select|show)\b/i.test(sql);
}

/** Wraps `pool.query` and `pool.execute` so reads survive a lost connection (drizzle calls them). */
export function retryReadsOnLostConnection(pool: Pool): void {
  for (const method of ['query', 'execute'] as const) {
    const original = pool[method].bind(pool) as (...args: unknown[]) => Promise<unknown>;
    const wrapped = async (...args: unknown[]): Promise<unknown> => {
      for (let attempt = 1; ; attempt++) {
        try {
          return await original(...args);
        } catch (error) {
          if (attempt >= READ_ATTEMPTS || !isReadStatement(args[0]) || !isQuickUnavailable(error)) throw error;
        }
      }
    };
    Object.assign(pool, { [method]: wrapped });
  }
}
