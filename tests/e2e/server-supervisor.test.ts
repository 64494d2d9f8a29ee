/**
 * `npm start` keeps the web server up through scripts/supervise-server.mjs. Here a supervisor of
 * its own (on a free port, the test run's database) serves saves from several connections while
 * its server process is killed with SIGKILL: a new server process answers again, the supervisor
 * logged the exit and the restart, and every save acknowledged before, during and after is in
 * the database. Waits are bounded (the goal: serving again within 10 s).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { acknowledgedSaveProblems, acknowledgement, markedDesign, saveBody, type AcknowledgedSave } from '../support/acknowledged-saves.ts';
import { freePort } from '../support/free-port.ts';
import { insertBoard } from '../support/designs.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

const CONNECTIONS = 4;
/** Each connection keeps saving until it has this many acknowledged saves after the restart. */
const SAVES_AFTER_RESTART = 3;
/** No loop runs longer than this many requests, whatever happens. */
const MAX_REQUESTS_PER_CONNECTION = 400;
const SERVES_AGAIN_WITHIN_MS = 10_000;

let supervisor: ChildProcess | undefined;
let log = '';
let builder: TestUser;

beforeAll(async () => {
  builder = await newShopUser('builder', 'Supervisor test shop');
});
afterAll(async () => {
  if (supervisor && supervisor.exitCode === null) {
    const exited = once(supervisor, 'exit');
    supervisor.kill('SIGTERM');
    await exited;
  }
  await closeDb();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The pids of the web server processes the supervisor has started, in order. */
function serverPids(): number[] {
  return [...log.matchAll(/web server started \(pid (\d+)\)/g)].map((m) => Number(m[1]));
}

async function waitFor(what: string, ms: number, check: () => boolean | Promise<boolean>): Promise<void> {
  const until = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`${what}: not within ${ms} ms. Supervisor log:\n${log}`);
    await sleep(50);
  }
}

const answers = (url: string) => fetch(`${url}/api/health`, { signal: AbortSignal.timeout(1000) }).then((r) => r.ok, () => false);

describe('the supervisor of `npm start` brings a killed web server back', () => {
  it('serves again after SIGKILL mid-load, logs it, and keeps every acknowledged save', async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    supervisor = spawn(process.execPath, ['scripts/supervise-server.mjs'], {
      env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), APP_ORIGIN: url },
      stdio: ['ignore', 'ignore', 'pipe'],
    });
    supervisor.stderr!.on('data', (chunk: Buffer) => (log += chunk.toString()));
    await waitFor('the first server answers', 20_000, () => answers(url));
    const [firstPid] = serverPids();
    expect(firstPid).toBeGreaterThan(0);

    const boardIds = await Promise.all(
      Array.from({ length: CONNECTIONS }, (_, i) => insertBoard(builder.shopId, builder.id, { ...markedDesign(`Supervised board ${i}`) })),
    );
    const acknowledged: AcknowledgedSave[] = [];
    let killed = false;
    let failedRequests = 0;
    const afterRestart = new Array<number>(CONNECTIONS).fill(0);

    const saveLoop = async (connection: number) => {
      const id = boardIds[connection]!;
      let version = 1;
      for (let n = 0; n < MAX_REQUESTS_PER_CONNECTION && afterRestart[connection]! < SAVES_AFTER_RESTART; n++) {
        const marker = `Supervised board ${connection} save ${n}`;
        try {
          const response = await fetch(`${url}/api/boards/${id}`, {
            method: 'PATCH',
            headers: { 'content-type': 'application/json', origin: url, cookie: builder.cookie },
            body: saveBody(version, marker),
          });
          const body = await response.text();
          if (response.status === 200) {
            const saved = acknowledgement(id, marker, body);
            acknowledged.push(saved);
            version = saved.version;
            if (killed && serverPids().length > 1) afterRestart[connection]!++;
          } else if (response.status === 409) {
            // A save in flight at the kill may have been stored without its answer arriving.
            version = Number((JSON.parse(body) as { currentVersion: number }).currentVersion);
          } else {
            throw new Error(`save answered ${response.status}: ${body}`);
          }
        } catch (error) {
          if (error instanceof Error && error.message.startsWith('save answered')) throw error;
          failedRequests++;
          await sleep(50);
        }
      }
    };
    const loops = Array.from({ length: CONNECTIONS }, (_, c) => saveLoop(c));

    await waitFor('some saves are acknowledged before the kill', 20_000, () => acknowledged.length >= CONNECTIONS * 2);
    const beforeKill = acknowledged.length;
    process.kill(firstPid!, 'SIGKILL');
    killed = true;
    await waitFor('the supervisor starts a second server', SERVES_AGAIN_WITHIN_MS, () => serverPids().length >= 2);
    await waitFor('the second server answers', SERVES_AGAIN_WITHIN_MS, () => answers(url));
    await Promise.all(loops);

    const [, secondPid] = serverPids();
    expect(secondPid).not.toBe(firstPid);
    expect(log).toMatch(/web server exited unexpectedly \(signal SIGKILL\).*starting it again in 1 s \(restart 1\)/);
    expect(supervisor.exitCode, 'the supervisor itself kept running').toBeNull();
    expect(afterRestart).toEqual(new Array(CONNECTIONS).fill(SAVES_AFTER_RESTART));
    expect(acknowledged.length).toBeGreaterThan(beforeKill);
    expect(await acknowledgedSaveProblems(acknowledged)).toEqual([]);
    console.log(`supervisor: ${acknowledged.length} saves acknowledged (${beforeKill} before the kill), ${failedRequests} requests failed while the server was down`);
  });
});
