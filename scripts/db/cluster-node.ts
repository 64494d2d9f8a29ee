/**
 * For backups of a cluster (scripts/backup.sh, scripts/restore.sh): the hosts of DATABASE_URL,
 * asked as the URL's user.
 *   cluster-node.ts ready   prints "HOST PORT" of the first listed host that takes queries and,
 *                           on a Galera node, is Synced (a dump from it sees every transaction
 *                           it has applied); exits 1 naming each host's state when none is.
 *   cluster-node.ts tables  prints "HOST:PORT TABLES" for every listed host: the tables of the
 *                           URL's database each node holds (a restore checks they all agree).
 */
import mysql from 'mysql2/promise';
import { parseDatabaseUrl, type DatabaseHost } from '../../src/lib/config/database-url.ts';

const parsed = parseDatabaseUrl(process.env.DATABASE_URL);
if (!parsed.ok) {
  console.error(`kerfline: ${parsed.message}`);
  process.exit(1);
}
const { user, password, database, hosts } = parsed.value;

/** The node's Galera state ("Synced", "Donor/Desynced", …), "single server" without Galera, or why it did not answer. */
async function stateOf(host: DatabaseHost): Promise<{ state: string; ready: boolean; tables?: number }> {
  let connection: mysql.Connection | undefined;
  try {
    connection = await mysql.createConnection({ host: host.host, port: host.port, user, password, database, connectTimeout: 2000 });
    const [rows] = await connection.query(
      "SELECT @@global.wsrep_on AS wsrep, (SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_LOCAL_STATE_COMMENT') AS state, (SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_READY') AS ready, (SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = DATABASE()) AS tables",
    );
    const row = (rows as { wsrep: number; state: string | null; ready: string | null; tables: number }[])[0]!;
    if (Number(row.wsrep) !== 1) return { state: 'single server', ready: true, tables: Number(row.tables) };
    return { state: row.state ?? 'unknown', ready: row.ready === 'ON' && row.state === 'Synced', tables: Number(row.tables) };
  } catch (error) {
    return { state: `not answering (${error instanceof Error ? error.message : String(error)})`, ready: false };
  } finally {
    await connection?.end().catch(() => undefined);
  }
}

const command = process.argv[2];
if (command === 'ready') {
  const states: string[] = [];
  for (const host of hosts) {
    const { state, ready } = await stateOf(host);
    if (ready) {
      console.log(`${host.host} ${host.port}`);
      process.exit(0);
    }
    states.push(`${host.host}:${host.port} ${state}`);
  }
  console.error(`kerfline: no listed database node is ready and Synced: ${states.join('; ')}`);
  process.exit(1);
} else if (command === 'tables') {
  for (const host of hosts) {
    const { state, tables } = await stateOf(host);
    console.log(`${host.host}:${host.port} ${tables ?? `? (${state})`}`);
  }
} else {
  console.error('usage: cluster-node.ts ready|tables');
  process.exit(1);
}
