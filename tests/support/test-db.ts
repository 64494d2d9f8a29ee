/** The test run's MariaDB (started by scripts/test.sh) and a way to stop and start it. */
import { execFileSync } from 'node:child_process';

export { db, closeDb, getPool } from '~/lib/db/client.server.ts';

function mariadb(command: 'start' | 'stop'): void {
  execFileSync('bash', ['scripts/db/mariadb.sh', command], { stdio: 'inherit', env: process.env });
}

export const stopDatabase = () => mariadb('stop');
export const startDatabase = () => mariadb('start');
