import { getPool } from './client.server.ts';
import { withDbTimeout } from './db-errors.ts';
import { isReadyAnswer, NODE_READY_SQL } from './failover-socket.server.ts';

/**
 * True when MariaDB answers within `ms` milliseconds and takes queries (a Galera node outside the
 * primary component answers but is not ready). Never throws.
 */
export async function databaseAnswers(ms = 1500): Promise<boolean> {
  try {
    const [rows] = await withDbTimeout(getPool().query(NODE_READY_SQL), ms);
    return isReadyAnswer(rows);
  } catch {
    return false;
  }
}
