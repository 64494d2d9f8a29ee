/**
 * Load on the built server (autocannon on 127.0.0.1, 10 connections, LOAD_SECONDS each, 3 by
 * default): the layout endpoint, the Boards list and Boards saves. No errors, no 5xx, and every
 * save the server acknowledged is in the database afterwards, in order. Speed is not asserted
 * here; `npm run bench` measures it.
 *
 * The load runs against a second built server of its own (same database) started with
 * RATE_LIMIT_SCALE=1000: thousands of layout requests in 3 s from 127.0.0.1 are far past the real
 * per-address budget, which is the point of the budget, not of this test. Its counters live under
 * their own key prefix, so the main test server's budgets for 127.0.0.1 stay whole; every request
 * still goes through the shared limiter, so its cost is part of the load. Budgets themselves are
 * tested in rate-limits.test.ts against the real numbers.
 */
import autocannon from 'autocannon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { acknowledgedSaveProblems, acknowledgement, saveBody, type AcknowledgedSave } from '../support/acknowledged-saves.ts';
import { startBuiltServer, type BuiltServer } from '../support/built-server.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { newShopUser, signInAs, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

const CONNECTIONS = 10;
const SECONDS = Number(process.env.LOAD_SECONDS ?? 3);

interface Outcome {
  requests: number;
  statuses: Record<string, number>;
  errors: number;
  timeouts: number;
}

function outcome(result: autocannon.Result): Outcome {
  const statuses: Record<string, number> = {};
  for (const [code, stat] of Object.entries(result.statusCodeStats ?? {})) statuses[code] = stat?.count ?? 0;
  return { requests: result.requests.total, statuses, errors: result.errors, timeouts: result.timeouts };
}

const count5xx = (o: Outcome) => Object.entries(o.statuses).reduce((n, [code, c]) => n + (code.startsWith('5') ? c : 0), 0);

/** RATE_LIMIT_SCALE of the load server (README, Configuration): load testing only. */
const LOAD_RATE_LIMIT_SCALE = '1000';

let server: BuiltServer;
let BASE_URL: string;
let demoBuilder: TestUser;
let loadBuilder: TestUser;

beforeAll(async () => {
  server = await startBuiltServer({ env: { RATE_LIMIT_SCALE: LOAD_RATE_LIMIT_SCALE } });
  BASE_URL = server.url;
  demoBuilder = await signInAs('builder@wrenfield.example');
  // Saves go to a shop of their own, so the demo shop's boards stay as other tests expect them.
  loadBuilder = await newShopUser('builder', 'Load test shop');
});
afterAll(async () => {
  await server?.stop();
  await closeDb();
});

describe(`load: ${CONNECTIONS} connections for ${SECONDS} s each on the built server`, () => {
  it('POST /api/layout answers every request with 200 and no errors', async () => {
    const result = outcome(
      await autocannon({
        url: `${BASE_URL}/api/layout`,
        method: 'POST',
        connections: CONNECTIONS,
        duration: SECONDS,
        headers: { 'content-type': 'application/json', origin: BASE_URL },
        body: JSON.stringify(fixtureDesign('seven-string-fan')),
      }),
    );
    expect(result.requests).toBeGreaterThan(CONNECTIONS);
    expect(result).toMatchObject({ errors: 0, timeouts: 0, statuses: { 200: result.requests } });
    expect(Object.keys(result.statuses)).toEqual(['200']);
  });

  it('the Boards list (GET /api/boards as the demo builder) answers every request with 200', async () => {
    const result = outcome(
      await autocannon({
        url: `${BASE_URL}/api/boards?q=a&sort=scale&dir=desc&pageSize=25`,
        connections: CONNECTIONS,
        duration: SECONDS,
        headers: { cookie: demoBuilder.cookie },
      }),
    );
    expect(result.requests).toBeGreaterThan(CONNECTIONS);
    expect(result).toMatchObject({ errors: 0, timeouts: 0 });
    expect(Object.keys(result.statuses)).toEqual(['200']);
  });

  it('saves (PATCH /api/boards/{id}, one board per connection): no 5xx, every acknowledged save stored in order', async () => {
    const boardIds = await Promise.all(
      Array.from({ length: CONNECTIONS }, (_, i) => insertBoard(loadBuilder.shopId, loadBuilder.id, { ...fixtureDesign('seven-string-fan'), name: `Load board ${i}` })),
    );
    const acknowledged: AcknowledgedSave[] = [];
    let conflicts = 0;
    // One autocannon client per board: each sends its next save only after the answer to the last,
    // over the version that answer named (a 409 would hand over the current version instead).
    const runs = boardIds.map((boardId, connection) => {
      let version = 1;
      let sequence = 0;
      let marker = '';
      return autocannon({
        url: BASE_URL,
        connections: 1,
        duration: SECONDS,
        requests: [
          {
            method: 'PATCH',
            path: `/api/boards/${boardId}`,
            headers: { 'content-type': 'application/json', origin: BASE_URL, cookie: loadBuilder.cookie },
            setupRequest: (request) => {
              marker = `Load board ${connection} save ${++sequence}`;
              return { ...request, body: saveBody(version, marker) };
            },
            onResponse: (status, body) => {
              if (status === 200) {
                const save = acknowledgement(boardId, marker, body);
                acknowledged.push(save);
                version = save.version;
              } else if (status === 409) {
                conflicts++;
                version = Number((JSON.parse(body) as { currentVersion: number }).currentVersion);
              }
            },
          },
        ],
      }).then(outcome);
    });
    const results = await Promise.all(runs);

    const total = (pick: (o: Outcome) => number) => results.reduce((n, o) => n + pick(o), 0);
    expect(total((o) => o.errors + o.timeouts), 'connection errors and timeouts').toBe(0);
    expect(total(count5xx), '5xx answers').toBe(0);
    const answered200 = total((o) => o.statuses['200'] ?? 0);
    const answered409 = total((o) => o.statuses['409'] ?? 0);
    expect(answered200 + answered409, 'every answer is a 200 or a 409').toBe(total((o) => o.requests));
    expect(answered200, '200s counted by autocannon and by the ledger').toBe(acknowledged.length);
    expect(answered409).toBe(conflicts);
    expect(acknowledged.length).toBeGreaterThan(CONNECTIONS);
    expect(await acknowledgedSaveProblems(acknowledged)).toEqual([]);
  });
});
