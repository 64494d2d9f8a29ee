import { count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '~/lib/auth/index.server.ts';
import { isResetLinkUsable, resetPassword, startPasswordReset } from '~/lib/accounts/password-reset.server.ts';
import { checkCredentials } from '~/lib/accounts/sign-in.server.ts';
import { oneTimeTokens, sessions } from '~/lib/db/schema.ts';
import { linkIn, mailsTo, waitForMail, waitForMailCount } from '../../support/outbox.ts';
import { newShopUser } from '../../support/sessions.ts';
import { closeDb, db } from '../../support/test-db.ts';

afterAll(() => closeDb());

const SUBJECT = /Reset your Kerfline password/;

describe('password reset', () => {
  it('mails a single-use link valid 1 hour; the new password works and every session ends', async () => {
    const user = await newShopUser('builder');
    await startPasswordReset(user.email.toUpperCase());
    const { token } = linkIn(await waitForMail(user.email, SUBJECT), '/reset-password/');
    const [row] = await db().select().from(oneTimeTokens).where(eq(oneTimeTokens.tokenHash, sha256Hex(token)));
    const minutes = (row!.expiresAt.getTime() - Date.now()) / 60_000;
    expect(Math.abs(minutes - 60)).toBeLessThan(1);
    expect(await isResetLinkUsable(token)).toBe(true);

    expect(await resetPassword(token, 'fresh-password-42')).toMatchObject({ ok: true });
    expect((await checkCredentials(user.email, 'fresh-password-42')).ok).toBe(true);
    const left = await db().select({ n: count() }).from(sessions).where(eq(sessions.userId, user.id));
    expect(left[0]!.n).toBe(0);

    // Used once: the same link now answers "no longer valid" and changes nothing.
    expect(await isResetLinkUsable(token)).toBe(false);
    expect(await resetPassword(token, 'another-password-9')).toMatchObject({ ok: false, status: 410 });
    expect((await checkCredentials(user.email, 'fresh-password-42')).ok).toBe(true);
  });

  it('sends nothing and stores nothing for an unknown address', async () => {
    // A reset resolves only after the fake SMTP server has filed its mail (it answers the SMTP
    // DATA command after saving), so right after it the outbox shows whatever it sent. The known
    // address shows that this holds; the unknown one then has nothing.
    const known = await newShopUser('builder');
    await startPasswordReset(known.email);
    expect((await mailsTo(known.email)).filter((m) => SUBJECT.test(m.subject))).toHaveLength(1);

    const email = `no-account-${Date.now()}@test.example`;
    await startPasswordReset(email);
    expect(await mailsTo(email)).toEqual([]);
    expect(await db().select().from(oneTimeTokens).where(eq(oneTimeTokens.email, email))).toEqual([]);
  });

  it('an expired link, a replaced link, and a forged link are all refused the same way', async () => {
    const user = await newShopUser('client');
    await startPasswordReset(user.email);
    const first = linkIn((await waitForMailCount(user.email, SUBJECT, 1))[0]!, '/reset-password/').token;
    await startPasswordReset(user.email);
    const mails = await waitForMailCount(user.email, SUBJECT, 2);
    const second = linkIn(mails[0]!, '/reset-password/').token; // newest first
    expect(second).not.toBe(first);
    expect(await isResetLinkUsable(first)).toBe(false);
    expect(await isResetLinkUsable(second)).toBe(true);

    await db().update(oneTimeTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(oneTimeTokens.tokenHash, sha256Hex(second)));
    for (const token of [first, second, 'AAAAAAAAAAAAAAAAAAAAAA', 'not a token', '']) {
      expect(await isResetLinkUsable(token)).toBe(false);
      expect(await resetPassword(token, 'whatever-password')).toEqual({ ok: false, status: 410, errors: {}, message: 'This link is no longer valid.' });
    }
  });
});
