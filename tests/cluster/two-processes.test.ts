/**
 * Two app processes on one replicated database keep no state of their own: process A's pool
 * writes through node 1, process B's through node 2 (the hosts listed in other orders). Signed
 * in on one is signed in on the other, the rate limit counts across both, a stale save through B
 * after a save through A is a 409, a proof link made on A opens on B; and saves of one board
 * through both at once give one 200 and one 409 each time, never two 200s or a 500 (Galera's
 * certification conflicts are retried and end in the revision check).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { SIGN_IN_BUDGETS } from '~/lib/http/rate-budgets.ts';
import { acknowledgedSaveProblems, acknowledgement, markedDesign, saveBody, type AcknowledgedSave } from '../support/acknowledged-saves.ts';
import type { BuiltServer } from '../support/built-server.ts';
import { nodeConnection, startClusterApp } from '../support/cluster.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

/** The password tests/support/sessions.ts gives every user it makes. */
const TEST_PASSWORD = 'test-password-1';
const CONFLICT_ROUNDS = 8;

let a: BuiltServer;
let b: BuiltServer;
let builder: TestUser;

beforeAll(async () => {
  [a, b] = await Promise.all([startClusterApp([1, 2, 3]), startClusterApp([2, 3, 1])]);
  builder = await newShopUser('builder', 'Two-process shop');
});
afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop()]);
  await closeDb();
});

function signIn(url: string, email: string, password: string): Promise<Response> {
  return fetch(`${url}/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: url },
    body: new URLSearchParams({ email, password }),
    redirect: 'manual',
  });
}

function send(url: string, method: string, path: string, body?: string): Promise<Response> {
  return fetch(`${url}${path}`, { method, headers: { 'content-type': 'application/json', origin: url, cookie: builder.cookie }, ...(body === undefined ? {} : { body }) });
}

async function newBoard(url: string, name: string): Promise<{ id: number; version: number }> {
  const created = await send(url, 'POST', '/api/boards', JSON.stringify({ design: markedDesign(name) }));
  expect(created.status).toBe(201);
  return (await created.json()) as { id: number; version: number };
}

describe('two app processes on one Galera cluster', () => {
  it('share the session: signed in on A, signed in on B', async () => {
    const response = await signIn(a.url, builder.email, TEST_PASSWORD);
    expect(response.status, 'sign-in on A redirects').toBe(303);
    const cookie = response.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`))?.split(';')[0];
    expect(cookie, 'A sets the session cookie').toBeDefined();
    const account = await fetch(`${b.url}/account`, { headers: { cookie: cookie! }, redirect: 'manual' });
    expect(account.status, 'B knows the session A made').toBe(200);
  });

  it('count the sign-in rate limit across both', async () => {
    const target = await newShopUser('builder', 'Rate limit shop');
    const budget = SIGN_IN_BUDGETS.perAccountAndAddress.points;
    for (let i = 0; i < budget; i++) {
      const via = i % 2 === 0 ? a : b;
      expect((await signIn(via.url, target.email, `wrong-${i}`)).status, `failure ${i + 1} of ${budget}`).toBe(401);
    }
    expect((await signIn(a.url, target.email, 'wrong-a')).status, 'A refuses once both together used the budget').toBe(429);
    expect((await signIn(b.url, target.email, 'wrong-b')).status, 'B refuses too').toBe(429);
  });

  it('refuse a stale save through B after a save through A with 409', async () => {
    const board = await newBoard(a.url, 'Two-process board');
    const first = await send(a.url, 'PATCH', `/api/boards/${board.id}`, saveBody(board.version, 'Saved on A'));
    expect(first.status).toBe(200);
    const stale = await send(b.url, 'PATCH', `/api/boards/${board.id}`, saveBody(board.version, 'Stale on B'));
    expect(stale.status).toBe(409);
    expect(await stale.json()).toMatchObject({ current: { design: { name: 'Saved on A' } } });
  });

  it('open on B a proof link made on A', async () => {
    const board = await newBoard(a.url, 'Proof board');
    const made = await send(a.url, 'POST', `/api/boards/${board.id}/proofs`, JSON.stringify({ clientName: 'Ines Calloway', clientEmail: 'ines@test.example' }));
    expect(made.status).toBe(201);
    const { link } = (await made.json()) as { link: string };
    const page = await fetch(`${b.url}${new URL(link).pathname}`);
    expect(page.status).toBe(200);
    expect(await page.text(), 'the proof page names the board').toContain('Proof: Proof board');
  });

  it('give one 200 and one 409 for saves of one board through two nodes at once', async () => {
    const board = await newBoard(a.url, 'Raced board');
    const certFailures = async () => {
      const totals = await Promise.all(
        ([1, 2] as const).map(async (n) => {
          const connection = await nodeConnection(n);
          try {
            const [rows] = await connection.query("SHOW GLOBAL STATUS WHERE Variable_name IN ('wsrep_local_cert_failures', 'wsrep_local_bf_aborts')");
            return (rows as { Value: string }[]).reduce((sum, r) => sum + Number(r.Value), 0);
          } finally {
            await connection.end();
          }
        }),
      );
      return totals.reduce((x, y) => x + y, 0);
    };
    const before = await certFailures();
    const acknowledged: AcknowledgedSave[] = [];
    let version = board.version;
    for (let round = 0; round < CONFLICT_ROUNDS; round++) {
      const markers = [`Round ${round} via A`, `Round ${round} via B`];
      const answers = await Promise.all([a, b].map((s, i) => send(s.url, 'PATCH', `/api/boards/${board.id}`, saveBody(version, markers[i]!))));
      const statuses = answers.map((r) => r.status);
      expect([...statuses].sort(), `round ${round}: ${statuses.join(', ')}`).toEqual([200, 409]);
      const winner = statuses.indexOf(200);
      const saved = acknowledgement(board.id, markers[winner]!, await answers[winner]!.text());
      acknowledged.push(saved);
      version = saved.version;
    }
    expect(await acknowledgedSaveProblems(acknowledged)).toEqual([]);
    const conflicts = (await certFailures()) - before;
    console.log(`cluster: ${CONFLICT_ROUNDS} raced rounds, ${conflicts} certification conflicts or brute-force aborts on nodes 1 and 2`);
  });
});
