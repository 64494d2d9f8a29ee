/**
 * The throwaway Galera cluster scripts/test-cluster.sh started (CLUSTER_DIR, NODE_PORT_n): its
 * nodes (stop, kill, start, wait, read one node alone), app processes on it with the hosts in a
 * chosen order, and HAProxy in front of some of them.
 */
import { execFile, spawn } from 'node:child_process';
import { once } from 'node:events';
import { promisify } from 'node:util';
import mysql from 'mysql2/promise';
import { parseDatabaseUrl } from '~/lib/config/database-url.ts';
import { startBuiltServer, type BuiltServer } from './built-server.ts';
import { freePort } from './free-port.ts';

export const NODES = [1, 2, 3] as const;
export type NodeNumber = (typeof NODES)[number];

function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the cluster tests with npm run test:cluster`);
  return value;
}

export function nodePort(n: NodeNumber): number {
  return Number(required(`NODE_PORT_${n}`));
}

/** DATABASE_URL of the test run with its nodes listed in `order` (the pool tries them in this order). */
export function clusterUrl(order: readonly NodeNumber[] = NODES): string {
  const parsed = parseDatabaseUrl(required('DATABASE_URL'));
  if (!parsed.ok) throw new Error(parsed.message);
  const { user, password, database } = parsed.value;
  return `mysql://${user}:${password}@${order.map((n) => `127.0.0.1:${nodePort(n)}`).join(',')}/${database}`;
}

/** Runs scripts/cluster/galera-node.sh: start, stop (clean), kill (SIGKILL), wait (until Synced). */
export async function galeraNode(command: 'start' | 'stop' | 'kill' | 'wait' | 'state', n: NodeNumber): Promise<string> {
  const { stdout } = await promisify(execFile)('bash', ['scripts/cluster/galera-node.sh', command, String(n)], { env: process.env, timeout: 180_000 });
  return stdout.trim();
}

/** A connection to node `n` alone (no failover), as the application user. */
export async function nodeConnection(n: NodeNumber): Promise<mysql.Connection> {
  const parsed = parseDatabaseUrl(required('DATABASE_URL'));
  if (!parsed.ok) throw new Error(parsed.message);
  const { user, password, database } = parsed.value;
  return mysql.createConnection({ host: '127.0.0.1', port: nodePort(n), user, password, database, connectTimeout: 2000 });
}

/** A built app process on the cluster, its pool trying the nodes in `order`. */
export function startClusterApp(order: readonly NodeNumber[], env: Record<string, string | undefined> = {}): Promise<BuiltServer> {
  return startBuiltServer({ env: { DATABASE_URL: clusterUrl(order), TRUSTED_PROXIES: 'loopback', ...env } });
}

export interface Balancer {
  url: string;
  stop(): Promise<void>;
}

/** HAProxy on a free port (`port` when given) over the app processes on `ports`; waits until it answers. */
export async function startBalancer(ports: readonly number[], port?: number): Promise<Balancer> {
  const chosen = port ?? (await freePort());
  const child = spawn('bash', ['scripts/cluster/haproxy-start.sh', String(chosen), ...ports.map(String)], { env: process.env, stdio: ['ignore', 'ignore', 'pipe'] });
  let log = '';
  child.stderr?.on('data', (chunk: Buffer) => (log = (log + chunk.toString()).slice(-2000)));
  const exited = once(child, 'exit');
  const url = `http://127.0.0.1:${chosen}`;
  const stop = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGTERM');
      await exited;
    }
  };
  for (let i = 0; i < 120; i++) {
    const ok = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(1000) }).then((r) => r.ok, () => false);
    if (ok) return { url, stop };
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  await stop();
  throw new Error(`HAProxy did not answer on ${url} within 30 s:\n${log}`);
}

/** Waits until `check` is true, polling every 250 ms, up to `ms`; says what it waited for otherwise. */
export async function waitUntil(what: string, check: () => Promise<boolean>, ms: number): Promise<void> {
  const until = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`gave up waiting: ${what} (${ms} ms)`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
