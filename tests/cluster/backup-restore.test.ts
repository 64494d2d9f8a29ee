/**
 * A backup of the cluster restores into a fresh one: boards with revisions and a proof are made
 * through an app process, `npm run backup -- --cluster` dumps the database from one node, and
 * `npm run restore -- FILE --cluster` bootstraps a new three-node cluster (its own directory and
 * ports) and loads the dump through one node. Every table is then read back from each new node
 * alone (row count and a checksum of its content, against the backed-up cluster's), and an app
 * process on the new cluster opens a board and the proof with the session made before the backup.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { markedDesign, saveBody } from '../support/acknowledged-saves.ts';
import type { BuiltServer } from '../support/built-server.ts';
import { clusterUrl, nodeConnection, NODES, startClusterApp, type NodeNumber } from '../support/cluster.ts';
import { startBuiltServer } from '../support/built-server.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { tableFingerprints, type TableFingerprint } from '../support/table-fingerprints.ts';
import { closeDb } from '../support/test-db.ts';

/** The board routes and the tables that must not come back empty. */
const BOARDS_API = '/api/boards';
const CONTENT_TABLES = ['boards', 'board_revisions', 'proofs'] as const;
const BOARDS = 3;
const SAVES_PER_BOARD = 2;
/** What `npm run restore -- --cluster` makes when DATABASE_URL is not set (scripts/lib/galera.sh, galera_app_url). */
const FRESH = { user: 'kerfline', password: 'kerfline-local', database: 'kerfline' };

const run = promisify(execFile);
const work = mkdtempSync(join(tmpdir(), 'kerfline-backup-test-'));
const freshDir = join(work, 'fresh-cluster');
let app: BuiltServer | undefined;
let restoredApp: BuiltServer | undefined;
let builder: TestUser;

function send(url: string, method: string, path: string, body?: string): Promise<Response> {
  return fetch(`${url}${path}`, { method, headers: { 'content-type': 'application/json', origin: url, cookie: builder.cookie }, ...(body === undefined ? {} : { body }) });
}

/** The fresh cluster's node ports, from the ports.env restore.sh chose. */
function freshPorts(): Record<NodeNumber, number> {
  const text = readFileSync(join(freshDir, 'ports.env'), 'utf8');
  const port = (n: NodeNumber) => Number(new RegExp(`NODE_PORT_${n}=(\\d+)`).exec(text)?.[1]);
  return { 1: port(1), 2: port(2), 3: port(3) };
}

/** A connection to node `n` of the fresh cluster alone; each read waits until the node has applied every earlier write. */
async function freshConnection(n: NodeNumber): Promise<mysql.Connection> {
  const connection = await mysql.createConnection({ host: '127.0.0.1', port: freshPorts()[n], ...FRESH, connectTimeout: 2000 });
  await connection.query('SET SESSION wsrep_sync_wait = 1');
  return connection;
}

async function fingerprintsOf(open: () => Promise<mysql.Connection>): Promise<Record<string, TableFingerprint>> {
  const connection = await open();
  try {
    return await tableFingerprints(connection);
  } finally {
    await connection.end();
  }
}

beforeAll(async () => {
  app = await startClusterApp(NODES);
  builder = await newShopUser('builder', 'Backup shop');
});
afterAll(async () => {
  await Promise.all([app?.stop(), restoredApp?.stop()]);
  for (const n of [3, 2, 1]) await run('bash', ['scripts/cluster/galera-node.sh', 'stop', String(n)], { env: { ...process.env, CLUSTER_DIR: freshDir } }).catch(() => undefined);
  await closeDb();
  rmSync(work, { recursive: true, force: true });
});

