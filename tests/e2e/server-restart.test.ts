/**
 * Restart: the built server (scripts/serve-built-app.mjs, what `npm start` runs) is stopped and
 * started again between writes. A session signed in before the restart still works after it, and
 * every save acknowledged before it is still there; saving carries on from the same version.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { acknowledgedSaveProblems, acknowledgement, markedDesign, saveBody, type AcknowledgedSave } from '../support/acknowledged-saves.ts';
import { startBuiltServer, type BuiltServer } from '../support/built-server.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

/** The password tests/support/sessions.ts gives every user it makes. */
const TEST_PASSWORD = 'test-password-1';

let server: BuiltServer | undefined;
let builder: TestUser;

beforeAll(async () => {
  builder = await newShopUser('builder', 'Restart test shop');
});
afterAll(async () => {
  await server?.stop();
  await closeDb();
});

/** Signs in through the sign-in form, as a browser would; returns the Cookie header it set. */
async function signIn(url: string, email: string): Promise<string> {
  const response = await fetch(`${url}/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: url },
    body: new URLSearchParams({ email, password: TEST_PASSWORD }),
    redirect: 'manual',
  });
  expect(response.status, 'sign-in answers with a redirect').toBe(303);
  const cookie = response.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  expect(cookie, 'sign-in sets the session cookie').toBeDefined();
  return cookie!.split(';')[0]!;
}

async function save(url: string, cookie: string, id: number, version: number, marker: string): Promise<AcknowledgedSave> {
  const response = await fetch(`${url}/api/boards/${id}`, {
    method: 'PATCH',
    headers: { 'content-type': 'application/json', origin: url, cookie },
    body: saveBody(version, marker),
  });
  const body = await response.text();
  expect(response.status, body).toBe(200);
  return acknowledgement(id, marker, body);
}

describe('the built server is stopped and started between writes', () => {
  it('keeps the signed-in session and every acknowledged save', async () => {
    server = await startBuiltServer();
    const { url, port } = server;
    const cookie = await signIn(url, builder.email);
    const created = await fetch(`${url}/api/boards`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: url, cookie },
      body: JSON.stringify({ design: markedDesign('Restart board') }),
    });
    expect(created.status).toBe(201);
    const { id, version: firstVersion } = (await created.json()) as { id: number; version: number };
    const acknowledged: AcknowledgedSave[] = [];
    let version = firstVersion;
    for (const n of [1, 2, 3]) {
      const saved = await save(url, cookie, id, version, `Restart board before ${n}`);
      acknowledged.push(saved);
      version = saved.version;
    }

    await server.stop();
    expect(await fetch(`${url}/api/version`).then(() => 'answered', () => 'down'), 'the server is really stopped').toBe('down');
    server = await startBuiltServer({ port });

    const account = await fetch(`${url}/account`, { headers: { cookie }, redirect: 'manual' });
    expect(account.status, 'the session from before the restart is still signed in').toBe(200);
    const board = await fetch(`${url}/api/boards/${id}`, { headers: { cookie } });
    expect(board.status).toBe(200);
    expect(await board.json()).toMatchObject({ version, revision: acknowledged.at(-1)!.revision, design: { name: 'Restart board before 3' } });
    for (const n of [1, 2]) {
      const saved = await save(url, cookie, id, version, `Restart board after ${n}`);
      acknowledged.push(saved);
      version = saved.version;
    }
    expect(acknowledged.map((s) => s.revision)).toEqual([2, 3, 4, 5, 6]);
    expect(await acknowledgedSaveProblems(acknowledged)).toEqual([]);
  });
});
