/**
 * The one rate limiter, shared by every app process: fixed-window counters in MariaDB's
 * `rate_limits` table (created by a migration) through rate-limiter-flexible's MySQL store,
 * whose upsert is one transaction, so concurrent requests on any process are counted exactly.
 * Budgets live in rate-budgets.ts. Callers count first and do the expensive work after.
 *
 * While MariaDB is unreachable a counter either fails with the database's error (the default:
 * middleware answers 503, as for any other query) or, for routes that need no database, counts
 * in this process's memory until MariaDB is back (`whenDatabaseDown: 'per-process'`).
 */
import { createHash } from 'node:crypto';
import { getTableName } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { RateLimiterMemory, RateLimiterMySQL, RateLimiterRes, type RateLimiterAbstract } from 'rate-limiter-flexible';
import { config } from '~/lib/config/env.server.ts';
import { getPool } from '~/lib/db/client.server.ts';
import { isDbUnavailable, withDbTimeout } from '~/lib/db/db-errors.ts';
import { rateLimits } from '~/lib/db/schema.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';
import { retryAfterSeconds, scaledPoints, type Budget } from './rate-budgets.ts';

export interface Counter {
  /** Names what is counted, e.g. `sign-in-address`; part of every key. */
  name: string;
  budget: Budget;
  /** While MariaDB is unreachable: throw its error (503), or count per process in memory. */
  whenDatabaseDown?: 'refuse' | 'per-process';
  /**
   * For the large budgets of cheap routes: this process takes this many points from the shared
   * count at once and spends them itself, so most requests cost no query. The shared count then
   * runs ahead of real use by at most `reserve` points per process: a client may be refused a
   * little early near the end of its budget, never let past it.
   */
  reserve?: number;
}

export type LimitVerdict = { ok: true } | { ok: false; retryAfterSeconds: number };

/** No request waits longer than this on the limiter's query, in milliseconds. */
const LIMITER_TIMEOUT_MS = 3000;
/** Longer keys (an e-mail can be 254 characters) are stored as their SHA-256, to fit the column. */
const MAX_PLAIN_KEY_CHARS = 160;

const TABLE = getTableName(rateLimits);
/** Points this process reserved and has not spent yet, per counter key, until the window ends. */
const allowances = new Map<string, { left: number; until: number }>();
/** Above this many allowances, expired ones are swept before a new one is added. */
const MAX_ALLOWANCES = 10_000;
const stores = new WeakMap<Pool, Map<string, RateLimiterMySQL>>();
const memories = new Map<string, RateLimiterMemory>();

/**
 * Key prefix of a counter. A server whose budgets are scaled (RATE_LIMIT_SCALE, load tests only)
 * counts under a prefix of its own: a shared counter with two different budgets means nothing.
 */
function prefixOf(counter: Counter): string {
  const scale = config().rateLimitScale;
  return `${scale === 1 ? 'rl' : `rl-x${scale}`}:${counter.name}`;
}

function storedKey(key: string): string {
  return key.length <= MAX_PLAIN_KEY_CHARS ? key : createHash('sha256').update(key).digest('hex');
}

function options(counter: Counter) {
  const points = scaledPoints(counter.budget, config().rateLimitScale);
  // Once a key is over budget this process refuses it from memory until its window ends, so a
  // flood of refused requests costs no queries.
  return { keyPrefix: prefixOf(counter), points, duration: counter.budget.seconds, inMemoryBlockOnConsumed: points + 1 };
}

function storeFor(counter: Counter): RateLimiterMySQL {
  const pool = getPool();
  let byPrefix = stores.get(pool);
  if (!byPrefix) stores.set(pool, (byPrefix = new Map()));
  const id = `${prefixOf(counter)}/${counter.budget.points}/${counter.budget.seconds}`;
  let store = byPrefix.get(id);
  if (!store) {
    store = new RateLimiterMySQL({
      ...options(counter),
      // rate-limiter-flexible speaks the callback API; the promise pool wraps one.
      storeClient: pool.pool,
      storeType: 'pool',
      dbName: config().database.database,
      tableName: TABLE,
      tableCreated: true,
      // The sweep deletes every expired row of the table, so one store per pool is enough.
      clearExpiredByTimeout: byPrefix.size === 0,
    });
    byPrefix.set(id, store);
  }
  return store;
}

function memoryFor(counter: Counter): RateLimiterMemory {
  const id = `${prefixOf(counter)}/${counter.budget.points}/${counter.budget.seconds}`;
  let memory = memories.get(id);
  if (!memory) memories.set(id, (memory = new RateLimiterMemory(options(counter))));
  return memory;
}

