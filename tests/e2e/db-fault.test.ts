/**
 * Database fault on the running built server: MariaDB is stopped while requests are in flight,
 * then started again. The app must answer 503 with a clear JSON message on API routes that need
 * the database (never a 500 or a hang), keep serving what needs no database, and recover without
 * being restarted. Feature routes that read or write the database belong in TARGETS.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL } from '../support/browser.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { closeDb, databaseCommand, startDatabase } from '../support/test-db.ts';

interface Target {
  name: string;
  path: string;
  signedIn: boolean;
}

/** Requests that touch the database: health pings it; a session cookie makes middleware read it. */
const TARGETS: Target[] = [
  { name: 'health', path: '/api/health', signedIn: false },
  { name: 'API as builder', path: '/api/version', signedIn: true },
  { name: 'home page as builder', path: '/', signedIn: true },
];

interface Sample {
  target: string;
  status: number;
  contentType: string;
  body: string;
}

let builder: TestUser;

async function call(target: Target): Promise<Sample> {
  try {
    const response = await fetch(`${BASE_URL}${target.path}`, {
      headers: target.signedIn ? { cookie: builder.cookie } : {},
      redirect: 'manual',
      signal: AbortSignal.timeout(5000),
    });
    return { target: target.name, status: response.status, contentType: response.headers.get('content-type') ?? '', body: await response.text() };
  } catch (error) {
    // A refused connection or a request that hangs past 5 s: recorded as status 0, a failure.
    return { target: target.name, status: 0, contentType: '', body: String(error) };
  }
}

/** Calls every target again and again until `stop()` says so. */
async function keepCalling(stop: () => boolean, samples: Sample[]): Promise<void> {
  while (!stop()) samples.push(...(await Promise.all(TARGETS.map(call))));
}

function isClearDatabaseDownAnswer(sample: Sample): boolean {
  if (sample.status !== 503) return false;
  if (!sample.contentType.startsWith('application/json')) return /database/i.test(sample.body);
  const payload = JSON.parse(sample.body) as { error?: string; db?: string };
  return /database/i.test(payload.error ?? '') || payload.db === 'down';
}

async function waitFor(check: () => Promise<boolean>, seconds: number): Promise<boolean> {
  for (let i = 0; i < seconds * 4; i++) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

beforeAll(async () => {
  builder = await signInAs('builder@wrenfield.example');
});
afterAll(async () => {
  startDatabase();
  await closeDb();
});

describe('MariaDB stops while requests are in flight, then comes back', () => {
  it('answers 503 with a clear message while it is down and recovers without an app restart', async () => {
    const samples: Sample[] = [];
    let done = false;
    const traffic = keepCalling(() => done, samples);

    await waitFor(async () => samples.filter((s) => s.status === 200).length >= TARGETS.length * 3, 10);
    expect(samples.every((s) => s.status === 200), 'all answers 200 before the fault').toBe(true);

    await databaseCommand('stop');
    const down = await call({ name: 'API as builder', path: '/api/version', signedIn: true });
    expect(down.status).toBe(503);
    expect(down.contentType).toMatch(/^application\/json/);
    expect(JSON.parse(down.body)).toMatchObject({ error: expect.stringMatching(/database is not answering/i) });
    expect(await call({ name: 'health', path: '/api/health', signedIn: false })).toMatchObject({ status: 503 });
    expect((await call({ name: 'home page as builder', path: '/', signedIn: true })).status).toBe(503);
    // What needs no database keeps working.
    expect((await call({ name: 'API anonymous', path: '/api/version', signedIn: false })).status).toBe(200);

    await databaseCommand('start');
    const recovered = await waitFor(async () => (await Promise.all(TARGETS.map(call))).every((s) => s.status === 200), 15);
    expect(recovered, 'every target answers 200 again within 15 s').toBe(true);
    const afterRecovery = samples.length;
    await waitFor(async () => samples.length >= afterRecovery + TARGETS.length * 2, 10);
    done = true;
    await traffic;

    const statuses = new Set(samples.map((s) => s.status));
    expect([...statuses].sort(), 'only 200 and 503 while in flight').toEqual([200, 503]);
    const unclear = samples.filter((s) => s.status === 503 && !isClearDatabaseDownAnswer(s));
    expect(unclear).toEqual([]);
    expect(samples.slice(-TARGETS.length).map((s) => s.status)).toEqual(TARGETS.map(() => 200));
  });
});
