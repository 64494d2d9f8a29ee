import { getPool } from './client.server.ts';
import { withDbTimeout } from './db-errors.ts';

/**
 * True when MariaDB answers within `ms` milliseconds and takes queries: a Galera node outside the
 * primary component answers but reports `wsrep_ready` OFF (a server without Galera has no such
 * status). Never throws.
 */
export async function databaseAnswers(ms = 1500): Promise<boolean> {
  try {
    const [rows] = await withDbTimeout(getPool().query("SHOW GLOBAL STATUS WHERE Variable_name = 'wsrep_ready'"), ms);
    const value = Array.isArray(rows) ? (rows[0] as { Value?: unknown } | undefined)?.Value : undefined;
    return value === undefined || value === 'ON';
  } catch {
    return false;
  }
}
