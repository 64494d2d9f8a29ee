/**
 * The invented demo shop "Wrenfield Instrument Co." (PRODUCT.md). Every step is idempotent:
 * it looks for its rows first, so running the seed again creates no duplicates.
 * Names, e-mails and passwords here are demo data, not from any real person.
 */
import { eq } from 'drizzle-orm';
import { hashPassword } from '~/lib/auth/index.server.ts';
import type { Db } from '~/lib/db/client.server.ts';
import { shops, users, type Role } from '~/lib/db/schema.ts';
import { newUserId } from '~/lib/db/ids.server.ts';

export const DEMO_SHOP_NAME = 'Wrenfield Instrument Co.';
export const DEMO_PASSWORD = 'wrenfield-demo-2026';

export const DEMO_PEOPLE: readonly { email: string; displayName: string; role: Role }[] = [
  { email: 'owner@wrenfield.example', displayName: 'Mara Wrenfield', role: 'owner' },
  { email: 'builder@wrenfield.example', displayName: 'Tobin Ashcroft', role: 'builder' },
  { email: 'client@wrenfield.example', displayName: 'Ines Calloway', role: 'client' },
  { email: 'client2@wrenfield.example', displayName: 'Rafe Dunmore', role: 'client' },
];

export interface SeedContext {
  db: Db;
  shopId: number;
  /** User id by demo e-mail. */
  people: ReadonlyMap<string, string>;
}

export interface SeedResult {
  shopId: number;
  createdShop: boolean;
  createdUsers: number;
}

async function ensureShop(db: Db): Promise<{ id: number; created: boolean }> {
  const found = await db.select({ id: shops.id }).from(shops).where(eq(shops.name, DEMO_SHOP_NAME)).limit(1);
  if (found[0]) return { id: found[0].id, created: false };
  const [inserted] = await db.insert(shops).values({ name: DEMO_SHOP_NAME }).$returningId();
  return { id: inserted!.id, created: true };
}

async function ensurePeople(db: Db, shopId: number): Promise<{ people: Map<string, string>; created: number }> {
  const people = new Map<string, string>();
  let created = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const person of DEMO_PEOPLE) {
    const found = await db.select({ id: users.id }).from(users).where(eq(users.email, person.email)).limit(1);
    if (found[0]) {
      people.set(person.email, found[0].id);
      continue;
    }
    const id = newUserId();
    await db.insert(users).values({ id, shopId, passwordHash, ...person });
    people.set(person.email, id);
    created++;
  }
  return { people, created };
}

/** Further demo rows (designs, proofs, templates) register here, each idempotent. */
export type SeedStep = (context: SeedContext) => Promise<void>;

export async function seedDemoShop(db: Db, steps: readonly SeedStep[] = []): Promise<SeedResult> {
  const shop = await ensureShop(db);
  const { people, created } = await ensurePeople(db, shop.id);
  for (const step of steps) await step({ db, shopId: shop.id, people });
  return { shopId: shop.id, createdShop: shop.created, createdUsers: created };
}
