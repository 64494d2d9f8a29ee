/**
 * Signed-in sessions for tests, made the way the app makes them (random token in the cookie,
 * its SHA-256 as the session id) without going through the sign-in page.
 */
import { eq } from 'drizzle-orm';
import { hashPassword, newToken, sha256Hex, SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { newUserId } from '~/lib/db/ids.server.ts';
import { sessions, shops, users, type Role } from '~/lib/db/schema.ts';
import { db } from '~/lib/db/client.server.ts';

export interface TestUser {
  id: string;
  shopId: number;
  email: string;
  role: Role;
  /** `kerfline_session=<token>` for a Cookie header. */
  cookie: string;
  token: string;
}

async function sessionFor(userId: string): Promise<string> {
  const token = newToken();
  await db().insert(sessions).values({ id: sha256Hex(token), userId, expiresAt: new Date(Date.now() + 86_400_000) });
  return token;
}

/** A session for an existing user (e.g. the demo builder@wrenfield.example). */
export async function signInAs(email: string): Promise<TestUser> {
  const [user] = await db().select().from(users).where(eq(users.email, email));
  if (!user) throw new Error(`no user ${email}`);
  const token = await sessionFor(user.id);
  return { id: user.id, shopId: user.shopId, email, role: user.role, token, cookie: `${SESSION_COOKIE}=${token}` };
}

/** A fresh shop with one user of `role` (unique e-mail), signed in. */
export async function newShopUser(role: Role, shopName = `Test shop ${newToken()}`): Promise<TestUser> {
  const [shop] = await db().insert(shops).values({ name: shopName }).$returningId();
  return addShopUser(shop!.id, role);
}

/** Another user in an existing shop, signed in. */
export async function addShopUser(shopId: number, role: Role): Promise<TestUser> {
  const id = newUserId();
  const email = `${role}-${id.slice(0, 10)}@test.example`;
  await db().insert(users).values({ id, shopId, email, displayName: `Test ${role}`, role, passwordHash: await hashPassword('test-password-1') });
  const token = await sessionFor(id);
  return { id, shopId, email, role, token, cookie: `${SESSION_COOKIE}=${token}` };
}
