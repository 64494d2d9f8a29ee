import { afterAll, describe, expect, it } from 'vitest';
import { BASE_URL } from '../support/browser.ts';
import { startDatabase, stopDatabase } from '../support/test-db.ts';

/** The endpoint's contract is to answer within 2 s even when MariaDB is gone; a slower answer aborts. */
async function health(): Promise<{ status: number; body: unknown }> {
  const response = await fetch(`${BASE_URL}/api/health`, { signal: AbortSignal.timeout(2000) });
  return { status: response.status, body: await response.json() };
}

afterAll(() => startDatabase());

describe('GET /api/health on the running built server', () => {
  it('answers 200 with db ok, 503 with db down when MariaDB stops, and 200 again after a restart', async () => {
    expect(await health()).toMatchObject({ status: 200, body: { status: 'ok', db: 'ok' } });
    stopDatabase();
    expect(await health()).toMatchObject({ status: 503, body: { db: 'down' } });
    startDatabase();
    expect(await health()).toMatchObject({ status: 200, body: { status: 'ok', db: 'ok' } });
  });
});
