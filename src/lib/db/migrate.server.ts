import { migrate } from 'drizzle-orm/mysql2/migrator';
import type { Db } from './client.server.ts';

/** Applies the committed SQL migrations in ./drizzle (relative to the working directory). */
export async function applyMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: './drizzle' });
}
