/** Looking people up by e-mail (stored lower-cased, so the lookup is case-insensitive). */
import { eq } from 'drizzle-orm';
import { db } from '~/lib/db/client.server.ts';
import { shops, users } from '~/lib/db/schema.ts';

export async function findUserByEmail(email: string) {
  const [row] = await db().select().from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row ?? null;
}

/** When the shop was created (null for no such shop). */
export async function shopCreatedAt(shopId: number): Promise<Date | null> {
  const [row] = await db().select({ createdAt: shops.createdAt }).from(shops).where(eq(shops.id, shopId)).limit(1);
  return row?.createdAt ?? null;
}

export async function shopName(shopId: number): Promise<string> {
  const [row] = await db().select({ name: shops.name }).from(shops).where(eq(shops.id, shopId)).limit(1);
  return row?.name ?? 'your shop';
}

/** The IANA time zone the shop writes dates in (UTC until the Owner chooses one). */
export async function shopTimeZone(shopId: number): Promise<string> {
  const [row] = await db().select({ timeZone: shops.timeZone }).from(shops).where(eq(shops.id, shopId)).limit(1);
  return row?.timeZone ?? 'UTC';
}

/** Sets the shop's default deposit currency (an ISO 4217 code, validated by shopSettingsSchema). */
export async function setShopCurrency(shopId: number, currency: string): Promise<void> {
  await db().update(shops).set({ currency }).where(eq(shops.id, shopId));
}

/** Sets the shop's time zone (validated by shopSettingsSchema). */
export async function setShopTimeZone(shopId: number, timeZone: string): Promise<void> {
  await db().update(shops).set({ timeZone }).where(eq(shops.id, shopId));
}
