/**
 * Row counts of every table in the test database, in one round trip, to show a request changed
 * nothing. Leaves out `rate_limits`: every request counts there by design; it holds no data.
 */
import type { RowDataPacket } from 'mysql2/promise';
import { getPool } from './test-db.ts';

let countQuery: string | undefined;

export async function tableCounts(): Promise<Record<string, number>> {
  if (!countQuery) {
    const [tables] = await getPool().query<RowDataPacket[]>(
      'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> ? ORDER BY table_name',
      ['rate_limits'],
    );
    countQuery = `SELECT ${tables.map(({ name }) => `(SELECT COUNT(*) FROM \`${String(name)}\`) AS \`${String(name)}\``).join(', ')}`;
  }
  const [rows] = await getPool().query<RowDataPacket[]>(countQuery);
  return Object.fromEntries(Object.entries(rows[0] ?? {}).map(([table, n]) => [table, Number(n)]));
}
