import { count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '~/lib/auth/index.server.ts';
import { requestNewShop } from '~/lib/accounts/create-shop.server.ts';
import { acceptInvitation, describeInvitation } from '~/lib/accounts/invitations.server.ts';
import { oneTimeTokens, shops, users } from '~/lib/db/schema.ts';
import { closeDb, db } from '../../support/test-db.ts';
import { linkIn, mailsTo, uniqueEmail, waitForMail } from '../../support/outbox.ts';

afterAll(() => closeDb());

const shopCount = async () => (await db().select({ n: count() }).from(shops))[0]!.n;

describe('creating a shop', () => {
  it('mails a new address a 7-day link; accepting it makes the first user the Owner', async () => {
    const email = uniqueEmail('founder');
    await requestNewShop({ shopName: 'Hollin Bench Works', email });
    const mail = await waitForMail(email, /^Finish setting up your Kerfline shop$/);
    expect(mail.text).toContain('"Hollin Bench Works"');
    const { token } = linkIn(mail, '/invitations/');

    const [row] = await db().select().from(oneTimeTokens).where(eq(oneTimeTokens.email, email));
    expect(row?.tokenHash).toBe(sha256Hex(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const days = (row!.expiresAt.getTime() - Date.now()) / 86_400_000;
    expect(Math.abs(days - 7)).toBeLessThan(0.01);

    expect(await describeInvitation(token)).toEqual({ shopName: 'Hollin Bench Works', email, role: 'owner' });
    const accepted = await acceptInvitation(token, { displayName: 'Ada Hollin', password: 'a-long-password', confirmPassword: 'a-long-password' });
    expect(accepted.ok).toBe(true);
    const [user] = await db().select().from(users).where(eq(users.email, email));
    expect(user?.role).toBe('owner');
    expect(user?.shopId).toBe(row!.shopId);
    expect(user?.passwordHash.startsWith('$argon2id$')).toBe(true);
  });

  it('creates nothing for an address that already has an account and mails its owner instead', async () => {
    const before = await shopCount();
    const earlier = (await mailsTo('builder@wrenfield.example')).length;
    await requestNewShop({ shopName: 'Copycat Shop', email: 'builder@wrenfield.example' });
    const mail = await waitForMail('builder@wrenfield.example', /already have a Kerfline account/);
    expect(mail.text).toContain('/forgot-password');
    expect((await mailsTo('builder@wrenfield.example')).length).toBe(earlier + 1);
    expect(await shopCount()).toBe(before);
    const [copy] = await db().select().from(shops).where(eq(shops.name, 'Copycat Shop'));
    expect(copy).toBeUndefined();
  });
});
