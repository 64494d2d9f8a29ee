/**
 * Validates DATABASE_URL for the shell scripts. `--shell` prints DB_USER=… lines to eval;
 * a bad URL prints one clear message and exits 1.
 */
import { parseDatabaseUrl } from '../../src/lib/config/database-url.ts';

const parsed = parseDatabaseUrl(process.env.DATABASE_URL);
if (!parsed.ok) {
  console.error(`kerfline: ${parsed.message}`);
  process.exit(1);
}
if (process.argv.includes('--shell')) {
  const { user, password, database, port, host } = parsed.value;
  console.log(`DB_USER=${user}\nDB_PASSWORD=${password}\nDB_NAME=${database}\nDB_URL_PORT=${port}\nDB_HOST=${host}`);
}
