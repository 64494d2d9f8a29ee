/**
 * Database fault on the running built server: MariaDB is stopped while requests are in flight,
 * then started again. The app must answer 503 with a clear JSON message on API routes that need
 * the database (never a 500 or a hang), keep serving what needs no database, and recover without
 * being restarted. Feature routes that read or write the database belong in TARGETS. Boards saves
 * keep running through the fault: every acknowledged one is stored, every other one got a 503.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL } from '../support/browser.ts';
import { acknowledgedSaveProblems, acknowledgement, saveBody, type AcknowledgedSave } from '../support/acknowledged-saves.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { newShopUser, signInAs, type TestUser } from '../support/sessions.ts';
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
    // What needs no database keeps working: the layout endpoint's budget counts per process meanwhile.
    expect((await call({ name: 'API anonymous', path: '/api/version', signedIn: false })).status).toBe(200);
    const layout = await fetch(`${BASE_URL}/api/layout`, {
      method: 'POST',
      headers: { origin: BASE_URL, 'content-type': 'application/json' },
      body: JSON.stringify(fixtureDesign('seven-string-fan')),
      signal: AbortSignal.timeout(5000),
    });
    expect(layout.status).toBe(200);
    // Sign-in needs its rate limit counters, which live in MariaDB: a clear 503, never a 500.
    const signIn = await fetch(`${BASE_URL}/sign-in`, {
      method: 'POST',
      headers: { origin: BASE_URL, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email: 'owner@wrenfield.example', password: 'whatever-it-is' }).toString(),
      signal: AbortSignal.timeout(5000),
    });
    expect(signIn.status).toBe(503);
    expect(await signIn.text()).toMatch(/database is not answering/i);

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

interface SaveAttempt {
  boardId: number;
  marker: string;
  status: number;
  contentType: string;
  body: string;
}

/**
 * Saves one board again and again, each over the version the last 200 named, until `stop()`;
 * a 409 (a save whose answer was lost but whose write went through) hands over the current version.
 */
async function keepSaving(writer: TestUser, boardId: number, stop: () => boolean, attempts: SaveAttempt[], acknowledged: AcknowledgedSave[]): Promise<void> {
  let version = 1;
  for (let sequence = 1; !stop(); sequence++) {
    const marker = `Fault board ${boardId} save ${sequence}`;
    let attempt: SaveAttempt;
    try {
      const response = await fetch(`${BASE_URL}/api/boards/${boardId}`, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json', origin: BASE_URL, cookie: writer.cookie },
        body: saveBody(version, marker),
        signal: AbortSignal.timeout(5000),
      });
      attempt = { boardId, marker, status: response.status, contentType: response.headers.get('content-type') ?? '', body: await response.text() };
    } catch (error) {
      attempt = { boardId, marker, status: 0, contentType: '', body: String(error) };
    }
    attempts.push(attempt);
    if (attempt.status === 200) {
      const save = acknowledgement(boardId, marker, attempt.body);
      acknowledged.push(save);
      version = save.version;
    } else if (attempt.status === 409) {
      version = Number((JSON.parse(attempt.body) as { currentVersion: number }).currentVersion);
    } else {
      // A 503 answer says to retry in a moment; the editor would wait for the next edit.
      await new Promise((r) => setTimeout(r, 50));
    }
  }
}

describe('Boards saves in flight while MariaDB stops and starts again', () => {
  it('acknowledges only stored saves, answers the others 503 with a clear message, and saves again after recovery', async () => {
    const writer = await newShopUser('builder', 'Database fault shop');
    const boards = await Promise.all([1, 2, 3].map((i) => insertBoard(writer.shopId, writer.id, { ...fixtureDesign('seven-string-fan'), name: `Fault board ${i}` })));
    const attempts: SaveAttempt[] = [];
    const acknowledged: AcknowledgedSave[] = [];
    let done = false;
    const savers = boards.map((id) => keepSaving(writer, id, () => done, attempts, acknowledged));
    const acknowledgedFor = (id: number) => acknowledged.filter((s) => s.boardId === id).length;

    expect(await waitFor(async () => boards.every((id) => acknowledgedFor(id) >= 2), 10), 'saves go through before the fault').toBe(true);
    await databaseCommand('stop');
    const beforeRestart = acknowledged.length;
    expect(await waitFor(async () => attempts.filter((a) => a.status === 503).length >= boards.length, 10), 'saves answered 503 while down').toBe(true);
    expect(acknowledged.length, 'nothing acknowledged while the database is down').toBe(beforeRestart);
    await databaseCommand('start');
    const afterRestart = new Map(boards.map((id) => [id, acknowledgedFor(id)]));
    const recovered = await waitFor(async () => boards.every((id) => acknowledgedFor(id) >= afterRestart.get(id)! + 2), 20);
    done = true;
    await Promise.all(savers);
    expect(recovered, 'every board saves again after the restart, without an app restart').toBe(true);

    const statuses = [...new Set(attempts.map((a) => a.status))].sort();
    expect(statuses.filter((s) => ![200, 409, 503].includes(s)), 'answers other than 200, 409 and 503').toEqual([]);
    const unclear = attempts.filter((a) => a.status === 503 && !isClearDatabaseDownAnswer({ target: 'save', ...a }));
    expect(unclear, '503 answers without a JSON message about the database').toEqual([]);
    expect(await acknowledgedSaveProblems(acknowledged)).toEqual([]);
  });
});
