/**
 * The shared rate limiter on the test run's MariaDB (rate_limits table from the migration):
 * fixed windows, atomic counting under concurrency, one count across limiter instances (as two
 * app processes would have), and database outages recognised as such.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { isDbUnavailable } from '~/lib/db/db-errors.ts';
import { consume, consumeEach, countOf, forget, refund, type Counter } from '~/lib/http/rate-limit.server.ts';
import { closeDb, getPool, startDatabase, stopDatabase } from '../../support/test-db.ts';

/** A counter of its own per test, so tests never share a window. */
function counter(points = 3, seconds = 60): Counter {
  return { name: `test-${randomUUID().slice(0, 8)}`, budget: { points, seconds } };
}

afterEach(() => vi.useRealTimers());
afterAll(() => closeDb());

describe('shared fixed-window rate limiter (MariaDB store)', () => {
  it('allows `points` requests per window, then refuses with the seconds left in the window', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: 1_000_000_000 });
    const c = counter();
    for (let i = 0; i < 3; i++) expect(await consume(c, 'k')).toEqual({ ok: true });
    vi.setSystemTime(1_000_015_000);
    expect(await consume(c, 'k')).toEqual({ ok: false, retryAfterSeconds: 45 });
  });

  it('opens a new window once the old one ends', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: 2_000_000_000 });
    const c = counter();
    for (let i = 0; i < 4; i++) await consume(c, 'k');
    expect((await consume(c, 'k')).ok).toBe(false);
    vi.setSystemTime(2_000_060_001);
    expect(await consume(c, 'k')).toEqual({ ok: true });
  });

  it('keeps keys and counters apart', async () => {
    const c = counter();
    for (let i = 0; i < 3; i++) await consume(c, 'a');
    expect((await consume(c, 'a')).ok).toBe(false);
    expect((await consume(c, 'b')).ok).toBe(true);
    expect((await consume(counter(), 'a')).ok).toBe(true);
  });

  it('countOf peeks without counting; refund gives points back; forget clears the key', async () => {
    const c = counter();
    for (let i = 0; i < 10; i++) expect(await countOf(c, 'f')).toBe(0);
    await consume(c, 'f');
    await consume(c, 'f');
    expect(await countOf(c, 'f')).toBe(2);
    await refund(c, 'f');
    expect(await countOf(c, 'f')).toBe(1);
    await forget(c, 'f');
    expect(await countOf(c, 'f')).toBe(0);
  });

  it('a counter with a reserve takes blocks from the shared count: one query per block, never past the budget', async () => {
    const c = { ...counter(100), reserve: 10 };
    const verdicts = [];
    for (let i = 0; i < 105; i++) verdicts.push((await consume(c, 'r')).ok);
    expect(verdicts.filter(Boolean)).toHaveLength(100);
    expect(verdicts.slice(100)).toEqual([false, false, false, false, false]);
    // The shared count holds whole blocks: 10 reservations of 10, and one refused block.
    expect(await countOf(c, 'r')).toBe(110);
  });

  it('a reserve runs ahead of use by at most one block per process: another process sees the blocks taken', async () => {
    const c = { ...counter(100), reserve: 10 };
    expect((await consume(c, 's')).ok).toBe(true);
    expect(await countOf(c, 's')).toBe(10);
    for (let i = 0; i < 9; i++) await consume(c, 's');
    expect(await countOf(c, 's')).toBe(10);
    // A refund goes back to this process's block, not to the shared count.
    await refund(c, 's');
    expect(await countOf(c, 's')).toBe(10);
    expect((await consume(c, 's')).ok).toBe(true);
    expect(await countOf(c, 's')).toBe(10);
  });

  it('concurrent requests with a reserve wait for one block instead of each taking one', async () => {
    const c = { ...counter(100), reserve: 10 };
    const verdicts = await Promise.all(Array.from({ length: 40 }, () => consume(c, 'herd')));
    expect(verdicts.filter((v) => v.ok)).toHaveLength(40);
    // Four blocks of 10 for 40 requests, not one block per request (which would refuse 30 of them).
    expect(await countOf(c, 'herd')).toBe(40);
  });

  it('never answers a Retry-After below 1 second', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: 3_000_000_000 });
    const c = counter();
    for (let i = 0; i < 3; i++) await consume(c, 'r');
    vi.setSystemTime(3_000_059_999);
    expect(await consume(c, 'r')).toEqual({ ok: false, retryAfterSeconds: 1 });
  });

  it('counts atomically: 30 concurrent requests against a budget of 10 let exactly 10 through', async () => {
    const c = counter(10);
    const verdicts = await Promise.all(Array.from({ length: 30 }, () => consume(c, 'burst')));
    expect(verdicts.filter((v) => v.ok)).toHaveLength(10);
  });

  it('one count for every limiter on the database: a new pool (as another process would have) sees it', async () => {
    const c = counter(5);
    for (let i = 0; i < 5; i++) await consume(c, 'shared');
    await closeDb();
    expect(getPool()).toBeDefined();
    expect(await countOf(c, 'shared')).toBe(5);
    expect((await consume(c, 'shared')).ok).toBe(false);
  });

  it('consumeEach counts every pair; when one refuses, the pairs before it get their point back', async () => {
    const wide = counter(5, 10);
    const narrow = counter(1, 100);
    expect((await consumeEach([[wide, 'x'], [narrow, 'x']])).ok).toBe(true);
    expect(await countOf(wide, 'x')).toBe(1);
    const refused = await consumeEach([[wide, 'x'], [narrow, 'x']]);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.retryAfterSeconds).toBeGreaterThan(10);
    expect(await countOf(wide, 'x')).toBe(1);
  });

  it('takes keys longer than the column (a 254-character e-mail and an address) without an error', async () => {
    const c = counter(1);
    const key = `${'a'.repeat(240)}@b.example|203.0.113.5`;
    expect((await consume(c, key)).ok).toBe(true);
    expect((await consume(c, key)).ok).toBe(false);
    expect((await consume(c, `${key}x`)).ok).toBe(true);
  });
});

describe('while MariaDB is down', () => {
  it('fails with an error the 503 mapping recognises, or counts per process where allowed', async () => {
    const refusing = counter(2);
    const perProcess: Counter = { ...counter(2), whenDatabaseDown: 'per-process' };
    stopDatabase();
    try {
      const error = await consume(refusing, 'down').then(() => null, (e: unknown) => e);
      expect(error).not.toBeNull();
      expect(isDbUnavailable(error)).toBe(true);
      expect((await consume(perProcess, 'down')).ok).toBe(true);
      expect((await consume(perProcess, 'down')).ok).toBe(true);
      expect((await consume(perProcess, 'down')).ok).toBe(false);
    } finally {
      startDatabase();
    }
    expect((await consume(refusing, 'down')).ok).toBe(true);
  });
});
