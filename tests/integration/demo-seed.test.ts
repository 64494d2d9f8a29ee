import { count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { verifyPassword } from '~/lib/auth/index.server.ts';
import { shops, users } from '~/lib/db/schema.ts';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SHOP_NAME, seedDemoShop } from '~/lib/db/seed/demo-shop.server.ts';
import { DEMO_SEED_STEPS } from '~/lib/db/seed/steps.server.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

describe('demo seed (the start script runs it on every start)', () => {
  it('is idempotent: a second run reports "already seeded" and adds no rows', async () => {
    await seedDemoShop(db(), DEMO_SEED_STEPS);
    const before = await db().select({ n: count() }).from(users);
    const again = await seedDemoShop(db(), DEMO_SEED_STEPS);
    const after = await db().select({ n: count() }).from(users);
    expect(again.createdShop).toBe(false);
    expect(again.createdUsers).toBe(0);
    expect(after[0]!.n).toBe(before[0]!.n);
    const demoShops = await db().select({ n: count() }).from(shops).where(eq(shops.name, DEMO_SHOP_NAME));
    expect(demoShops[0]!.n).toBe(1);
  });

  it('creates every demo person in the demo shop with the printed password', async () => {
    const { shopId } = await seedDemoShop(db(), DEMO_SEED_STEPS);
    for (const person of DEMO_PEOPLE) {
      const [row] = await db().select().from(users).where(eq(users.email, person.email));
      expect(row?.shopId).toBe(shopId);
      expect(row?.role).toBe(person.role);
      expect(await verifyPassword(row?.passwordHash, DEMO_PASSWORD)).toBe(true);
    }
  });
});