/** Runs `work` on the shared store, or on this process's memory while MariaDB is down (if allowed). */
async function onStore<T>(counter: Counter, work: (limiter: RateLimiterAbstract) => Promise<T>): Promise<T> {
  try {
    // A Galera certification conflict on the shared counter rolled the count back: count again.
    return await withDbTimeout(withRetry(() => work(storeFor(counter))), LIMITER_TIMEOUT_MS);
  } catch (error) {
    if (error instanceof RateLimiterRes || counter.whenDatabaseDown !== 'per-process' || !isDbUnavailable(error)) throw error;
    return work(memoryFor(counter));
  }
}

function verdictOf(rejection: unknown): LimitVerdict {
  if (rejection instanceof RateLimiterRes) return { ok: false, retryAfterSeconds: retryAfterSeconds(rejection.msBeforeNext) };
  throw rejection;
}

/** Counts `points` against `key`; refused once the window's budget is used. */
export async function consume(counter: Counter, key: string, points = 1): Promise<LimitVerdict> {
  if (counter.reserve && counter.reserve > 1 && points === 1) return consumeReserved(counter, key, counter.reserve);
  try {
    await onStore(counter, (limiter) => limiter.consume(storedKey(key), points));
    return { ok: true };
  } catch (rejection) {
    return verdictOf(rejection);
  }
}

/**
 * Reservations of a block under way, per counter key: concurrent requests that find no allowance
 * wait for the one reservation instead of each taking a block (40 at once would otherwise take
 * 40 blocks, and the shared count would run far ahead of use).
 */
const reserving = new Map<string, Promise<LimitVerdict>>();

/** One point from this process's reserve for `key`, reserving `reserve` more from the shared count when it is spent. */
async function consumeReserved(counter: Counter, key: string, reserve: number): Promise<LimitVerdict> {
  const id = `${prefixOf(counter)}:${key}`;
  // Each turn either spends a point, answers a refusal, or waits for a block reserved meanwhile.
  for (;;) {
    const now = Date.now();
    const allowance = allowances.get(id);
    if (allowance && allowance.until > now && allowance.left > 0) {
      allowance.left--;
      return { ok: true };
    }
    let pending = reserving.get(id);
    if (!pending) {
      pending = reserveBlock(counter, key, reserve, id);
      reserving.set(id, pending);
      void pending.finally(() => reserving.delete(id)).catch(() => undefined);
    }
    const verdict = await pending;
    if (!verdict.ok) return verdict;
  }
}

/** Takes `reserve` points from the shared count into this process's allowance for `id`. */
async function reserveBlock(counter: Counter, key: string, reserve: number, id: string): Promise<LimitVerdict> {
  const now = Date.now();
  try {
    const taken = await onStore(counter, (limiter) => limiter.consume(storedKey(key), reserve));
    if (allowances.size >= MAX_ALLOWANCES) for (const [other, a] of allowances) if (a.until <= now) allowances.delete(other);
    allowances.set(id, { left: reserve, until: now + taken.msBeforeNext });
    return { ok: true };
  } catch (rejection) {
    allowances.delete(id);
    return verdictOf(rejection);
  }
}

/**
 * Counts one request against each (counter, key) pair in turn. The first pair that refuses
 * answers, and the pairs before it get their point back, so a request refused by one budget
 * (say a user's) does not spend another (the shop's).
 */
export async function consumeEach(checks: readonly (readonly [Counter, string])[]): Promise<LimitVerdict> {
  for (const [index, [counter, key]] of checks.entries()) {
    const verdict = await consume(counter, key);
    if (!verdict.ok) {
      await Promise.all(checks.slice(0, index).map(([taken, takenKey]) => refund(taken, takenKey)));
      return verdict;
    }
  }
  return { ok: true };
}

/** Points counted against `key` in its current window (0 when none), without counting. */
export async function countOf(counter: Counter, key: string): Promise<number> {
  const res = await onStore(counter, (limiter) => limiter.get(storedKey(key)));
  return res?.consumedPoints ?? 0;
}

/** Gives back `points` counted against `key` (e.g. a sign-in that turned out correct). */
export async function refund(counter: Counter, key: string, points = 1): Promise<void> {
  const allowance = counter.reserve ? allowances.get(`${prefixOf(counter)}:${key}`) : undefined;
  if (allowance && allowance.until > Date.now()) {
    allowance.left += points;
    return;
  }
  await onStore(counter, (limiter) => limiter.reward(storedKey(key), points));
}

/** Forgets `key`'s counter. */
export async function forget(counter: Counter, key: string): Promise<void> {
  await onStore(counter, (limiter) => limiter.delete(storedKey(key)));
}
