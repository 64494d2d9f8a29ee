/** The test run's MariaDB (started by scripts/test.sh) and a way to stop and start it. */
import { execFile, execFileSync } from 'node:child_process';
import { promisify } from 'node:util';

export { db, closeDb, getPool } from '~/lib/db/client.server.ts';

function mariadb(command: 'start' | 'stop'): void {
  execFileSync('bash', ['scripts/db/mariadb.sh', command], { stdio: 'inherit', env: process.env });
}

export const stopDatabase = () => mariadb('stop');
export const startDatabase = () => mariadb('start');

/** Like stopDatabase/startDatabase, without blocking this process (requests keep flowing meanwhile). */
export async function databaseCommand(command: 'start' | 'stop'): Promise<void> {
  await promisify(execFile)('bash', ['scripts/db/mariadb.sh', command], { env: process.env });
}
