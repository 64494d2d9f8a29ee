import { migrate } from 'drizzle-orm/mysql2/migrator';
import { backfillFingerprints } from './backfill-fingerprints.server.ts';
import type { Db } from './client.server.ts';

/**
 * Applies the committed SQL migrations in ./drizzle (relative to the working directory), then
 * fills in what SQL cannot compute (fingerprints of rows older than them).
 */
export async function applyMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: './drizzle' });
  await backfillFingerprints(db);
}
