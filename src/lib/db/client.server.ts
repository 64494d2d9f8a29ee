/** The one MariaDB connection pool and Drizzle instance for the app process. */
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { config } from '~/lib/config/env.server.ts';
import * as schema from './schema.ts';

export type Db = MySql2Database<typeof schema>;

let pool: mysql.Pool | undefined;
let instance: Db | undefined;

export function getPool(): mysql.Pool {
  if (!pool) {
    const { host, port, user, password, database } = config().database;
    pool = mysql.createPool({
      host,
      port,
      user,
      password,
      database,
      connectionLimit: 10,
      // Fail fast when MariaDB is down so requests get a 503 instead of hanging.
      connectTimeout: 1500,
      enableKeepAlive: true,
      timezone: 'Z',
      dateStrings: false,
    });
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
