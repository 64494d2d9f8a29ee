/** The signed-in person's own settings: password and preferred units. */
import { eq } from 'drizzle-orm';
import { endOtherSessions, hashPassword, verifyPassword } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { users } from '~/lib/db/schema.ts';
import { done, refused, type Outcome } from './outcome.ts';

/** Changes the password after checking the current one; every other session of the account ends. */
export async function changePassword(userId: string, keepSessionId: string | null, currentPassword: string, newPassword: string): Promise<Outcome> {
  const [user] = await db().select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, userId));
  if (!(await verifyPassword(user?.passwordHash, currentPassword))) {
    return refused(400, { currentPassword: 'This is not your current password.' });
  }
  await db().update(users).set({ passwordHash: await hashPassword(newPassword) }).where(eq(users.id, userId));
  await endOtherSessions(userId, keepSessionId ?? undefined);
  return done(undefined);
}

export async function setPreferredUnits(userId: string, preferredUnits: 'mm' | 'in'): Promise<void> {
  await db().update(users).set({ preferredUnits }).where(eq(users.id, userId));
}
