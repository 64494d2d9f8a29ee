import { getPool } from './client.server.ts';
import { withDbTimeout } from './db-errors.ts';

/** True when MariaDB answers `SELECT 1` within `ms` milliseconds. Never throws. */
export async function databaseAnswers(ms = 1500): Promise<boolean> {
  try {
    await withDbTimeout(getPool().query('SELECT 1'), ms);
    return true;
  } catch {
    return false;
  }
}
