/**
 * The one MariaDB connection pool and Drizzle instance for the app process. With several hosts in
 * DATABASE_URL (a Galera cluster) each new connection goes to the first host that answers and is
 * ready (failover-socket.server.ts), and a read whose connection was lost runs again there
 * (read-retry.server.ts).
 */
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { config } from '~/lib/config/env.server.ts';
import { FailoverSocket, HostList, watchReadiness } from './failover-socket.server.ts';
import { retryReadsOnLostConnection } from './read-retry.server.ts';
import * as schema from './schema.ts';

/** Fail fast when MariaDB is down so requests get a 503 instead of hanging. */
const CONNECT_TIMEOUT_MS = 1500;

export type Db = MySql2Database<typeof schema>;

let pool: mysql.Pool | undefined;
let instance: Db | undefined;

export function getPool(): mysql.Pool {
  if (!pool) {
    const { host, port, hosts, user, password, database } = config().database;
    const list = hosts.length > 1 ? new HostList(hosts) : undefined;
    pool = mysql.createPool({
      ...(list ? { stream: () => new FailoverSocket(list, CONNECT_TIMEOUT_MS) } : { host, port }),
      user,
      password,
      database,
      connectionLimit: 10,
      connectTimeout: list ? CONNECT_TIMEOUT_MS * hosts.length : CONNECT_TIMEOUT_MS,
      enableKeepAlive: true,
      timezone: 'Z',
      dateStrings: false,
    });
    if (list) {
      watchReadiness(pool.pool, list);
      retryReadsOnLostConnection(pool);
    }
  }
  return pool;
}

export function db(): Db {
  if (!instance) instance = drizzle(getPool(), { schema, mode: 'default' });
  return instance;
}

/** Closes the pool (tests and scripts that must exit). */
export async function closeDb(): Promise<void> {
  const open = pool;
  pool = undefined;
  instance = undefined;
  await open?.end();
}
