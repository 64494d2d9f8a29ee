/** Forgotten passwords: a single-use link valid for 1 hour, then a new password ends every session. */
import { eq } from 'drizzle-orm';
import { endOtherSessions, hashPassword } from '~/lib/auth/index.server.ts';
import { config } from '~/lib/config/env.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { users } from '~/lib/db/schema.ts';
import { limitMail } from '~/lib/mail/mail-budgets.server.ts';
import { resetMail } from './account-mail.ts';
import { RESET_TTL_MS } from './links.ts';
import { sendMail } from '~/lib/mail/send.server.ts';
import { findUsableToken, issueToken, markTokenUsed, revokePendingTokens } from './one-time-tokens.server.ts';
import { done, refused, type Outcome } from './outcome.ts';
import { findUserByEmail } from './users.server.ts';

/**
 * Mails a reset link when `email` has an account; does nothing otherwise, nor once the account's
 * or its shop's hourly reset-mail budget is used. Pages run this without waiting for it, so the
 * answer (and its timing) is the same in every case.
 */
export async function startPasswordReset(email: string, now = new Date()): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user) return;
  if (!(await limitMail('password-reset', { userId: user.id, shopId: user.shopId }, now)).ok) return;
  // Only the newest link works: asking again revokes the earlier ones.
  const token = await db().transaction(async (tx) => {
    await revokePendingTokens(tx, 'reset', user.shopId, user.email);
    return issueToken(tx, { kind: 'reset', shopId: user.shopId, userId: user.id, email: user.email, ttlMs: RESET_TTL_MS });
  });
  await sendMail({ to: user.email, ...resetMail(config().appOrigin, token) });
}

/** True while the reset link can still be used (the page shows the form, or "no longer valid"). */
export async function isResetLinkUsable(token: string): Promise<boolean> {
  return (await findUsableToken(db(), 'reset', token)) !== null;
}

/** Sets the new password and ends every session of the account. 410 when the link is not usable. */
export async function resetPassword(token: string, password: string): Promise<Outcome<{ userId: string }>> {
  const passwordHash = await hashPassword(password);
  const userId = await db().transaction(async (tx) => {
    const row = await findUsableToken(tx, 'reset', token, true);
    if (!row?.userId) return null;
    const [result] = await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
    if (result.affectedRows !== 1) return null;
    await markTokenUsed(tx, row.id);
    return row.userId;
  });
  if (!userId) return refused(410, {}, 'This link is no longer valid.');
  await endOtherSessions(userId);
  return done({ userId });
}
