/**
 * Every base table of a connection's database as its row count and a SHA-256 of its rows (all
 * columns, in primary-key order, bytes as hex, times as ISO strings), to show two databases hold
 * the same content row for row (a backup and its restore). Reads the table list from
 * information_schema, so it names no table itself.
 */
import { createHash } from 'node:crypto';
import type { Connection, RowDataPacket } from 'mysql2/promise';

export interface TableFingerprint {
  rows: number;
  sha256: string;
}

function plain(value: unknown): unknown {
  if (Buffer.isBuffer(value)) return `hex:${value.toString('hex')}`;
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'bigint') return value.toString();
  return value;
}

export async function tableFingerprints(connection: Connection): Promise<Record<string, TableFingerprint>> {
  const [tables] = await connection.query<RowDataPacket[]>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
  );
  const out: Record<string, TableFingerprint> = {};
  for (const { name } of tables) {
    const [keys] = await connection.query<RowDataPacket[]>(
      "SELECT column_name AS name FROM information_schema.key_column_usage WHERE table_schema = DATABASE() AND table_name = ? AND constraint_name = 'PRIMARY' ORDER BY ordinal_position",
      [name],
    );
    const [columns] = await connection.query<RowDataPacket[]>(
      'SELECT column_name AS name FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = ? ORDER BY ordinal_position',
      [name],
    );
    const order = (keys.length > 0 ? keys : columns).map((c) => `\`${String(c.name)}\``).join(', ');
    const [rows] = await connection.query<RowDataPacket[]>(`SELECT * FROM \`${String(name)}\` ORDER BY ${order}`);
    const hash = createHash('sha256');
    for (const row of rows) hash.update(`${JSON.stringify(columns.map((c) => plain(row[String(c.name)])))}\n`);
    out[String(name)] = { rows: rows.length, sha256: hash.digest('hex') };
  }
  return out;
}
