/**
 * Migrates the database and, with --seed, seeds the demo shop. Used by `npm start` and the tests.
 * Exits 1 with one clear line when the database cannot be reached or a step fails.
 */
import { closeDb, db } from '../../src/lib/db/client.server.ts';
import { applyMigrations } from '../../src/lib/db/migrate.server.ts';
import { seedDemoShop } from '../../src/lib/db/seed/demo-shop.server.ts';
import { DEMO_SEED_STEPS } from '../../src/lib/db/seed/steps.server.ts';

async function main(): Promise<void> {
  await applyMigrations(db());
  if (process.argv.includes('--seed')) {
    const result = await seedDemoShop(db(), DEMO_SEED_STEPS);
    console.log(
      result.createdShop || result.createdUsers > 0
        ? `kerfline: seeded the demo shop (${result.createdUsers} people)`
        : 'kerfline: demo shop already seeded',
    );
  }
}

main()
  .then(() => closeDb())
  .catch(async (error: unknown) => {
    const cause = error instanceof Error && error.cause instanceof Error ? ` (${error.cause.message})` : '';
    const message = error instanceof Error ? error.message.split('\n')[0] : String(error);
    console.error(`kerfline: database setup failed: ${message}${cause}`);
    await closeDb().catch(() => undefined);
    process.exit(1);
  });