describe('backup of a cluster, restored into a fresh cluster', () => {
  it('holds every row of every table, and the app opens a board and a proof from it', async () => {
    const boards: { id: number; name: string; version: number }[] = [];
    for (let b = 0; b < BOARDS; b++) {
      const created = await send(app!.url, 'POST', BOARDS_API, JSON.stringify({ design: markedDesign(`Backed-up board ${b}`) }));
      expect(created.status).toBe(201);
      let { id, version } = (await created.json()) as { id: number; version: number };
      let name = '';
      for (let s = 0; s < SAVES_PER_BOARD; s++) {
        name = `Backed-up board ${b} save ${s}`;
        const saved = await send(app!.url, 'PATCH', `${BOARDS_API}/${id}`, saveBody(version, name));
        expect(saved.status).toBe(200);
        version = ((await saved.json()) as { version: number }).version;
      }
      boards.push({ id, name, version });
    }
    const proof = await send(app!.url, 'POST', `${BOARDS_API}/${boards[0]!.id}/proofs`, JSON.stringify({ clientName: 'Ines Calloway', clientEmail: 'ines@test.example' }));
    expect(proof.status).toBe(201);
    const proofPath = new URL(((await proof.json()) as { link: string }).link).pathname;
    // Nothing writes while the source is read and dumped: its content is then what the dump holds.
    await app!.stop();
    app = undefined;
    const source = await fingerprintsOf(async () => {
      const connection = await nodeConnection(1);
      await connection.query('SET SESSION wsrep_sync_wait = 1');
      return connection;
    });
    for (const table of CONTENT_TABLES) expect(source[table]?.rows, `${table} has rows to back up`).toBeGreaterThan(0);

    const backupStarted = Date.now();
    const backup = await run('bash', ['scripts/backup.sh', '--cluster'], { env: { ...process.env, DATABASE_URL: clusterUrl(), BACKUP_DIR: work } });
    const backupMs = Date.now() - backupStarted;
    const file = backup.stdout.trim().split('\n').at(-1)!;
    expect(readFileSync(file, 'utf8'), 'the dump has no table locks (Galera does not replicate them)').not.toContain('LOCK TABLES');

    const restoreStarted = Date.now();
    const restoreEnv: NodeJS.ProcessEnv = { ...process.env, CLUSTER_DIR: freshDir };
    delete restoreEnv.DATABASE_URL;
    const restored = await run('bash', ['scripts/restore.sh', file, '--cluster'], { env: restoreEnv, timeout: 180_000 });
    const restoreMs = Date.now() - restoreStarted;
    expect(restored.stdout, 'restore says every node holds the tables').toMatch(/restored \d+ tables .* on every node/);
    const ports = freshPorts();
    expect(Object.values(ports).some((p) => clusterUrl().includes(`:${p}`)), 'the fresh cluster is not the backed-up one').toBe(false);

    for (const n of NODES) {
      expect(await fingerprintsOf(() => freshConnection(n)), `node ${n} of the fresh cluster holds every row`).toEqual(source);
    }

    const hosts = NODES.map((n) => `127.0.0.1:${ports[n]}`).join(',');
    restoredApp = await startBuiltServer({ env: { DATABASE_URL: `mysql://${FRESH.user}:${FRESH.password}@${hosts}/${FRESH.database}` } });
    const board = await send(restoredApp.url, 'GET', `${BOARDS_API}/${boards.at(-1)!.id}`);
    expect(board.status, 'the session made before the backup is valid on the fresh cluster').toBe(200);
    expect(await board.json()).toMatchObject({ version: boards.at(-1)!.version, design: { name: boards.at(-1)!.name } });
    const page = await fetch(`${restoredApp.url}${proofPath}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(`Proof: ${boards[0]!.name}`);

    const rows = Object.values(source).reduce((sum, t) => sum + t.rows, 0);
    console.log(
      `cluster backup: ${Object.keys(source).length} tables, ${rows} rows; backup from one node ${(backupMs / 1000).toFixed(1)} s; fresh three-node cluster bootstrapped and restored ${(restoreMs / 1000).toFixed(1)} s`,
    );
  });
});
