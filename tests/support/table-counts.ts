/** Row counts of every table in the test database, to show a request changed nothing. */
import type { RowDataPacket } from 'mysql2/promise';
import { getPool } from './test-db.ts';

export async function tableCounts(): Promise<Record<string, number>> {
  const [tables] = await getPool().query<RowDataPacket[]>(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [rows] = await getPool().query<RowDataPacket[]>(`SELECT COUNT(*) AS n FROM \`${String(name)}\``);
    counts[String(name)] = Number(rows[0]?.n);
  }
  return counts;
}
