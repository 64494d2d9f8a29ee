import { describe, expect, it } from 'vitest';
import { DbBusyError, isCertificationConflict, isDbUnavailable, isQuickUnavailable } from '~/lib/db/db-errors.ts';
import { isReadStatement } from '~/lib/db/read-retry.server.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';

/** Errors shaped as mysql2 gives them (code, errno), wrapped as drizzle wraps them (cause). */
const driverError = (code: string, errno: number, fatal = false) => Object.assign(new Error(code), { code, errno, ...(fatal ? { fatal } : {}) });
const wrapped = (cause: Error) => Object.assign(new Error('Failed query'), { cause });
const deadlock = () => wrapped(driverError('ER_LOCK_DEADLOCK', 1213));
const notReady = () => wrapped(driverError('ER_UNKNOWN_COM_ERROR', 1047));
const noSleep = { sleep: async () => undefined };

/** Fails with the given errors one after the other, then answers `value`; counts its calls. */
function flaky<T>(errors: Error[], value: T) {
  let calls = 0;
  return {
    run: async () => {
      const error = errors[calls++];
      if (error) throw error;
      return value;
    },
    calls: () => calls,
  };
}

describe('database errors a cluster gives', () => {
  it('reads a deadlock (how Galera reports a certification conflict) as a conflict, not an outage', () => {
    expect(isCertificationConflict(deadlock())).toBe(true);
    expect(isDbUnavailable(deadlock())).toBe(false);
  });

  it('reads a node without quorum (1047) and conflicts past the retries as an outage (503)', () => {
    expect(isDbUnavailable(notReady())).toBe(true);
    expect(isDbUnavailable(new DbBusyError(deadlock()))).toBe(true);
    expect(isQuickUnavailable(notReady())).toBe(true);
  });

  it('does not call a timeout quick: retrying it on the spot would only wait again', () => {
    expect(isQuickUnavailable(driverError('ETIMEDOUT', 0, true))).toBe(false);
  });
});

describe('withRetry', () => {
  it('runs a save again after a certification conflict and gives its answer', async () => {
    const work = flaky([deadlock(), deadlock()], 'saved');
    expect(await withRetry(work.run, noSleep)).toBe('saved');
    expect(work.calls()).toBe(3);
  });

  it('runs again after a connection that failed at once (the pool tries the next node)', async () => {
    const work = flaky([wrapped(driverError('ECONNREFUSED', 0, true))], 'saved');
    expect(await withRetry(work.run, noSleep)).toBe('saved');
    expect(work.calls()).toBe(2);
  });

  it('stops after the bounded number of tries: a conflict becomes DbBusyError (503)', async () => {
    const work = flaky(Array.from({ length: 10 }, deadlock), 'never');
    await expect(withRetry(work.run, { ...noSleep, attempts: 3 })).rejects.toBeInstanceOf(DbBusyError);
    expect(work.calls()).toBe(3);
  });

  it('passes other errors on at once, untried again', async () => {
    const bug = new Error('a bug');
    const work = flaky([bug], 'never');
    await expect(withRetry(work.run, noSleep)).rejects.toBe(bug);
    expect(work.calls()).toBe(1);
  });

  it('waits longer before each try, with jitter between half and one and a half times', async () => {
    const waits: number[] = [];
    const work = flaky([deadlock(), deadlock(), deadlock()], 'saved');
    await withRetry(work.run, { firstDelayMs: 10, random: () => 1, sleep: async (ms) => void waits.push(ms) });
    expect(waits).toEqual([15, 30, 60]);
  });
});

describe('isReadStatement: the statements run again after a lost connection', () => {
  it.each([
    ['select 1', true],
    [{ sql: '  SELECT `id` from `boards`' }, true],
    ['(select 1) union (select 2)', true],
    ["SHOW GLOBAL STATUS LIKE 'wsrep_ready'", true],
    ['insert into `sessions` values (1)', false],
    [{ sql: 'update `boards` set `version` = 2' }, false],
    ['selectivity', false],
    [undefined, false],
  ])('%j: %s', (statement, read) => {
    expect(isReadStatement(statement)).toBe(read);
  });
});
