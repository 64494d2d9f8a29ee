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
    const before = await shopCount();
    const accepted = await acceptInvitation(token, { displayName: 'Ada Hollin', password: 'a-long-password', confirmPassword: 'a-long-password' });
    expect(accepted.ok).toBe(true);
    expect(await shopCount()).toBe(before + 1);
    const [user] = await db().select().from(users).where(eq(users.email, email));
    expect(user?.role).toBe('owner');
    const [shop] = await db().select().from(shops).where(eq(shops.id, user!.shopId));
    expect(shop?.name).toBe('Hollin Bench Works');
    expect(user?.passwordHash.startsWith('$argon2id$')).toBe(true);
    // The link is single-use: a second try creates no second shop.
    const again = await acceptInvitation(token, { displayName: 'Ada Hollin', password: 'a-long-password', confirmPassword: 'a-long-password' });
    expect(again).toMatchObject({ ok: false, status: 410 });
    expect(await shopCount()).toBe(before + 1);
  });

  it('writes no shop row until the e-mailed link is used: 5 unfinished requests leave the shop count unchanged', async () => {
    const before = await shopCount();
    const emails = Array.from({ length: 5 }, () => uniqueEmail('unfinished'));
    for (const email of emails) await requestNewShop({ shopName: 'Never Finished Guitars', email });
    for (const email of emails) await waitForMail(email, /^Finish setting up your Kerfline shop$/);
    expect(await shopCount()).toBe(before);
    const [unfinished] = await db().select().from(shops).where(eq(shops.name, 'Never Finished Guitars'));
    expect(unfinished).toBeUndefined();
    const links = await db().select().from(oneTimeTokens).where(eq(oneTimeTokens.shopName, 'Never Finished Guitars'));
    expect(links.map((l) => [l.kind, l.shopId])).toEqual(emails.map(() => ['new-shop', null]));
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
