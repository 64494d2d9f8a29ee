import { and, count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { acceptInvitation, describeInvitation, inviteMember, listPendingInvitations, resendInvitation, revokeInvitation } from '~/lib/accounts/invitations.server.ts';
import { checkCredentials } from '~/lib/accounts/sign-in.server.ts';
import { oneTimeTokens, users } from '~/lib/db/schema.ts';
import { linkIn, uniqueEmail, waitForMail, waitForMailCount } from '../../support/outbox.ts';
import { addShopUser, newShopUser } from '../../support/sessions.ts';
import { closeDb, db } from '../../support/test-db.ts';

afterAll(() => closeDb());

const SUBJECT = /^You are invited to a shop on Kerfline$/;
const form = (displayName: string) => ({ displayName, password: 'invited-password', confirmPassword: 'invited-password' });
const inviterOf = (u: { id: string; shopId: number }) => ({ shopId: u.shopId, userId: u.id, displayName: 'Test owner' });

describe('invitations', () => {
  it('invites by e-mail with a role; accepting joins the shop with that role, once', async () => {
    const owner = await newShopUser('owner', 'Invite Test Shop');
    const email = uniqueEmail('builder');
    expect((await inviteMember(inviterOf(owner), email, 'builder')).ok).toBe(true);
    const mail = await waitForMail(email, SUBJECT);
    expect(mail.text).toContain('Builder');
    const { token } = linkIn(mail, '/invitations/');
    expect((await listPendingInvitations(owner.shopId)).map((i) => [i.email, i.role])).toEqual([[email, 'builder']]);
    expect(await describeInvitation(token)).toEqual({ shopName: 'Invite Test Shop', email, role: 'builder' });

    const accepted = await acceptInvitation(token, form('Ned Planer'));
    expect(accepted).toMatchObject({ ok: true, value: { email } });
    const [user] = await db().select().from(users).where(eq(users.email, email));
    expect(user).toMatchObject({ shopId: owner.shopId, role: 'builder', displayName: 'Ned Planer' });
    expect((await checkCredentials(email, 'invited-password')).ok).toBe(true);
    expect(await listPendingInvitations(owner.shopId)).toEqual([]);

    expect(await acceptInvitation(token, form('Someone Else'))).toMatchObject({ ok: false, status: 410 });
    expect(await describeInvitation(token)).toBeNull();
  });

  it('refuses to invite someone already in the shop, naming the e-mail field', async () => {
    const owner = await newShopUser('owner');
    const member = await addShopUser(owner.shopId, 'client');
    expect(await inviteMember(inviterOf(owner), member.email.toUpperCase().toLowerCase(), 'builder')).toMatchObject({ ok: false, status: 409, errors: { email: expect.any(String) } });
    const tokens = await db().select({ n: count() }).from(oneTimeTokens).where(eq(oneTimeTokens.shopId, owner.shopId));
    expect(tokens[0]!.n).toBe(0);
  });

  it('resend replaces the link; revoke kills it; both only within the owner\'s own shop', async () => {
    const owner = await newShopUser('owner');
    const stranger = await newShopUser('owner');
    const email = uniqueEmail('client');
    await inviteMember(inviterOf(owner), email, 'client');
    const first = linkIn(await waitForMail(email, SUBJECT), '/invitations/').token;
    const [pending] = await listPendingInvitations(owner.shopId);

    expect(await resendInvitation(inviterOf(stranger), pending!.id)).toMatchObject({ ok: false, status: 404 });
    expect(await revokeInvitation(stranger.shopId, pending!.id)).toMatchObject({ ok: false, status: 404 });
    expect(await describeInvitation(first)).not.toBeNull();

    expect((await resendInvitation(inviterOf(owner), pending!.id)).ok).toBe(true);
    const second = linkIn((await waitForMailCount(email, SUBJECT, 2))[0]!, '/invitations/').token;
    expect(await describeInvitation(first)).toBeNull();
    expect(await describeInvitation(second)).not.toBeNull();

    const [replacement] = await listPendingInvitations(owner.shopId);
    expect((await revokeInvitation(owner.shopId, replacement!.id)).ok).toBe(true);
    expect(await describeInvitation(second)).toBeNull();
    expect(await acceptInvitation(second, form('Late Comer'))).toMatchObject({ ok: false, status: 410 });
    expect(await db().select().from(users).where(eq(users.email, email))).toEqual([]);
  });

  it('accepting for an address that got an account meanwhile creates nothing and leaves the link unused', async () => {
    const owner = await newShopUser('owner');
    const elsewhere = await newShopUser('builder');
    await inviteMember(inviterOf(owner), elsewhere.email, 'client');
    const { token } = linkIn(await waitForMail(elsewhere.email, SUBJECT), '/invitations/');
    expect(await acceptInvitation(token, form('Double Agent'))).toMatchObject({ ok: false, status: 409 });
    const rows = await db().select().from(users).where(eq(users.email, elsewhere.email));
    expect(rows.map((r) => r.shopId)).toEqual([elsewhere.shopId]);
    const open = await db().select().from(oneTimeTokens).where(and(eq(oneTimeTokens.shopId, owner.shopId), eq(oneTimeTokens.email, elsewhere.email)));
    expect(open[0]?.usedAt).toBeNull();
  });

  it('treats forged, malformed and expired links alike', async () => {
    const owner = await newShopUser('owner');
    const email = uniqueEmail('late');
    await inviteMember(inviterOf(owner), email, 'builder');
    const { token } = linkIn(await waitForMail(email, SUBJECT), '/invitations/');
    await db().update(oneTimeTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(oneTimeTokens.email, email));
    for (const t of [token, 'AAAAAAAAAAAAAAAAAAAAAA', '../../etc/passwd', '']) {
      expect(await describeInvitation(t)).toBeNull();
      expect(await acceptInvitation(t, form('Nobody'))).toMatchObject({ ok: false, status: 410 });
    }
  });
});
